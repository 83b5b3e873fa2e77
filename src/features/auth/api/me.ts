import { queryOptions, useQuery } from "@tanstack/react-query";
import { ApiError, get } from "@/lib/api-client";
import type { MeResponse } from "@/contracts/auth";

/** GET /api/me — null when nobody is signed in. */
export async function fetchMe(): Promise<MeResponse | null> {
  try {
    return await get<MeResponse>("/api/me");
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export const meQueryOptions = queryOptions({
  queryKey: ["me"],
  queryFn: fetchMe,
  staleTime: 60_000,
});

export function useMe() {
  return useQuery(meQueryOptions);
}

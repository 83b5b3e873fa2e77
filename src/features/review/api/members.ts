import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { MemberSummary } from "@/contracts/team";

/** GET /api/team/members — colleagues' names for @mentions (same key as the Team page). */
export const mentionMembersQueryOptions = queryOptions({
  queryKey: ["team", "members"],
  queryFn: () => get<MemberSummary[]>("/api/team/members"),
  staleTime: 5 * 60_000,
});

export function useMentionMembers(enabled = true) {
  return useQuery({ ...mentionMembersQueryOptions, enabled });
}

import { queryOptions, useQuery } from "@tanstack/react-query";
import type { PickSetView } from "@/contracts/field";
import { get } from "@/lib/api-client";
import { fieldKeys } from "./field-keys";

/** GET /api/plans/:id/picks — the plan's saved first-break picks (empty when none). */
export const fetchPicks = (planId: string) =>
  get<PickSetView>(`/api/plans/${encodeURIComponent(planId)}/picks`);

export const picksQueryOptions = (planId: string) =>
  queryOptions({ queryKey: fieldKeys.picks(planId), queryFn: () => fetchPicks(planId) });

export function usePicks(planId: string) {
  return useQuery(picksQueryOptions(planId));
}

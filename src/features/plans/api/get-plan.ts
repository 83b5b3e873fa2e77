import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { PlanDetail } from "@/contracts/plans";
import { plansKeys } from "./plans-keys";

/** GET /api/plans/:id — the plan with its latest document and what the user may do with it. */
export const fetchPlan = (planId: string) =>
  get<PlanDetail>(`/api/plans/${encodeURIComponent(planId)}`);

export const planQueryOptions = (planId: string) =>
  queryOptions({
    queryKey: plansKeys.one(planId),
    queryFn: () => fetchPlan(planId),
    // The designer holds unsaved edits: never refetch underneath them while it is open, but
    // fetch afresh each time it opens (nothing kept once no one shows the plan).
    staleTime: Number.POSITIVE_INFINITY,
    gcTime: 0,
  });

export function usePlan(planId: string) {
  return useQuery(planQueryOptions(planId));
}

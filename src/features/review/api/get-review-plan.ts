import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { PlanDetail } from "@/contracts/plans";
import { planUrl, reviewKeys } from "./review-keys";

/** GET /api/plans/:id — the plan, its latest document and what the user may do now. */
export const fetchReviewPlan = (planId: string) => get<PlanDetail>(planUrl(planId));

export const reviewPlanQueryOptions = (planId: string) =>
  queryOptions({
    queryKey: reviewKeys.detail(planId),
    queryFn: () => fetchReviewPlan(planId),
    // Status and permissions change through other people's actions: always refetch on open.
    staleTime: 0,
  });

export function useReviewPlan(planId: string) {
  return useQuery(reviewPlanQueryOptions(planId));
}

import { queryOptions, useQuery } from "@tanstack/react-query";
import type { PlanDetail } from "@/contracts/plans";
import { get } from "@/lib/api-client";
import { fieldKeys } from "./field-keys";

/** GET /api/plans/:id — the plan's latest document and what the user may do with it. */
export const fetchFieldPlan = (planId: string) =>
  get<PlanDetail>(`/api/plans/${encodeURIComponent(planId)}`);

export const fieldPlanQueryOptions = (planId: string) =>
  queryOptions({ queryKey: fieldKeys.plan(planId), queryFn: () => fetchFieldPlan(planId) });

export function useFieldPlan(planId: string) {
  return useQuery(fieldPlanQueryOptions(planId));
}

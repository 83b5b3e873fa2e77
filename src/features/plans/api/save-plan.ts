import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ApiError, put } from "@/lib/api-client";
import { PLAN_ERROR_CODES, type PlanDetail, type PlanSaveInput } from "@/contracts/plans";
import { plansKeys } from "./plans-keys";

/** PUT /api/plans/:id — a new revision; 409 `revision_conflict` when someone saved meanwhile. */
export const savePlan = (planId: string, input: PlanSaveInput) =>
  put<PlanDetail>(`/api/plans/${encodeURIComponent(planId)}`, input);

/** True for the server's answer that the plan changed since `baseRevision`. */
export const isRevisionConflict = (error: unknown) =>
  error instanceof ApiError && error.code === PLAN_ERROR_CODES.revisionConflict;

export function useSavePlan(planId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PlanSaveInput) => savePlan(planId, input),
    onSuccess: (plan) => {
      queryClient.setQueryData(plansKeys.one(plan.id), plan);
      return queryClient.invalidateQueries({ queryKey: plansKeys.site(plan.siteId) });
    },
  });
}

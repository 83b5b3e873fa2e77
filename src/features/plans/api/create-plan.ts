import { useMutation, useQueryClient } from "@tanstack/react-query";
import { post } from "@/lib/api-client";
import type { PlanCreateInput, PlanDetail } from "@/contracts/plans";
import { plansKeys } from "./plans-keys";

/** POST /api/sites/:siteId/plans — 201 with the new plan (a trainee's lands in their sandbox). */
export const createPlan = (siteId: string, input: PlanCreateInput) =>
  post<PlanDetail>(`/api/sites/${encodeURIComponent(siteId)}/plans`, input);

export function useCreatePlan(siteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PlanCreateInput) => createPlan(siteId, input),
    onSuccess: (plan) => {
      queryClient.setQueryData(plansKeys.one(plan.id), plan);
      return queryClient.invalidateQueries({ queryKey: plansKeys.site(siteId) });
    },
  });
}

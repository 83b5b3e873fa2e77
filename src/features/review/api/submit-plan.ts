import { useMutation, useQueryClient } from "@tanstack/react-query";
import { post } from "@/lib/api-client";
import type { PlanDetail } from "@/contracts/plans";
import { afterPlanChange } from "./invalidate";
import { planUrl } from "./review-keys";

/** POST /api/plans/:id/submit — a lead sends the plan to the reviewers (optional note). */
export const submitPlan = (planId: string, note?: string) =>
  post<PlanDetail>(planUrl(planId, "/submit"), note ? { note } : {});

export function useSubmitPlan(planId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (note?: string) => submitPlan(planId, note),
    onSuccess: (plan) => afterPlanChange(queryClient, planId, plan),
  });
}

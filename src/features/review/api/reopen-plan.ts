import { useMutation, useQueryClient } from "@tanstack/react-query";
import { post } from "@/lib/api-client";
import type { PlanDetail } from "@/contracts/plans";
import { afterPlanChange } from "./invalidate";
import { planUrl } from "./review-keys";

/** POST /api/plans/:id/reopen — a lead starts a new revision of an approved plan (back to draft). */
export const reopenPlan = (planId: string) => post<PlanDetail>(planUrl(planId, "/reopen"), {});

export function useReopenPlan(planId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => reopenPlan(planId),
    onSuccess: (plan) => afterPlanChange(queryClient, planId, plan),
  });
}

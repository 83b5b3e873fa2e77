import { useMutation, useQueryClient } from "@tanstack/react-query";
import { post } from "@/lib/api-client";
import type { PlanDetail } from "@/contracts/plans";
import { afterPlanChange } from "./invalidate";
import { planUrl } from "./review-keys";

/** POST /api/plans/:id/approve — a reviewer signs the plan off (optional note). */
export const approvePlan = (planId: string, note?: string) =>
  post<PlanDetail>(planUrl(planId, "/approve"), note ? { note } : {});

export function useApprovePlan(planId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (note?: string) => approvePlan(planId, note),
    onSuccess: (plan) => afterPlanChange(queryClient, planId, plan),
  });
}

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { post } from "@/lib/api-client";
import type { PlanDetail } from "@/contracts/plans";
import { afterPlanChange } from "./invalidate";
import { planUrl } from "./review-keys";

/** POST /api/plans/:id/request-changes — a reviewer sends the plan back; the note is required. */
export const requestChanges = (planId: string, note: string) =>
  post<PlanDetail>(planUrl(planId, "/request-changes"), { note });

export function useRequestChanges(planId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (note: string) => requestChanges(planId, note),
    onSuccess: (plan) => afterPlanChange(queryClient, planId, plan),
  });
}

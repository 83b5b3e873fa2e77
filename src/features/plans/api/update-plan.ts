import { useMutation, useQueryClient } from "@tanstack/react-query";
import { patch } from "@/lib/api-client";
import type { PlanDetail } from "@/contracts/plans";
import { plansKeys } from "./plans-keys";

export interface PlanUpdate {
  name?: string;
  archived?: boolean;
}

/** PATCH /api/plans/:id — rename, archive or restore (no new revision). */
export const updatePlan = (planId: string, input: PlanUpdate) =>
  patch<PlanDetail>(`/api/plans/${encodeURIComponent(planId)}`, input);

export function useUpdatePlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: PlanUpdate & { id: string }) => updatePlan(id, input),
    onSuccess: (plan) => {
      queryClient.setQueryData(plansKeys.one(plan.id), plan);
      return queryClient.invalidateQueries({ queryKey: plansKeys.site(plan.siteId) });
    },
  });
}

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { post } from "@/lib/api-client";
import type { PlanDetail } from "@/contracts/plans";
import { plansKeys } from "./plans-keys";

/** POST /api/plans/:id/duplicate — a copy of the latest revision, owned by the caller. */
export const duplicatePlan = (planId: string, name?: string) =>
  post<PlanDetail>(`/api/plans/${encodeURIComponent(planId)}/duplicate`, name ? { name } : {});

export function useDuplicatePlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, name }: { id: string; name?: string }) => duplicatePlan(id, name),
    onSuccess: (plan) => {
      queryClient.setQueryData(plansKeys.one(plan.id), plan);
      return queryClient.invalidateQueries({ queryKey: plansKeys.site(plan.siteId) });
    },
  });
}

import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { PlanDetail } from "@/contracts/plans";
import { post } from "@/lib/api-client";

/** POST /api/sites/:siteId/plans/import — body is a plan document (docs/plan-format.md). */
export const importPlan = (siteId: string, document: unknown) =>
  post<PlanDetail>(`/api/sites/${encodeURIComponent(siteId)}/plans/import`, document);

export function useImportPlan(siteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (document: unknown) => importPlan(siteId, document),
    // The plans feature's lists live under ["plans", …]; the site's plan count under ["sites"].
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: ["plans"] }),
        queryClient.invalidateQueries({ queryKey: ["sites"] }),
      ]),
  });
}

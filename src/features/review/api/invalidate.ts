import type { QueryClient } from "@tanstack/react-query";
import type { PlanDetail } from "@/contracts/plans";
import { foreignKeys, reviewKeys } from "./review-keys";

/**
 * After a workflow step: keep the returned plan (when the server sends one) and mark every view
 * of this plan stale — the Review screen, the designer, the plans list and the inbox.
 */
export async function afterPlanChange(
  queryClient: QueryClient,
  planId: string,
  returned: unknown,
): Promise<void> {
  if (isPlanDetail(returned) && returned.id === planId) {
    queryClient.setQueryData(reviewKeys.detail(planId), returned);
  }
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: reviewKeys.plan(planId) }),
    queryClient.invalidateQueries({ queryKey: foreignKeys.plans }),
    queryClient.invalidateQueries({ queryKey: foreignKeys.notifications }),
    queryClient.invalidateQueries({ queryKey: foreignKeys.teamAudit }),
  ]);
}

function isPlanDetail(value: unknown): value is PlanDetail {
  return (
    typeof value === "object" &&
    value !== null &&
    "id" in value &&
    "status" in value &&
    "permissions" in value
  );
}

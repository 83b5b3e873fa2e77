import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { PlanDiff } from "@/contracts/plans";
import { planUrl, reviewKeys } from "./review-keys";

/** GET /api/plans/:id/diff?from=a&to=b — what changed between two revisions. */
export const diffQueryOptions = (planId: string, from: number, to: number) =>
  queryOptions({
    queryKey: reviewKeys.diff(planId, from, to),
    queryFn: () => get<PlanDiff>(planUrl(planId, `/diff?from=${from}&to=${to}`)),
    // Revisions are immutable, so their difference is too.
    staleTime: Number.POSITIVE_INFINITY,
  });

export function useDiff(planId: string, from: number | null, to: number | null) {
  return useQuery({
    ...diffQueryOptions(planId, from ?? 0, to ?? 0),
    enabled: from !== null && to !== null && from >= 1 && to >= 1 && from !== to,
  });
}

import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { RevisionSummary } from "@/contracts/plans";
import { planUrl, reviewKeys } from "./review-keys";

/** GET /api/plans/:id/revisions — every saved revision of the plan. */
export const revisionsQueryOptions = (planId: string) =>
  queryOptions({
    queryKey: reviewKeys.revisions(planId),
    queryFn: () => get<RevisionSummary[]>(planUrl(planId, "/revisions")),
    // Newest first, whatever order the server sends.
    select: (list) => [...list].sort((a, b) => b.number - a.number),
  });

export function useRevisions(planId: string) {
  return useQuery(revisionsQueryOptions(planId));
}

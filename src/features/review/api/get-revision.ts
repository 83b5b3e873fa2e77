import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { RevisionDetail } from "@/contracts/plans";
import { planUrl, reviewKeys } from "./review-keys";

/** GET /api/plans/:id/revisions/:n — one immutable revision with its document and summary. */
export const revisionQueryOptions = (planId: string, number: number) =>
  queryOptions({
    queryKey: reviewKeys.revision(planId, number),
    queryFn: () => get<RevisionDetail>(planUrl(planId, `/revisions/${number}`)),
    // A revision never changes once saved.
    staleTime: Number.POSITIVE_INFINITY,
  });

export function useRevision(planId: string, number: number | null) {
  return useQuery({
    ...revisionQueryOptions(planId, number ?? 0),
    enabled: number !== null && number >= 1,
  });
}

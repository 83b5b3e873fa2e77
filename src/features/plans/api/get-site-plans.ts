import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { PlanSummary } from "@/contracts/plans";
import { plansKeys } from "./plans-keys";

/**
 * GET /api/sites/:siteId/plans?archived=all — every plan of the site the user may see (sandbox
 * plans included, archived ones too: the list hides those until asked).
 */
export const fetchSitePlans = (siteId: string) =>
  get<PlanSummary[]>(`/api/sites/${encodeURIComponent(siteId)}/plans?archived=all`);

export const sitePlansQueryOptions = (siteId: string) =>
  queryOptions({ queryKey: plansKeys.site(siteId), queryFn: () => fetchSitePlans(siteId) });

export function useSitePlans(siteId: string) {
  return useQuery(sitePlansQueryOptions(siteId));
}

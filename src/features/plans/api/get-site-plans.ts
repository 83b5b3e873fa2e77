import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { PlanSummary } from "@/contracts/plans";
import { plansKeys } from "./plans-keys";

/** GET /api/sites/:siteId/plans — every plan of the site the user may see (sandbox plans included). */
export const fetchSitePlans = (siteId: string) =>
  get<PlanSummary[]>(`/api/sites/${encodeURIComponent(siteId)}/plans`);

export const sitePlansQueryOptions = (siteId: string) =>
  queryOptions({ queryKey: plansKeys.site(siteId), queryFn: () => fetchSitePlans(siteId) });

export function useSitePlans(siteId: string) {
  return useQuery(sitePlansQueryOptions(siteId));
}

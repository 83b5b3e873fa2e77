import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { ActivityView } from "@/contracts/plans";
import { planUrl, reviewKeys } from "./review-keys";

/** GET /api/plans/:id/activity — the plan's audit trail, newest first. */
export const activityQueryOptions = (planId: string) =>
  queryOptions({
    queryKey: reviewKeys.activity(planId),
    queryFn: () => get<ActivityView[]>(planUrl(planId, "/activity")),
  });

export function useActivity(planId: string) {
  return useQuery(activityQueryOptions(planId));
}

/** GET /api/plans/:id/activity.csv — the same trail as a CSV download (a plain link). */
export const activityCsvUrl = (planId: string) => planUrl(planId, "/activity.csv");

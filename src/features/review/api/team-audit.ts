import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { AuditEventSummary } from "@/contracts/audit";
import { foreignKeys } from "./review-keys";

/** GET /api/audit?limit= — the team's trail, newest first (admins, leads, reviewers). */
export const teamAuditQueryOptions = (limit = 200) =>
  queryOptions({
    queryKey: [...foreignKeys.teamAudit, { limit }],
    queryFn: () => get<AuditEventSummary[]>(`/api/audit?limit=${limit}`),
  });

export function useTeamAudit(limit = 200) {
  return useQuery(teamAuditQueryOptions(limit));
}

/** GET /api/audit.csv — the same trail as a CSV download (a plain link). */
export const teamAuditCsvUrl = "/api/audit.csv";

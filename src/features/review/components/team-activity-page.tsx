import { Link } from "react-router-dom";
import type { AuditEventSummary } from "@/contracts/audit";
import { Card, EmptyState, ErrorNotice, Loading, PageHeader } from "@/components/feedback";
import { paths } from "@/app/paths";
import { teamAuditCsvUrl, useTeamAudit } from "../api/team-audit";
import { describeAction, describeDetail } from "../lib/activity-words";

const timeFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

/** Where an event's target lives in the app, when it has a page. */
function targetLink(event: AuditEventSummary): string | null {
  if (!event.targetId) return null;
  if (event.targetType === "plan") return paths.planReview(event.targetId);
  if (event.targetType === "site") return paths.site(event.targetId);
  return null;
}

/** The team's audit trail: who did what, when, with a CSV export (admins, leads, reviewers). */
export function TeamActivityPage() {
  const audit = useTeamAudit(200);
  return (
    <div>
      <PageHeader
        title="Team activity"
        subtitle="Who did what, and when, across the team's sites and plans (the latest 200 events)."
        actions={
          <a
            href={teamAuditCsvUrl}
            download
            className="rounded-md border border-ink-soft bg-card px-3.5 py-1.5 text-sm font-medium text-ink hover:bg-paper-deep"
          >
            Download CSV
          </a>
        }
      />
      <Card>
        {audit.isPending ? <Loading label="Loading the activity…" /> : null}
        {audit.isError ? (
          <ErrorNotice
            error={audit.error}
            title="Cannot load the activity"
            onRetry={() => audit.refetch()}
          />
        ) : null}
        {audit.data && audit.data.length === 0 ? <EmptyState title="No activity yet" /> : null}
        {audit.data && audit.data.length > 0 ? (
          <table className="w-full text-left text-sm" aria-label="Team activity">
            <thead className="border-b border-rule text-xs tracking-wide text-ink-soft uppercase">
              <tr>
                <th className="py-2 pr-3 font-medium">When</th>
                <th className="py-2 pr-3 font-medium">Who</th>
                <th className="py-2 pr-3 font-medium">What</th>
                <th className="py-2 font-medium">Detail</th>
              </tr>
            </thead>
            <tbody>
              {audit.data.map((event) => {
                const to = targetLink(event);
                return (
                  <tr key={event.id} className="border-b border-rule/60 align-top">
                    <td className="py-2 pr-3 font-mono text-xs whitespace-nowrap text-ink-soft">
                      <time dateTime={event.createdAt}>
                        {timeFormat.format(new Date(event.createdAt))}
                      </time>
                    </td>
                    <td className="py-2 pr-3 font-medium whitespace-nowrap text-ink-deep">
                      {event.actor?.name ?? "—"}
                    </td>
                    <td className="py-2 pr-3">
                      {to ? (
                        <Link to={to} className="text-ink underline">
                          {describeAction(event.action)}
                        </Link>
                      ) : (
                        describeAction(event.action)
                      )}
                    </td>
                    <td className="py-2 text-xs text-ink-soft">{describeDetail(event.detail)}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        ) : null}
      </Card>
    </div>
  );
}

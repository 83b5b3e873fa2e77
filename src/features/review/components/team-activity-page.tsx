import { useMemo, useState } from "react";
import { Link } from "react-router-dom";
import type { AuditEventSummary } from "@/contracts/audit";
import { Card, EmptyState, ErrorNotice, Loading, PageHeader } from "@/components/feedback";
import { paths } from "@/app/paths";
import { teamAuditCsvUrl, useTeamAudit } from "../api/team-audit";
import {
  ACTIVITY_KINDS,
  describeAction,
  describeDetail,
  describeObject,
  filterTrail,
  foldSignIns,
  type ActivityKind,
} from "../lib/activity-words";

const timeFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

/** Where an event's target lives in the app, when it has a page. */
function targetLink(event: AuditEventSummary): string | null {
  if (!event.targetId) return null;
  if (event.targetType === "plan") return paths.planReview(event.targetId);
  if (event.targetType === "site") return paths.site(event.targetId);
  return null;
}

/** Detail keys the "What" cell already says in words. */
const NAMED = ["name", "fileName", "email"];

/**
 * The team's audit trail: who did what, when, in plain words with the plan, site or file named;
 * a person's repeated sign-ins fold into one row; filter by kind and person; CSV export
 * (admins, leads, reviewers).
 */
export function TeamActivityPage() {
  const audit = useTeamAudit(200);
  const [kind, setKind] = useState<ActivityKind | null>(null);
  const [person, setPerson] = useState<string | null>(null);
  const people = useMemo(() => {
    const byId = new Map<string, string>();
    for (const e of audit.data ?? []) if (e.actor) byId.set(e.actor.id, e.actor.name);
    return [...byId].sort((a, b) => a[1].localeCompare(b[1]));
  }, [audit.data]);
  const rows = useMemo(
    () => foldSignIns(filterTrail(audit.data ?? [], kind, person)),
    [audit.data, kind, person],
  );

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
        <div className="mb-4 flex flex-wrap items-end gap-3 text-sm" role="search">
          <label className="flex flex-col gap-1">
            <span className="text-xs font-medium text-ink-soft">Kind</span>
            <select
              className="field-input py-1"
              value={kind ?? ""}
              onChange={(e) => setKind((e.target.value || null) as ActivityKind | null)}
            >
              <option value="">All kinds</option>
              {ACTIVITY_KINDS.map((k) => (
                <option key={k.value} value={k.value}>
                  {k.label}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1">
            <span className="text-xs font-medium text-ink-soft">Person</span>
            <select
              className="field-input py-1"
              value={person ?? ""}
              onChange={(e) => setPerson(e.target.value || null)}
            >
              <option value="">Everyone</option>
              {people.map(([id, name]) => (
                <option key={id} value={id}>
                  {name}
                </option>
              ))}
            </select>
          </label>
        </div>
        {audit.isPending ? <Loading label="Loading the activity…" /> : null}
        {audit.isError ? (
          <ErrorNotice
            error={audit.error}
            title="Cannot load the activity"
            onRetry={() => audit.refetch()}
          />
        ) : null}
        {audit.data && audit.data.length === 0 ? <EmptyState title="No activity yet" /> : null}
        {audit.data && audit.data.length > 0 && rows.length === 0 ? (
          <EmptyState title="Nothing of this kind by this person" />
        ) : null}
        {rows.length > 0 ? (
          <ul aria-label="Team activity" className="flex flex-col divide-y divide-rule/60">
            {rows.map(({ event, count, since }) => {
              const to = targetLink(event);
              const object = describeObject(event);
              const detail = describeDetail(
                Object.fromEntries(
                  Object.entries(event.detail ?? {}).filter(([key]) => !NAMED.includes(key)),
                ),
              );
              return (
                <li
                  key={event.id}
                  className="flex flex-col gap-0.5 py-2 text-sm sm:flex-row sm:items-baseline sm:gap-3"
                >
                  <span className="shrink-0 text-xs text-ink-soft sm:w-40">
                    <time dateTime={event.createdAt}>
                      {timeFormat.format(new Date(event.createdAt))}
                    </time>
                    {count > 1 ? (
                      <span className="block">
                        since <time dateTime={since}>{timeFormat.format(new Date(since))}</time>
                      </span>
                    ) : null}
                  </span>
                  <span className="min-w-0 break-words">
                    <span className="font-medium text-ink-deep">
                      {event.actor?.name ?? "Someone"}
                    </span>{" "}
                    {describeAction(event.action)}
                    {count > 1 ? ` ${count} times` : ""}
                    {object ? (
                      <>
                        {" · "}
                        {to ? (
                          <Link to={to} className="text-ink underline">
                            {object}
                          </Link>
                        ) : (
                          object
                        )}
                      </>
                    ) : null}
                    {detail ? <span className="block text-xs text-ink-soft">{detail}</span> : null}
                  </span>
                </li>
              );
            })}
          </ul>
        ) : null}
      </Card>
    </div>
  );
}

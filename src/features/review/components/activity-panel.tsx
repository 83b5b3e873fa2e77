import type { ActivityView } from "@/contracts/plans";
import { EmptyState, ErrorNotice, Loading } from "@/components/feedback";
import { activityCsvUrl, useActivity } from "../api/activity";
import { describeAction, describeDetail } from "../lib/activity-words";

const timeFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

/** The plan's audit trail (who did what, when) with its CSV download. */
export function ActivityPanel({ planId }: { planId: string }) {
  const activity = useActivity(planId);
  return (
    <div>
      <div className="mb-3 flex justify-end">
        <a
          href={activityCsvUrl(planId)}
          download
          className="rounded-md border border-ink-soft px-3 py-1 text-sm font-medium text-ink hover:bg-paper-deep"
        >
          Download CSV
        </a>
      </div>
      {activity.isPending ? <Loading label="Loading the activity…" /> : null}
      {activity.isError ? (
        <ErrorNotice
          error={activity.error}
          title="Cannot load the activity"
          onRetry={() => activity.refetch()}
        />
      ) : null}
      {activity.data && activity.data.length === 0 ? (
        <EmptyState title="Nothing has happened to this plan yet" />
      ) : null}
      {activity.data && activity.data.length > 0 ? <ActivityList events={activity.data} /> : null}
    </div>
  );
}

export function ActivityList({ events }: { events: ActivityView[] }) {
  return (
    <ol aria-label="Activity" className="flex flex-col divide-y divide-rule/60">
      {events.map((event) => {
        const detail = describeDetail(event.detail);
        return (
          <li key={event.id} className="flex flex-wrap items-baseline gap-x-2 py-2 text-sm">
            <time
              dateTime={event.createdAt}
              className="w-40 shrink-0 font-mono text-xs text-ink-soft"
            >
              {timeFormat.format(new Date(event.createdAt))}
            </time>
            <span className="font-medium text-ink-deep">{event.actorName ?? "Someone"}</span>
            <span>{describeAction(event.action)}</span>
            {detail ? <span className="text-ink-soft">— {detail}</span> : null}
          </li>
        );
      })}
    </ol>
  );
}

import { useState } from "react";
import { Link, useNavigate } from "react-router-dom";
import type { NotificationKind, NotificationView } from "@/contracts/plans";
import { useMe } from "@/features/auth/api/me";
import { Button } from "@/components/button";
import { Card, EmptyState, ErrorNotice, Loading, PageHeader } from "@/components/feedback";
import { paths } from "@/app/paths";
import { useNotifications } from "../api/notifications";
import { useMarkRead } from "../api/mark-read";
import { useMarkAllRead } from "../api/mark-all-read";

const timeFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

export const KIND_LABELS: Record<NotificationKind, string> = {
  submitted: "Submitted for review",
  decision: "Decision",
  mention: "Mentioned you",
  reply: "Reply",
};

const KIND_TONE: Record<NotificationKind, string> = {
  submitted: "border-ink/40 bg-paper-deep text-ink-deep",
  decision: "border-moss/40 bg-moss-soft text-moss",
  mention: "border-ochre/60 bg-ochre-soft text-ink-deep",
  reply: "border-rule bg-card text-ink",
};

/** The in-app path a notice opens: its own link when it is a path, else the plan's Review. */
export function noticeTarget(notice: NotificationView): string {
  if (notice.link.startsWith("/") && !notice.link.startsWith("//")) return notice.link;
  try {
    const url = new URL(notice.link);
    if (typeof window !== "undefined" && url.origin === window.location.origin)
      return url.pathname + url.search + url.hash;
  } catch {
    // Not a URL: fall through to the plan's Review screen.
  }
  return paths.planReview(notice.planId);
}

/** The inbox: every notice about plans that concern the user; opening one marks it seen. */
export function InboxPage() {
  const { data: me } = useMe();
  const notifications = useNotifications();
  const markRead = useMarkRead();
  const markAll = useMarkAllRead();
  const navigate = useNavigate();
  const [unreadOnly, setUnreadOnly] = useState(false);
  const list = notifications.data ?? [];
  const unread = list.filter((n) => !n.read).length;
  const shown = unreadOnly ? list.filter((n) => !n.read) : list;
  const seesActivity = me ? me.role !== "trainee" : false;

  const open = (notice: NotificationView) => {
    if (!notice.read) markRead.mutate(notice.id);
    navigate(noticeTarget(notice));
  };

  return (
    <div>
      <PageHeader
        title="Inbox"
        subtitle={
          unread > 0
            ? `${unread} not yet seen · plans submitted to you, decisions on your plans, mentions and replies.`
            : "Plans submitted to you, decisions on your plans, mentions and replies."
        }
        actions={
          <>
            {seesActivity ? (
              <Link
                to={paths.activity}
                className="rounded-md px-3.5 py-1.5 text-sm font-medium text-ink hover:bg-paper-deep"
              >
                Team activity
              </Link>
            ) : null}
            <Button
              variant="secondary"
              disabled={unread === 0 || markAll.isPending}
              onClick={() => markAll.mutate()}
            >
              Mark all seen
            </Button>
          </>
        }
      />
      <Card className="max-w-4xl">
        <label className="mb-3 flex items-center gap-2 text-sm text-ink">
          <input
            type="checkbox"
            checked={unreadOnly}
            onChange={(e) => setUnreadOnly(e.target.checked)}
          />
          Not yet seen only
        </label>
        {markAll.isError ? (
          <ErrorNotice error={markAll.error} title="Could not mark everything seen" />
        ) : null}
        {markRead.isError ? (
          <ErrorNotice error={markRead.error} title="Could not mark the notice seen" />
        ) : null}
        {notifications.isPending ? <Loading label="Loading your inbox…" /> : null}
        {notifications.isError ? (
          <ErrorNotice
            error={notifications.error}
            title="Cannot load your inbox"
            onRetry={() => notifications.refetch()}
          />
        ) : null}
        {notifications.data && shown.length === 0 ? (
          <EmptyState title={unreadOnly ? "Nothing new" : "Your inbox is empty"}>
            You will hear here when a plan is submitted to you, when your plan gets a decision, and
            when someone mentions you or replies to you.
          </EmptyState>
        ) : null}
        {shown.length > 0 ? (
          <ul aria-label="Notifications" className="flex flex-col divide-y divide-rule/60">
            {shown.map((notice) => (
              <li
                key={notice.id}
                className={`flex items-start gap-3 py-2.5 ${notice.read ? "" : "bg-ochre-soft/30"}`}
              >
                <span
                  aria-hidden
                  className={`mt-1.5 h-2 w-2 shrink-0 rounded-full ${notice.read ? "bg-transparent" : "bg-brick"}`}
                />
                <button
                  type="button"
                  onClick={() => open(notice)}
                  className="min-w-0 flex-1 text-left"
                  aria-label={`${notice.read ? "" : "New: "}${notice.text}`}
                >
                  <span className="flex flex-wrap items-center gap-2">
                    <span
                      className={`rounded border px-1.5 py-px text-[11px] font-semibold ${KIND_TONE[notice.kind]}`}
                    >
                      {KIND_LABELS[notice.kind]}
                    </span>
                    <span className="text-sm font-medium text-ink-deep">{notice.planName}</span>
                  </span>
                  <span
                    className={`mt-0.5 block text-sm ${notice.read ? "text-ink-soft" : "font-medium text-ink-deep"}`}
                  >
                    {notice.text}
                  </span>
                  <span className="block text-xs text-ink-soft">
                    {notice.actorName} ·{" "}
                    <time dateTime={notice.createdAt}>
                      {timeFormat.format(new Date(notice.createdAt))}
                    </time>
                  </span>
                </button>
                {!notice.read ? (
                  <Button
                    variant="quiet"
                    className="shrink-0 px-2 py-1 text-xs"
                    onClick={() => markRead.mutate(notice.id)}
                    aria-label={`Mark seen: ${notice.text}`}
                  >
                    Mark seen
                  </Button>
                ) : null}
              </li>
            ))}
          </ul>
        ) : null}
      </Card>
    </div>
  );
}

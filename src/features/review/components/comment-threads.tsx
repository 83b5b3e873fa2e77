import { useMemo, useState } from "react";
import type { Plan } from "@engine";
import type { CommentAnchor, CommentView } from "@/contracts/plans";
import { ROLE_LABELS } from "@/contracts/common";
import { useMe } from "@/features/auth/api/me";
import { Button } from "@/components/button";
import { EmptyState, ErrorNotice, Loading } from "@/components/feedback";
import type { UnitSystem } from "@/lib/units";
import { useComments } from "../api/comments";
import { useCreateComment } from "../api/create-comment";
import { useUpdateComment } from "../api/update-comment";
import { useMentionMembers } from "../api/members";
import { useReviewPlan } from "../api/get-review-plan";
import { anchorLabel, anchorOptions } from "../lib/anchors";
import type { MentionCandidate } from "../lib/mentions";
import { splitMentions } from "../lib/mentions";
import {
  buildThreads,
  filterThreads,
  threadCounts,
  type Thread,
  type ThreadFilter,
} from "../lib/threads";
import { AnchorChip } from "./badges";
import { CommentForm } from "./comment-form";

const timeFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

const FILTERS: Array<{ value: ThreadFilter; label: string }> = [
  { value: "open", label: "Open notes" },
  { value: "resolved", label: "Closed notes" },
  { value: "all", label: "All" },
];

export interface CommentThreadsProps {
  planId: string;
  /**
   * Show only threads anchored here, and anchor new ones here (the designer shows them beside a
   * layer, refractor or shot). `null` means threads about the whole plan; omit for every thread.
   */
  anchorFilter?: CommentAnchor | null;
  /** A tighter layout for a side panel. */
  compact?: boolean;
}

/**
 * The review notes of a plan (comment threads in the API): show open or closed notes, start a
 * note (anchored or not), reply, close or reopen it (API: `resolved`), with @mention suggestions
 * from the team. Fetches what it needs itself.
 */
export function CommentThreads({ planId, anchorFilter, compact = false }: CommentThreadsProps) {
  const plan = useReviewPlan(planId);
  const comments = useComments(planId);
  const { data: me } = useMe();
  const canComment = plan.data?.permissions.comment ?? false;
  const members = useMentionMembers(canComment);
  const createThread = useCreateComment(planId);
  const [filter, setFilter] = useState<ThreadFilter>("open");
  const units: UnitSystem = me?.preferences.units ?? "metric";
  const document = plan.data?.document ?? null;

  const threads = useMemo(() => buildThreads(comments.data ?? []), [comments.data]);
  const scoped = anchorFilter === undefined ? threads : filterThreads(threads, "all", anchorFilter);
  const counts = threadCounts(scoped);
  const shown = filterThreads(scoped, filter);
  // A sandbox scenario is seen only by its author, reviewers and admins: the server mentions no
  // one else (docs/api.md, Mentions), so nobody else is offered.
  const sandbox = plan.data?.sandbox ?? false;
  const authorId = plan.data?.author.id;
  const candidates: MentionCandidate[] = (members.data ?? []).filter(
    (m) =>
      m.userId !== me?.user.id &&
      (!sandbox || m.role === "admin" || m.role === "reviewer" || m.userId === authorId),
  );
  const names = (members.data ?? []).map((m) => m.name);
  const anchorChoices = useMemo(
    () => (document && anchorFilter === undefined ? anchorOptions(document, units) : undefined),
    [document, anchorFilter, units],
  );

  if (comments.isPending || plan.isPending) return <Loading label="Loading comments…" />;
  if (comments.isError)
    return (
      <ErrorNotice
        error={comments.error}
        title="Cannot load the comments"
        onRetry={() => comments.refetch()}
      />
    );
  if (plan.isError) return <ErrorNotice error={plan.error} title="Cannot load the plan" />;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-2 print:hidden">
        <span className="text-xs font-medium text-ink-soft" aria-hidden>
          Show:
        </span>
        <div
          role="group"
          aria-label="Show notes"
          className="flex flex-wrap rounded-md border border-rule"
        >
          {FILTERS.map((f) => (
            <button
              key={f.value}
              type="button"
              aria-pressed={filter === f.value}
              onClick={() => setFilter(f.value)}
              className={`px-3 py-1 text-xs font-medium first:rounded-l-md last:rounded-r-md ${filter === f.value ? "bg-ink text-card" : "text-ink hover:bg-paper-deep"}`}
            >
              {f.label}
              {f.value === "open" ? ` (${counts.open})` : null}
              {f.value === "resolved" ? ` (${counts.resolved})` : null}
            </button>
          ))}
        </div>
      </div>

      {shown.length === 0 ? (
        <EmptyState
          title={
            filter === "resolved"
              ? "No closed notes"
              : filter === "open"
                ? "No open notes"
                : "No notes yet"
          }
        >
          {canComment && filter !== "resolved" ? "Start one below." : null}
        </EmptyState>
      ) : (
        <ol className="flex flex-col gap-3" aria-label="Review notes">
          {shown.map((thread) => (
            <li key={thread.root.id}>
              <ThreadCard
                planId={planId}
                thread={thread}
                document={document}
                latestRevision={plan.data.revision}
                canComment={canComment}
                canResolve={
                  canComment &&
                  !!me &&
                  (me.role === "admin" ||
                    me.role === "reviewer" ||
                    me.user.id === plan.data.author.id ||
                    me.user.id === thread.root.author.id)
                }
                candidates={candidates}
                names={names}
                units={units}
                showAnchor={anchorFilter === undefined}
                compact={compact}
              />
            </li>
          ))}
        </ol>
      )}

      {canComment ? (
        <div className="rounded-md border border-rule bg-paper/60 p-3 print:hidden">
          <CommentForm
            label={
              anchorFilter
                ? `New note on ${anchorLabel(anchorFilter, document, units)}`
                : "New note"
            }
            submitLabel="Post note"
            members={candidates}
            anchorChoices={anchorChoices}
            fixedAnchor={anchorFilter}
            pending={createThread.isPending}
            error={createThread.error}
            onSubmit={(input) => createThread.mutateAsync(input)}
          />
        </div>
      ) : (
        <p className="text-sm text-ink-soft">
          {me?.role === "trainee"
            ? "Trainees write notes on their own sandbox scenarios (to ask a reviewer a question); on team plans you read them."
            : "Your role can read the notes but not add to them."}
        </p>
      )}
    </div>
  );
}

/** The comments beside one layer, refractor or shot (for the designer). */
export function AnchorComments({ planId, anchor }: { planId: string; anchor: CommentAnchor }) {
  return <CommentThreads planId={planId} anchorFilter={anchor} compact />;
}

function ThreadCard({
  planId,
  thread,
  document,
  latestRevision,
  canComment,
  canResolve,
  candidates,
  names,
  units,
  showAnchor,
  compact,
}: {
  planId: string;
  thread: Thread;
  document: Plan | null;
  latestRevision: number;
  canComment: boolean;
  /** The server lets the note's author, the plan's author, reviewers and admins close it. */
  canResolve: boolean;
  candidates: MentionCandidate[];
  names: string[];
  units: UnitSystem;
  showAnchor: boolean;
  compact: boolean;
}) {
  const [replying, setReplying] = useState(false);
  const reply = useCreateComment(planId);
  const update = useUpdateComment(planId);
  const { root } = thread;
  return (
    <article
      aria-label={`Note started by ${root.author.name}`}
      className={`rounded-md border bg-card ${thread.resolved ? "border-rule/70 opacity-80" : "border-rule"} ${compact ? "p-2.5" : "p-3.5"}`}
    >
      <div className="mb-2 flex flex-wrap items-center gap-2 text-xs">
        {showAnchor && thread.anchor ? (
          <AnchorChip
            kind={thread.anchor.kind}
            label={anchorLabel(thread.anchor, document, units)}
          />
        ) : null}
        {thread.resolved ? (
          <span className="rounded-full border border-moss/40 bg-moss-soft px-2 py-0.5 font-medium text-moss">
            ✓ Closed
          </span>
        ) : null}
        <span
          className={`font-mono ${root.revision < latestRevision ? "text-ochre" : "text-ink-soft"}`}
        >
          revision {root.revision}
          {root.revision < latestRevision ? " (earlier)" : ""}
        </span>
      </div>
      <CommentBody comment={root} names={names} />
      {thread.replies.length > 0 ? (
        <ol
          aria-label="Replies"
          className="mt-2 ml-3 flex flex-col gap-2 border-l-2 border-rule pl-3"
        >
          {thread.replies.map((r) => (
            <li key={r.id}>
              <CommentBody comment={r} names={names} />
            </li>
          ))}
        </ol>
      ) : null}
      {update.isError ? (
        <div className="mt-2">
          <ErrorNotice error={update.error} title="Could not change the note" />
        </div>
      ) : null}
      {canComment ? (
        replying ? (
          <div className="mt-3">
            <CommentForm
              label={`Reply to ${root.author.name}`}
              submitLabel="Post reply"
              members={candidates}
              pending={reply.isPending}
              error={reply.error}
              autoFocus
              onSubmit={async (input) => {
                await reply.mutateAsync({ body: input.body, parentId: root.id });
                setReplying(false);
              }}
              onCancel={() => {
                reply.reset();
                setReplying(false);
              }}
            />
          </div>
        ) : (
          <div className="mt-2 flex gap-1">
            <Button variant="quiet" className="px-2 py-1 text-xs" onClick={() => setReplying(true)}>
              Reply
            </Button>
            {canResolve ? (
              <Button
                variant="quiet"
                className="px-2 py-1 text-xs"
                disabled={update.isPending}
                onClick={() => update.mutate({ commentId: root.id, resolved: !thread.resolved })}
              >
                {thread.resolved ? "Reopen note" : "Close note"}
              </Button>
            ) : null}
          </div>
        )
      ) : null}
    </article>
  );
}

function CommentBody({ comment, names }: { comment: CommentView; names: string[] }) {
  return (
    <div>
      <p className="text-xs text-ink-soft">
        <span className="font-semibold text-ink-deep">{comment.author.name}</span>
        <span> · {ROLE_LABELS[comment.author.role] ?? comment.author.role}</span>
        <span> · </span>
        <time dateTime={comment.createdAt}>{timeFormat.format(new Date(comment.createdAt))}</time>
      </p>
      <p className="mt-0.5 text-sm whitespace-pre-wrap text-ink-deep">
        {splitMentions(comment.body, names).map((part, i) =>
          part.kind === "mention" ? (
            <span key={i} className="rounded bg-ochre-soft px-0.5 font-medium text-ink-deep">
              {part.value}
            </span>
          ) : (
            <span key={i}>{part.value}</span>
          ),
        )}
      </p>
    </div>
  );
}

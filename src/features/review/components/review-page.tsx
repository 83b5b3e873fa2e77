import type { KeyboardEvent, ReactNode } from "react";
import { Link, useParams, useSearchParams } from "react-router-dom";
import type { PlanDetail } from "@/contracts/plans";
import { useMe } from "@/features/auth/api/me";
import { Card, ErrorNotice, Loading } from "@/components/feedback";
import { ErrorBoundary } from "@/components/error-boundary";
import { paths } from "@/app/paths";
import { ApiError } from "@/lib/api-client";
import type { UnitSystem } from "@/lib/units";
import { useReviewPlan } from "../api/get-review-plan";
import { useRevision } from "../api/get-revision";
import { useActivity } from "../api/activity";
import { latestDecisionNote } from "../lib/activity-words";
import { PlanStatusBadge } from "./badges";
import { DecisionPanel } from "./decision-panel";
import { ResolvabilitySummaryView } from "./resolvability-summary";
import { PlanDocumentView } from "./plan-document";
import { CommentThreads } from "./comment-threads";
import { HistoryPanel } from "./history-panel";
import { ActivityPanel } from "./activity-panel";
import { useReviewSlots } from "../review-slots";

const timeFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

/** The Review screen: the latest revision read-only, its verdicts, the decision, comments, history. */
export function ReviewPage() {
  const { planId = "" } = useParams();
  const plan = useReviewPlan(planId);
  const { data: me } = useMe();
  if (plan.isPending) return <Loading label="Loading the plan…" />;
  if (plan.isError) {
    // 404 (no such plan, another team's, a sandbox hidden from this role) or a mistyped id:
    // trying again cannot help, so say what it means and offer the way back.
    const missing =
      plan.error instanceof ApiError && (plan.error.status === 404 || plan.error.status === 400);
    if (missing)
      return (
        <div className="flex flex-col gap-3">
          <ErrorNotice
            error={
              new Error(
                "This plan does not exist, or you cannot see it (a sandbox scenario is seen only by its author, reviewers and admins).",
              )
            }
            title="Cannot open this plan for review"
          />
          <Link to={paths.sites} className="text-sm text-ink underline">
            Back to Sites
          </Link>
        </div>
      );
    return (
      <ErrorNotice
        error={plan.error}
        title="Cannot open this plan for review"
        onRetry={() => plan.refetch()}
      />
    );
  }
  if (!me) return null;
  return <Review plan={plan.data} units={me.preferences.units} />;
}

type Tab = "plan" | "history" | "activity";
const TABS: Array<{ tab: Tab; label: string }> = [
  { tab: "plan", label: "Plan" },
  { tab: "history", label: "History" },
  { tab: "activity", label: "Activity" },
];

function Review({ plan, units }: { plan: PlanDetail; units: UnitSystem }) {
  const revision = useRevision(plan.id, plan.revision);
  const activity = useActivity(plan.id);
  const [search, setSearch] = useSearchParams();
  const tab = TABS.find((t) => t.tab === search.get("tab"))?.tab ?? "plan";
  const selectTab = (next: Tab) =>
    setSearch(
      (prev) => {
        const params = new URLSearchParams(prev);
        params.set("tab", next);
        return params;
      },
      { replace: true },
    );
  // The tab list follows the usual keyboard pattern: one stop on Tab, arrows/Home/End move.
  const onTabKey = (event: KeyboardEvent<HTMLButtonElement>) => {
    const at = TABS.findIndex((t) => t.tab === tab);
    const to =
      event.key === "ArrowRight"
        ? (at + 1) % TABS.length
        : event.key === "ArrowLeft"
          ? (at - 1 + TABS.length) % TABS.length
          : event.key === "Home"
            ? 0
            : event.key === "End"
              ? TABS.length - 1
              : null;
    if (to === null) return;
    event.preventDefault();
    selectTab(TABS[to].tab);
    event.currentTarget.parentElement
      ?.querySelector<HTMLButtonElement>(`#review-tab-${TABS[to].tab}`)
      ?.focus();
  };
  const lastNote = latestDecisionNote(activity.data ?? []);
  const document = revision.data?.document ?? plan.document;
  const slots = useReviewSlots();

  return (
    <div>
      <p className="mb-2 text-sm">
        <Link to={paths.sites} className="text-ink underline">
          Sites
        </Link>{" "}
        ›{" "}
        <Link to={paths.site(plan.siteId)} className="text-ink underline">
          {plan.siteName}
        </Link>{" "}
        ›{" "}
        <Link to={paths.plan(plan.id)} className="text-ink underline">
          {plan.name}
        </Link>{" "}
        › Review
      </p>
      <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-rule pb-4">
        <div>
          <h1 className="text-2xl font-semibold tracking-tight text-ink-deep">
            Review: {plan.name}
          </h1>
          <p className="mt-1 flex flex-wrap items-center gap-2 text-sm text-ink-soft">
            <PlanStatusBadge status={plan.status} />
            <span className="font-mono text-xs">revision {plan.revision}</span>
            {/* One phrase, so a narrow screen never starts a line with a stray "·". */}
            <span data-testid="review-byline">
              by {plan.author.name}, updated{" "}
              <time dateTime={plan.updatedAt}>{timeFormat.format(new Date(plan.updatedAt))}</time>
            </span>
          </p>
        </div>
        <Link
          to={paths.plan(plan.id)}
          className="rounded-md border border-ink-soft bg-card px-3.5 py-1.5 text-sm font-medium text-ink hover:bg-paper-deep print:hidden"
        >
          {plan.permissions.edit ? "Edit in the designer" : "Open in the designer"}
        </Link>
      </header>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(20rem,1fr)]">
        <div className="flex min-w-0 flex-col gap-6">
          <Card>
            <h2 className="mb-3 font-semibold text-ink">
              Resolvability{" "}
              <span className="font-mono text-xs font-normal text-ink-soft">
                revision {plan.revision}
              </span>
            </h2>
            <ErrorBoundary title="The resolvability summary failed to draw">
              {revision.isPending ? (
                <Loading label="Loading the revision…" />
              ) : (
                <ResolvabilitySummaryView
                  document={document}
                  stored={revision.data?.summary}
                  units={units}
                />
              )}
            </ErrorBoundary>
          </Card>

          {slots && !revision.isPending ? (
            <Card>
              <h2 className="mb-3 font-semibold text-ink">
                Arrivals{" "}
                <span className="font-mono text-xs font-normal text-ink-soft">
                  revision {plan.revision}, read-only
                </span>
              </h2>
              <ErrorBoundary title="The charts failed to draw">
                {slots.renderCharts(document, units)}
              </ErrorBoundary>
            </Card>
          ) : null}

          <Card>
            <div
              role="tablist"
              aria-label="Plan details"
              className="mb-4 flex gap-1 border-b border-rule"
            >
              {TABS.map((t) => (
                <button
                  key={t.tab}
                  type="button"
                  role="tab"
                  id={`review-tab-${t.tab}`}
                  aria-selected={tab === t.tab}
                  aria-controls={`review-panel-${t.tab}`}
                  tabIndex={tab === t.tab ? 0 : -1}
                  onClick={() => selectTab(t.tab)}
                  onKeyDown={onTabKey}
                  className={`-mb-px border-b-2 px-3 py-1.5 text-sm font-medium ${tab === t.tab ? "border-ink text-ink-deep" : "border-transparent text-ink-soft hover:text-ink"}`}
                >
                  {t.label}
                </button>
              ))}
            </div>
            <div role="tabpanel" id={`review-panel-${tab}`} aria-labelledby={`review-tab-${tab}`}>
              <ErrorBoundary>
                {tab === "plan" ? <PlanDocumentView document={document} units={units} /> : null}
                {tab === "history" ? <HistoryPanel planId={plan.id} units={units} /> : null}
                {tab === "activity" ? <ActivityPanel planId={plan.id} /> : null}
              </ErrorBoundary>
            </div>
          </Card>
        </div>

        <div className="flex min-w-0 flex-col gap-6">
          <Card>
            <h2 className="mb-3 font-semibold text-ink">Decision</h2>
            {lastNote ? (
              <LastNote>
                <p className="text-xs text-ink-soft">
                  {lastNote.kind === "changes-requested"
                    ? "Returned with notes"
                    : lastNote.kind === "approved"
                      ? "Signed off for mobilisation"
                      : "Submitted"}{" "}
                  by {lastNote.actorName ?? "someone"} ·{" "}
                  {timeFormat.format(new Date(lastNote.createdAt))}
                </p>
                {lastNote.note ? (
                  <p className="mt-0.5 text-sm whitespace-pre-wrap text-ink-deep">
                    {lastNote.note}
                  </p>
                ) : (
                  <p className="mt-0.5 text-sm text-ink-soft italic">No note.</p>
                )}
              </LastNote>
            ) : null}
            <DecisionPanel plan={plan} />
          </Card>
          <Card>
            <h2 className="mb-3 font-semibold text-ink">Review notes</h2>
            <ErrorBoundary title="The review notes failed to draw">
              <CommentThreads planId={plan.id} />
            </ErrorBoundary>
          </Card>
        </div>
      </div>
    </div>
  );
}

function LastNote({ children }: { children: ReactNode }) {
  return (
    <blockquote
      aria-label="Latest note"
      className="mb-3 rounded-md border-l-4 border-ochre bg-ochre-soft/50 px-3 py-2"
    >
      {children}
    </blockquote>
  );
}

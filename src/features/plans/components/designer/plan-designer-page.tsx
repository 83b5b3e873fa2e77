import { memo, useCallback, useEffect, useRef, useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { FormProvider, useForm, useFormState, type Control } from "react-hook-form";
import { Link, useBlocker, useNavigate, useParams, useSearchParams } from "react-router-dom";
import type { Plan } from "@engine";
import { PLAN_STATUS_LABELS, type PlanDetail } from "@/contracts/plans";
import { useMe } from "@/features/auth/api/me";
import { Button } from "@/components/button";
import { ErrorBoundary } from "@/components/error-boundary";
import { Card, ErrorNotice, Loading, Notice } from "@/components/feedback";
import { paths } from "@/app/paths";
import type { UnitSystem } from "@/lib/units";
import { planQueryOptions, usePlan } from "../../api/get-plan";
import { isRevisionConflict, useSavePlan } from "../../api/save-plan";
import { useCreatePlan } from "../../api/create-plan";
import { useDuplicatePlan } from "../../api/duplicate-plan";
import { exactValues, planFormResolver, planToForm, type PlanForm } from "../../lib/plan-form";
import { appliedFormSpread, type AppliedChoice } from "../../lib/apply-choices";
import { shownSpreadParam } from "../../lib/roll-along-view";
import { useLivePlan } from "../../hooks/use-live-plan";
import { useSaveShortcut } from "../../hooks/use-save-shortcut";
import { usePlanHistory } from "../../hooks/use-plan-history";
import { HistoryButtons } from "./history-buttons";
import { usePlanAnalysis, type PlanAnalysisState } from "../../hooks/use-plan-analysis";
import { GroundModelsPanel } from "./ground-models-panel";
import { MaterialSourceNote } from "./material-picker";
import { SpreadPanel } from "./spread-panel";
import { ExactValuesContext } from "../../hooks/use-typed-number";
import { ResultsPanel } from "./results-panel";
import { SweepView } from "./sweep-view";
import { CompareView } from "./compare-view";
import { AnchorCommentsScope } from "./anchor-comments";
import { PlanPrintRecord } from "./plan-print-record";
import { warmModeller } from "../../lib/modeller-client";
import { usePrintMedia } from "../../hooks/use-print-media";

/** The designer route: loads the plan, then hands it to the editor keyed by plan and units. */
export function PlanDesignerPage() {
  const { planId = "" } = useParams();
  const plan = usePlan(planId);
  // The modeller's worker starts loading while the plan is fetched.
  useEffect(warmModeller, []);
  const { data: me } = useMe();
  if (plan.isPending) return <Loading label="Loading the plan…" />;
  if (plan.isError)
    return (
      <ErrorNotice
        error={plan.error}
        title="Cannot open this plan"
        onRetry={() => plan.refetch()}
      />
    );
  if (!me) return null;
  return (
    <AnchorCommentsScope planId={plan.data.id}>
      <PlanDesigner
        key={`${plan.data.id}:${me.preferences.units}`}
        detail={plan.data}
        units={me.preferences.units}
      />
    </AnchorCommentsScope>
  );
}

type View = "design" | "sweep" | "compare";
const VIEWS: Array<{ view: View; label: string }> = [
  { view: "design", label: "Design" },
  { view: "sweep", label: "Design sweep" },
  { view: "compare", label: "Side by side" },
];

function PlanDesigner({ detail, units }: { detail: PlanDetail; units: UnitSystem }) {
  const [baseline, setBaseline] = useState(detail);
  const readOnly = !baseline.permissions.edit;
  const [search, setSearch] = useSearchParams();
  const view = (VIEWS.find((v) => v.view === search.get("view"))?.view ?? "design") as View;
  const editor = search.get("edit") === "spread" ? "spread" : "models";
  const setParam = (key: string, value: string) =>
    setSearch(
      (prev) => {
        const next = new URLSearchParams(prev);
        next.set(key, value);
        return next;
      },
      { replace: true },
    );

  // The stored SI value behind each shown number; grows with every revision loaded or saved.
  const [exact] = useState(() => exactValues(detail.document, units));
  const form = useForm<PlanForm, unknown, Plan>({
    resolver: planFormResolver(units, baseline.name, exact),
    mode: "onChange",
    defaultValues: planToForm(baseline.document, units),
  });
  const [selectedModel, setSelectedModel] = useState(0);

  // Live analysis (see "Designer rendering" in DEVELOPERS.md): this component never watches
  // the form's values itself, so a keystroke re-renders only the boxes' own panels; the plan
  // as typed is parsed on every change and, when it differs, analysed at once by the worker.
  // When the plan is invalid, mark every offending field (also ones not yet touched, such as
  // a freshly added layer), so "fix the marked fields" always has marks to point at. This
  // full validation waits for a pause in typing; it is not on the way to the analysis.
  const markTimer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  const { trigger } = form;
  const markAll = useCallback(() => {
    clearTimeout(markTimer.current);
    markTimer.current = setTimeout(() => void trigger(), 200);
  }, [trigger]);
  useEffect(() => () => clearTimeout(markTimer.current), []);
  const livePlan = useLivePlan(form, units, baseline.name, exact, markAll);
  const analysis = usePlanAnalysis(livePlan, { spread: shownSpreadParam(search) });
  // The printed record of the inputs exists only while printing (the form is not printed).
  const printing = usePrintMedia();

  // Saving.
  const savePlan = useSavePlan(baseline.id);
  const createPlan = useCreatePlan(baseline.siteId);
  const duplicatePlan = useDuplicatePlan();
  const navigate = useNavigate();
  const [conflict, setConflict] = useState<Plan | null>(null);
  const [reloadError, setReloadError] = useState<unknown>(null);
  const queryClient = useQueryClient();
  const leaving = useRef(false);
  const save = useCallback(() => {
    if (readOnly || savePlan.isPending) return;
    void form.handleSubmit((document) => {
      const submitted = form.getValues();
      savePlan.mutate(
        { baseRevision: baseline.revision, document },
        {
          onSuccess: (saved) => {
            exactValues(saved.document, units, exact);
            setBaseline(saved);
            form.reset(structuredClone(submitted), { keepValues: true });
          },
          onError: (error) => {
            if (isRevisionConflict(error)) setConflict(document);
          },
        },
      );
    })();
  }, [readOnly, savePlan, form, baseline.revision, exact, units]);
  useSaveShortcut(save, !readOnly);
  const history = usePlanHistory(form, !readOnly);

  const applyRecommendation = useCallback(
    (spread: AppliedChoice) => {
      // One value, so Apply (spacing, channels, shots, roll-along) is one undo step.
      const next = appliedFormSpread(form.getValues("spread"), spread, units);
      form.setValue("spread", next, { shouldDirty: true, shouldValidate: true });
    },
    [form, units],
  );

  return (
    <FormProvider {...form}>
      <div>
        <p className="mb-2 text-sm print:hidden">
          <Link to={paths.sites} className="text-ink underline">
            Sites
          </Link>{" "}
          ›{" "}
          <Link to={paths.site(baseline.siteId)} className="text-ink underline">
            {baseline.siteName}
          </Link>
        </p>
        <header className="mb-4 flex flex-wrap items-end justify-between gap-x-4 gap-y-3 border-b border-rule pb-4 print:mb-2 print:pb-2">
          <div className="min-w-0">
            <h1 className="text-2xl font-semibold tracking-tight break-words text-ink-deep">
              {baseline.name}
            </h1>
            <p className="mt-1 flex flex-wrap items-center gap-x-2 gap-y-0.5 text-sm text-ink-soft print:hidden">
              <span>{PLAN_STATUS_LABELS[baseline.status]}</span>
              {baseline.sandbox ? (
                <span className="rounded-full border border-ochre/60 bg-ochre-soft px-2 py-0.5 text-xs font-medium text-ink-deep">
                  Sandbox
                </span>
              ) : null}
              <span>· by {baseline.author.name}</span>
              <span className="font-mono text-xs">· revision {baseline.revision}</span>
              {readOnly ? <span className="font-medium text-ink">· read only</span> : null}
              {/* The two links stay together: on a phone they wrap as a pair, never one alone. */}
              <span className="inline-flex items-center gap-2 whitespace-nowrap">
                <span className="max-sm:hidden">·</span>
                <Link to={paths.planReview(baseline.id)} className="text-ink underline">
                  Review
                </Link>
                <span>·</span>
                <Link to={paths.planField(baseline.id)} className="text-ink underline">
                  Field check
                </Link>
              </span>
            </p>
          </div>
          <div className="flex flex-wrap items-center gap-x-3 gap-y-2 print:hidden">
            {!readOnly ? <HistoryButtons history={history as never} /> : null}
            <AnalysisState
              control={form.control}
              valid={livePlan !== null}
              pending={analysis.pending}
              current={analysis.current}
              error={analysis.error}
            />
            {baseline.permissions.duplicate ? (
              <Button
                variant="secondary"
                disabled={duplicatePlan.isPending}
                title={
                  readOnly
                    ? "Make your own copy of the saved plan to edit"
                    : "Copy the saved plan (unsaved edits stay here)"
                }
                onClick={() =>
                  duplicatePlan.mutate(
                    { id: baseline.id, name: `${baseline.name} (copy)`.slice(0, 120) },
                    { onSuccess: (copy) => navigate(paths.plan(copy.id)) },
                  )
                }
              >
                Duplicate
              </Button>
            ) : null}
            {!readOnly ? (
              <SaveControls
                control={form.control}
                onSave={save}
                saving={savePlan.isPending}
                saved={savePlan.isSuccess}
              />
            ) : null}
          </div>
        </header>

        {duplicatePlan.isError ? (
          <div className="mb-4">
            <ErrorNotice error={duplicatePlan.error} title="Could not duplicate the plan" />
          </div>
        ) : null}
        {savePlan.isError && !isRevisionConflict(savePlan.error) ? (
          <div className="mb-4">
            <ErrorNotice error={savePlan.error} title="Could not save the plan" />
          </div>
        ) : null}
        {conflict ? (
          <ConflictNotice
            pendingCopy={createPlan.isPending}
            copyError={createPlan.error}
            reloadError={reloadError}
            onReload={async () => {
              // The user chose the saved version: their local edits are dropped on purpose.
              setReloadError(null);
              try {
                const fresh = await queryClient.fetchQuery({
                  ...planQueryOptions(baseline.id),
                  staleTime: 0,
                });
                exactValues(fresh.document, units, exact);
                setBaseline(fresh);
                form.reset(planToForm(fresh.document, units));
                setConflict(null);
                savePlan.reset();
              } catch (error) {
                setReloadError(error);
              }
            }}
            onCopy={() =>
              createPlan.mutate(
                { name: `${baseline.name} (my copy)`.slice(0, 120), document: conflict },
                {
                  onSuccess: (copy) => {
                    leaving.current = true;
                    setConflict(null);
                    navigate(paths.plan(copy.id));
                  },
                },
              )
            }
          />
        ) : null}
        <UnsavedChangesGuard control={form.control} readOnly={readOnly} leaving={leaving} />

        <nav aria-label="Designer views" className="mb-4 flex flex-wrap gap-1 print:hidden">
          {VIEWS.map((v) => (
            <button
              key={v.view}
              type="button"
              aria-current={view === v.view ? "page" : undefined}
              onClick={() => setParam("view", v.view)}
              className={`rounded-md px-3 py-1.5 text-sm font-medium ${
                view === v.view ? "bg-ink text-card" : "text-ink hover:bg-paper-deep"
              }`}
            >
              {v.label}
            </button>
          ))}
        </nav>

        <div hidden={view !== "design"}>
          {view === "design" && printing ? (
            <PlanPrintRecord
              detail={baseline}
              plan={livePlan}
              analysis={analysis.current ? analysis.result : null}
              units={units}
            />
          ) : null}
          {/* One column up to xl; minmax(0, …) lets wide content shrink to a phone's width. */}
          <div className="grid grid-cols-1 gap-5 xl:grid-cols-[minmax(0,5fr)_minmax(0,6fr)] print:block">
            <Card className="print:hidden">
              <div
                role="tablist"
                aria-label="Plan inputs"
                className="mb-4 flex gap-4 border-b border-rule"
              >
                {(
                  [
                    ["models", "Ground models"],
                    ["spread", "Spread"],
                  ] as const
                ).map(([key, label]) => (
                  <button
                    key={key}
                    type="button"
                    role="tab"
                    aria-selected={editor === key}
                    onClick={() => setParam("edit", key)}
                    className={`-mb-px border-b-2 pb-2 text-base font-semibold ${
                      editor === key
                        ? "border-ink text-ink-deep"
                        : "border-transparent text-ink-soft hover:text-ink"
                    }`}
                  >
                    {label}
                  </button>
                ))}
              </div>
              <form
                noValidate
                aria-label="Plan inputs"
                onSubmit={(e) => {
                  e.preventDefault();
                  save();
                }}
              >
                <fieldset disabled={readOnly} className="min-w-0">
                  {/* Only the chosen editor is mounted (the form keeps the other's values):
                      half the boxes to lay out and re-render. */}
                  {editor === "models" ? (
                    <ErrorBoundary title="The ground models panel failed to draw">
                      <MemoGroundModelsPanel
                        units={units}
                        selected={selectedModel}
                        onSelect={setSelectedModel}
                        readOnly={readOnly}
                      />
                      <MaterialSourceNote />
                    </ErrorBoundary>
                  ) : (
                    <ErrorBoundary title="The spread panel failed to draw">
                      <ExactValuesContext.Provider value={exact}>
                        <MemoSpreadPanel units={units} readOnly={readOnly} />
                      </ExactValuesContext.Provider>
                    </ErrorBoundary>
                  )}
                </fieldset>
              </form>
            </Card>
            <ErrorBoundary title="The analysis failed to draw">
              <MemoResultsPanel
                analysis={analysis}
                units={units}
                selectedModel={selectedModel}
                onSelectModel={setSelectedModel}
                readOnly={readOnly}
                onApplyRecommendation={applyRecommendation}
              />
            </ErrorBoundary>
          </div>
        </div>
        {view === "sweep" ? (
          <ErrorBoundary title="The design sweep failed to draw">
            <SweepView plan={livePlan} detail={baseline} units={units} />
          </ErrorBoundary>
        ) : null}
        {view === "compare" ? (
          <ErrorBoundary title="Side by side failed to draw">
            <CompareView plan={livePlan} detail={baseline} units={units} />
          </ErrorBoundary>
        ) : null}
      </div>
    </FormProvider>
  );
}

function countErrors(errors: unknown): number {
  if (!errors || typeof errors !== "object") return 0;
  let count = 0;
  for (const [key, value] of Object.entries(errors)) {
    if (key === "ref" || key === "type" || key === "types") continue;
    if (key === "message" && typeof value === "string") count += 1;
    else count += countErrors(value);
  }
  return count;
}

// The panels subscribe to the parts of the form they show (useWatch / useFormState by name),
// so the designer re-renders them only when their own props change.
const MemoGroundModelsPanel = memo(GroundModelsPanel);
const MemoSpreadPanel = memo(SpreadPanel);
const MemoResultsPanel = memo(ResultsPanel, (a, b) => {
  const keys = Object.keys(a) as Array<keyof typeof a>;
  return keys.every((k) =>
    k === "analysis" ? sameAnalysisState(a.analysis, b.analysis) : a[k] === b[k],
  );
});

/** The analysis state as the results show it (a fresh object each render, same content). */
function sameAnalysisState(a: PlanAnalysisState, b: PlanAnalysisState): boolean {
  return (
    a.result === b.result &&
    a.resultInput === b.resultInput &&
    a.current === b.current &&
    a.pending === b.pending &&
    a.error === b.error
  );
}

/** "● Unsaved changes" and Save: only these re-render when the form becomes dirty. */
function SaveControls({
  control,
  onSave,
  saving,
  saved,
}: {
  control: Control<PlanForm, unknown, Plan>;
  onSave: () => void;
  saving: boolean;
  saved: boolean;
}) {
  const { isDirty: dirty } = useFormState({ control });
  return (
    <>
      <span
        className={`text-sm ${dirty ? "font-medium text-ochre" : "text-ink-soft"}`}
        aria-live="polite"
      >
        {dirty ? "● Unsaved changes" : saved ? "Saved" : "No changes"}
      </span>
      <Button onClick={onSave} disabled={saving || !dirty} title="Save (Ctrl+S)">
        {saving ? "Saving…" : "Save"}
      </Button>
    </>
  );
}

/** Asks before leaving a plan with unsaved changes (in the app and when closing the tab). */
function UnsavedChangesGuard({
  control,
  readOnly,
  leaving,
}: {
  control: Control<PlanForm, unknown, Plan>;
  readOnly: boolean;
  leaving: { current: boolean };
}) {
  const { isDirty: dirty } = useFormState({ control });
  const blocker = useBlocker(
    ({ currentLocation, nextLocation }) =>
      dirty && !readOnly && !leaving.current && currentLocation.pathname !== nextLocation.pathname,
  );
  useEffect(() => {
    if (!dirty || readOnly) return;
    const onUnload = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener("beforeunload", onUnload);
    return () => window.removeEventListener("beforeunload", onUnload);
  }, [dirty, readOnly]);
  if (blocker.state !== "blocked") return null;
  return (
    <div className="mb-4">
      <Notice tone="caution">
        <p className="font-medium">This plan has unsaved changes.</p>
        <div className="mt-2 flex gap-2">
          <Button variant="secondary" onClick={() => blocker.reset()}>
            Stay and keep editing
          </Button>
          <Button variant="danger" onClick={() => blocker.proceed()}>
            Leave without saving
          </Button>
        </div>
      </Notice>
    </div>
  );
}

function AnalysisState({
  control,
  valid,
  pending,
  current,
  error,
}: {
  control: Control<PlanForm, unknown, Plan>;
  valid: boolean;
  pending: boolean;
  current: boolean;
  error: unknown;
}) {
  const { errors } = useFormState({ control });
  const errorCount = valid ? 0 : countErrors(errors);
  let text: string;
  let tone = "text-ink-soft";
  if (!valid) {
    text =
      errorCount > 0
        ? `Fix ${errorCount} marked field${errorCount === 1 ? "" : "s"} to update the analysis`
        : "Fix the marked fields to update the analysis";
    tone = "text-brick";
  } else if (pending) {
    text = "Updating…";
    tone = "text-ochre";
  } else if (error) {
    text = "The analysis failed";
    tone = "text-brick";
  } else if (current) {
    text = "Analysis up to date";
    tone = "text-moss";
  } else {
    text = "Waiting for the modeller…";
  }
  return (
    <span role="status" aria-live="polite" className={`text-sm font-medium ${tone}`}>
      {text}
    </span>
  );
}

function ConflictNotice({
  onReload,
  onCopy,
  pendingCopy,
  copyError,
  reloadError,
}: {
  onReload: () => void;
  onCopy: () => void;
  pendingCopy: boolean;
  copyError: unknown;
  reloadError: unknown;
}) {
  return (
    <div className="mb-4">
      <Notice tone="caution">
        <p className="font-medium">
          Someone saved a newer revision of this plan while you were editing.
        </p>
        <p className="mt-1">
          Your changes are still here and nothing has been lost. Reload to see their version (your
          edits are discarded), or save your edits as a copy of the plan.
        </p>
        <div className="mt-2 flex gap-2">
          <Button variant="secondary" onClick={onReload}>
            Reload their version
          </Button>
          <Button onClick={onCopy} disabled={pendingCopy}>
            {pendingCopy ? "Saving a copy…" : "Save as a copy"}
          </Button>
        </div>
        {copyError ? (
          <div className="mt-2">
            <ErrorNotice error={copyError} title="Could not save the copy" />
          </div>
        ) : null}
        {reloadError ? (
          <div className="mt-2">
            <ErrorNotice error={reloadError} title="Could not reload the plan" />
          </div>
        ) : null}
      </Notice>
    </div>
  );
}

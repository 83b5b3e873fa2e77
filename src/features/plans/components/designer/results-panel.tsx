import { useState } from "react";
import { useSearchParams } from "react-router-dom";
import { Card, ErrorNotice, Loading, Notice } from "@/components/feedback";
import { ErrorBoundary } from "@/components/error-boundary";
import { formatQuantity, type UnitSystem } from "@/lib/units";
import type { PlanAnalysisState } from "../../hooks/use-plan-analysis";
import type { AppliedSpread } from "../../lib/apply-recommendation";
import { VerdictBadge } from "../verdict-badge";
import { ArrivalsPanel } from "./arrivals-panel";
import { SectionPanel } from "./section-panel";
import { RollAlongTable } from "./roll-along-panel";
import { chartPlan } from "../../lib/roll-along-view";
import { ResolvabilityPanel } from "./resolvability-panel";
import { useLateFlag } from "../../hooks/use-late-flag";
import { isSectionAnalysis } from "@engine";
import { SectionAnswers, SectionReadOnly } from "../section/section-answers";
import { usePrintMedia } from "../../hooks/use-print-media";

type Tab = "arrivals" | "section" | "resolvability";
const TABS: Array<{ tab: Tab; label: string }> = [
  { tab: "arrivals", label: "Arrivals" },
  { tab: "section", label: "Section" },
  { tab: "resolvability", label: "Resolvability" },
];

/**
 * What the engine says about the plan as typed: a verdict strip, then Arrivals, Section and
 * Resolvability. Everything shown is the analysis of one exact plan (the result's input); a
 * result for an older edit is dimmed and labelled, never presented as current.
 */
export function ResultsPanel({
  analysis,
  units,
  selectedModel,
  onSelectModel,
  readOnly,
  onApplyRecommendation,
}: {
  analysis: PlanAnalysisState;
  units: UnitSystem;
  selectedModel: number;
  onSelectModel: (index: number) => void;
  readOnly: boolean;
  onApplyRecommendation: (spread: AppliedSpread) => void;
}) {
  const [search, setSearch] = useSearchParams();
  const tab = (TABS.find((t) => t.tab === search.get("panel"))?.tab ?? "arrivals") as Tab;
  const [shotIndex, setShotIndex] = useState(0);
  const { result, resultInput: typed, current, pending, error } = analysis;
  // The charts draw the spread the analysis details (roll-along: one spread of the line).
  const plan = typed && result ? chartPlan(typed, result) : typed;
  // Only an answer that takes a while is shown as "an earlier version" (no flicker per key).
  const outdated = useLateFlag(!current, 200);
  // In print every view is shown, one after the other (the tabs themselves are not printed).
  const printing = usePrintMedia();
  const shows = (t: Tab) => printing || tab === t;

  if (!result || !plan) {
    return (
      <Card>
        {error ? (
          <ErrorNotice error={error} title="The modeller could not analyse this plan" />
        ) : pending ? (
          <Loading label="Analysing the plan…" />
        ) : (
          <Notice>Fill in the marked fields and the analysis appears here.</Notice>
        )}
      </Card>
    );
  }

  const modelIndex = Math.min(selectedModel, result.models.length - 1);
  const model = result.models[modelIndex];
  const shot = Math.min(shotIndex, plan.spread.shots.length - 1);

  return (
    // In print the card runs over several pages (it holds every view), so it may break
    // (print-flow, index.css).
    <Card className="min-w-0 print-flow">
      <div className={outdated ? "opacity-70" : ""}>
        {outdated ? (
          <div className="mb-3">
            <Notice tone="caution">
              {error
                ? "The modeller could not analyse your latest edit; this is the analysis of an earlier version."
                : pending
                  ? "Updating… this is the analysis of an earlier version."
                  : "Out of date: this is the analysis of an earlier version. Fix the marked fields to update it."}
            </Notice>
          </div>
        ) : null}
        {error && !current ? (
          <div className="mb-3">
            <ErrorNotice error={error} title="The modeller refused the latest edit" />
          </div>
        ) : null}
        <div className="mb-3 flex flex-wrap items-center gap-x-3 gap-y-2" aria-label="Verdicts">
          <span className="text-sm font-semibold text-ink-deep">Plan verdict</span>
          <VerdictBadge verdict={result.worstStatus} />
          <div
            role="tablist"
            aria-label="Ground model shown"
            className="flex flex-wrap gap-1 border-l border-rule pl-3"
          >
            {result.models.map((m, i) => (
              <button
                key={i}
                type="button"
                role="tab"
                aria-selected={i === modelIndex}
                onClick={() => onSelectModel(i)}
                className={`flex items-center gap-1.5 rounded-md border px-2 py-0.5 text-xs ${
                  i === modelIndex ? "border-ink bg-paper-deep" : "border-rule hover:bg-paper-deep"
                }`}
              >
                <span className="font-medium text-ink-deep">{m.name}</span>
                <VerdictBadge verdict={m.worstStatus} />
              </button>
            ))}
          </div>
        </div>

        {printing ? (
          <p className="mb-2 hidden text-sm print:block">
            Analysis of <span className="font-semibold">{model.name}</span>, charts for shot{" "}
            {shot + 1} at {formatQuantity("length", plan.spread.shots[shot].position, units)}.
          </p>
        ) : null}
        <RollAlongTable plan={typed ?? plan} analysis={result} units={units} />
        <div className="mb-3 flex flex-wrap items-end justify-between gap-3 border-b border-rule print:hidden">
          <div role="tablist" aria-label="Analysis views" className="flex gap-4">
            {TABS.map((t) => (
              <button
                key={t.tab}
                type="button"
                role="tab"
                aria-selected={tab === t.tab}
                onClick={() =>
                  setSearch(
                    (prev) => {
                      const next = new URLSearchParams(prev);
                      next.set("panel", t.tab);
                      return next;
                    },
                    { replace: true },
                  )
                }
                className={`-mb-px border-b-2 pb-2 text-base font-semibold ${
                  tab === t.tab
                    ? "border-ink text-ink-deep"
                    : "border-transparent text-ink-soft hover:text-ink"
                }`}
              >
                {t.label}
              </button>
            ))}
          </div>
          {tab !== "resolvability" ? (
            <label className="mb-1.5 flex items-center gap-2 text-sm text-ink">
              Shot
              <select
                className="field-input w-auto! py-1! text-sm!"
                value={shot}
                onChange={(e) => setShotIndex(Number(e.target.value))}
              >
                {plan.spread.shots.map((s, i) => (
                  <option key={i} value={i}>
                    {i + 1}: {formatQuantity("length", s.position, units)}
                    {s.label ? ` (${s.label})` : ""}
                  </option>
                ))}
              </select>
            </label>
          ) : null}
        </div>

        {isSectionAnalysis(model) && printing ? (
          <ErrorBoundary title="The section answers failed to draw">
            <SectionAnswers
              plan={plan}
              analysis={model}
              modelIndex={modelIndex}
              shotIndex={shot}
              units={units}
              tab="arrivals"
            />
            <PrintHeading>Section and resolvability</PrintHeading>
            <SectionReadOnly plan={plan} analysis={model} modelIndex={modelIndex} units={units} />
          </ErrorBoundary>
        ) : null}
        {isSectionAnalysis(model) && !printing ? (
          <ErrorBoundary title="The section answers failed to draw">
            <SectionAnswers
              plan={plan}
              analysis={model}
              modelIndex={modelIndex}
              shotIndex={shot}
              units={units}
              tab={tab}
            />
          </ErrorBoundary>
        ) : null}
        {!isSectionAnalysis(model) && shows("arrivals") ? (
          <ErrorBoundary title="The Arrivals chart failed to draw">
            <ArrivalsPanel
              plan={plan}
              analysis={result}
              modelIndex={modelIndex}
              shotIndex={shot}
              units={units}
            />
          </ErrorBoundary>
        ) : null}
        {!isSectionAnalysis(model) && shows("section") ? (
          <ErrorBoundary title="The Section failed to draw">
            {printing ? <PrintHeading>Section</PrintHeading> : null}
            <SectionPanel plan={plan} modelIndex={modelIndex} shotIndex={shot} units={units} />
          </ErrorBoundary>
        ) : null}
        {!isSectionAnalysis(model) && shows("resolvability") ? (
          <ErrorBoundary title="The Resolvability table failed to draw">
            {printing ? <PrintHeading>Resolvability</PrintHeading> : null}
            <ResolvabilityPanel
              plan={typed ?? plan}
              analysis={result}
              model={model}
              modelIndex={modelIndex}
              units={units}
              readOnly={readOnly}
              current={current}
              onApply={onApplyRecommendation}
            />
          </ErrorBoundary>
        ) : null}
      </div>
    </Card>
  );
}

/** A heading between the views printed one after the other. */
function PrintHeading({ children }: { children: string }) {
  return (
    <h3 className="mt-4 mb-2 text-base font-semibold text-ink-deep print:break-after-avoid">
      {children}
    </h3>
  );
}

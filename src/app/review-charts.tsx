import { useState } from "react";
import { isSectionAnalysis, type Plan } from "@engine";
import type { UnitSystem } from "@/lib/units";
import { ArrivalsPanel } from "@/features/plans/components/designer/arrivals-panel";
import { ChartState } from "@/features/plans/components/charts/arrivals-chart";
import { usePlanAnalysis } from "@/features/plans/hooks/use-plan-analysis";
import {
  SectionArrivalsChart,
  SectionReadOnly,
} from "@/features/plans/components/section/section-answers";
import { ReviewPage, ReviewSlotsProvider, type ReviewSlots } from "@/features/review";

/**
 * The designer's Arrivals chart on the Review screen, read-only: the revision under review,
 * one ground model and shot at a time (the designer's own component, not a copy).
 */
export function ReviewCharts({ document, units }: { document: Plan; units: UnitSystem }) {
  const analysis = usePlanAnalysis(document);
  const [modelIndex, setModelIndex] = useState(0);
  const [shotIndex, setShotIndex] = useState(0);
  const model = Math.min(modelIndex, document.models.length - 1);
  const shot = Math.min(shotIndex, document.spread.shots.length - 1);
  if (model < 0 || shot < 0) return <p className="text-sm text-ink-soft">Nothing to draw.</p>;
  return (
    <div className="flex min-w-0 flex-col gap-3">
      <div className="flex flex-wrap gap-3 text-sm">
        <label className="flex flex-col gap-1">
          <span className="text-xs font-medium text-ink-soft">Ground model</span>
          <select
            className="field-input py-1"
            value={model}
            onChange={(e) => setModelIndex(Number(e.target.value))}
          >
            {document.models.map((m, i) => (
              <option key={i} value={i}>
                {m.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1">
          <span className="text-xs font-medium text-ink-soft">Shot</span>
          <select
            className="field-input py-1"
            value={shot}
            onChange={(e) => setShotIndex(Number(e.target.value))}
          >
            {document.spread.shots.map((s, i) => (
              <option key={i} value={i}>
                {`Shot ${i + 1}${s.label ? ` · ${s.label}` : ""}`}
              </option>
            ))}
          </select>
        </label>
      </div>
      <ChartState pending={analysis.pending && !analysis.result} error={analysis.error} />
      {analysis.result && analysis.current && isSectionAnalysis(analysis.result.models[model]) ? (
        <>
          <SectionArrivalsChart
            analysis={analysis.result.models[model]}
            shotIndex={shot}
            units={units}
            title={`Arrivals, ${document.models[model].name}, shot ${shot + 1}`}
            layerNames={document.models[model].layers.map((l, i) => l.name || `layer ${i + 1}`)}
          />
          <h3 className="mt-2 text-sm font-semibold text-ink-deep">
            Section: stretches sampled by head waves (read-only)
          </h3>
          <SectionReadOnly
            plan={document}
            analysis={analysis.result.models[model]}
            modelIndex={model}
            units={units}
          />
        </>
      ) : analysis.result && analysis.current ? (
        <ArrivalsPanel
          plan={document}
          analysis={analysis.result}
          modelIndex={model}
          shotIndex={shot}
          units={units}
        />
      ) : null}
    </div>
  );
}

/** What the Review screen borrows from the designer: its Arrivals chart, read-only. */
export const reviewSlots: ReviewSlots = {
  renderCharts: (document, units) => <ReviewCharts document={document} units={units} />,
};

/** The Review route's element (loaded with its own chunk, see router.tsx). */
export function ReviewRoute() {
  return (
    <ReviewSlotsProvider slots={reviewSlots}>
      <ReviewPage />
    </ReviewSlotsProvider>
  );
}

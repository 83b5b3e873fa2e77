import { useMemo, useState } from "react";
import { type UnitSystem } from "@/lib/units";
import { useElementWidth } from "@/hooks/use-element-width";
import { useLateFlag } from "../../hooks/use-late-flag";
import { useLatestResult } from "../../hooks/use-latest-result";
import { layeredModel, type Plan, type PlanAnalysis } from "../../lib/engine";
import { modeller } from "../../lib/modeller-client";
import { objectId } from "../../lib/object-id";
import { ArrivalsChart, ChartState, type ArrivalsData } from "../charts/arrivals-chart";

interface ChartRequest {
  plan: Plan;
  analysis: PlanAnalysis;
  modelIndex: number;
  shotIndex: number;
  domain: [number, number];
  reflections: boolean;
}

/** Signed offsets spanning the whole spread from a shot, m. */
export function wholeDomain(plan: Plan, shotIndex: number): [number, number] {
  const { spread } = plan;
  const shot = spread.shots[shotIndex].position;
  const first = spread.firstGeophone - shot;
  const last = spread.firstGeophone + (spread.channels - 1) * spread.spacing - shot;
  const lo = Math.min(first, last, 0);
  const hi = Math.max(first, last, 0);
  return lo === hi ? [lo - spread.spacing, hi + spread.spacing] : [lo, hi];
}

/**
 * The near offsets: out to 1.4 × the farthest crossover distance of this shot's branches (the
 * start of the last segment, from the engine's analysis), at least three spacings; a quarter of
 * the whole range when no arrival takes over from another.
 */
export function nearDomain(
  plan: Plan,
  shotIndex: number,
  model?: PlanAnalysis["models"][number],
): [number, number] {
  const [lo, hi] = wholeDomain(plan, shotIndex);
  let crossover = 0;
  for (const arrival of model ? [model.direct, ...model.refractors] : []) {
    for (const b of arrival.branches) {
      if (b.shot === shotIndex && b.segment && b.segment.from > 0)
        crossover = Math.max(crossover, b.segment.from);
    }
  }
  const reach = Math.max(crossover > 0 ? crossover * 1.4 : (hi - lo) / 4, 3 * plan.spread.spacing);
  return [Math.max(lo, -reach), Math.min(hi, reach)];
}

async function computeChart(request: ChartRequest) {
  const { plan, modelIndex, shotIndex, domain, reflections } = request;
  const model = layeredModel(plan.models[modelIndex]);
  const shot = plan.spread.shots[shotIndex].position;
  const [curves, arrivals] = await Promise.all([
    modeller().curves(model, shot, domain[0], domain[1], 800, { reflections }),
    modeller().arrivals(model, plan.spread, shotIndex),
  ]);
  return { curves, arrivals } satisfies ArrivalsData;
}

export function ArrivalsPanel({
  plan,
  analysis,
  modelIndex,
  shotIndex,
  units,
}: {
  plan: Plan;
  analysis: PlanAnalysis;
  modelIndex: number;
  shotIndex: number;
  units: UnitSystem;
}) {
  const [near, setNear] = useState(false);
  const [reflections, setReflections] = useState(false);
  const { ref, width } = useElementWidth<HTMLDivElement>(720);
  const domain = useMemo(
    () =>
      near
        ? nearDomain(plan, shotIndex, analysis.models[modelIndex])
        : wholeDomain(plan, shotIndex),
    [near, plan, shotIndex, analysis, modelIndex],
  );
  const request: ChartRequest = { plan, analysis, modelIndex, shotIndex, domain, reflections };
  const key = `${objectId(analysis)}:${modelIndex}:${shotIndex}:${domain.join(",")}:${reflections}`;
  const data = useLatestResult(request, key, computeChart);
  const shown = data.resultInput;
  const stale = useLateFlag(!data.current, 200);
  const model = plan.models[modelIndex];
  // A new array on every render would make the chart rebuild its paths on every render.
  const layerNames = useMemo(
    () => (shown ? shown.plan.models[shown.modelIndex].layers.map((l) => l.name) : []),
    [shown],
  );

  return (
    <div ref={ref} className="min-w-0 print:break-inside-avoid">
      <div className="mb-2 flex flex-wrap items-center gap-4 text-sm">
        <div role="group" aria-label="Offsets shown" className="flex gap-1">
          {(
            [
              [false, "Whole spread"],
              [true, "Near offsets"],
            ] as const
          ).map(([value, label]) => (
            <button
              key={label}
              type="button"
              aria-pressed={near === value}
              onClick={() => setNear(value)}
              className={`rounded-full px-3 py-0.5 text-xs ${near === value ? "bg-ink text-card" : "bg-paper-deep text-ink"}`}
            >
              {label}
            </button>
          ))}
        </div>
        <label className="flex items-center gap-1.5 text-xs text-ink">
          <input
            type="checkbox"
            checked={reflections}
            onChange={(e) => setReflections(e.target.checked)}
          />
          Show reflections
        </label>
      </div>
      <ChartState pending={data.pending && !data.result} error={data.error} />
      {data.result && shown ? (
        <ArrivalsChart
          data={data.result}
          analysis={shown.analysis.models[shown.modelIndex]}
          layerNames={layerNames}
          minGeophones={shown.plan.criteria.minGeophones}
          units={units}
          width={Math.max(320, width)}
          domain={shown.domain}
          showReflections={shown.reflections}
          stale={stale}
          title={`Arrivals, ${model.name}, shot ${shown.shotIndex + 1}`}
        />
      ) : null}
    </div>
  );
}

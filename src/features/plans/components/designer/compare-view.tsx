import { useEffect, useMemo, useRef, useState } from "react";
import { useQueries } from "@tanstack/react-query";
import type { PlanDetail } from "@/contracts/plans";
import { Card, ErrorNotice, Loading, Notice } from "@/components/feedback";
import { chartFont, palette } from "@/lib/chart/palette";
import { HorizontalGrid } from "@/lib/chart/grid";
import { type UnitSystem } from "@/lib/units";
import { useSitePlans } from "../../api/get-site-plans";
import { planQueryOptions } from "../../api/get-plan";
import { useElementWidth } from "@/hooks/use-element-width";
import { useModellerQuery } from "../../hooks/use-modeller-query";
import { layeredModel, type Plan } from "../../lib/engine";
import { isSectionAnalysis } from "@engine";
import { sectionOverlayData } from "../../lib/section-compare";
import { privateModeller, type ModellerClient } from "../../lib/modeller-client";
import {
  buildOverlay,
  compareRows,
  modelScenarios,
  planScenario,
  type Scenario,
  type ScenarioResult,
} from "../../lib/compare";
import { VerdictBadge } from "../verdict-badge";
import { ExportButtons } from "../charts/export-buttons";
import { wholeDomain } from "./arrivals-panel";

const MAX = 4;

/**
 * Every scenario's analysis and shot-1 curves, one question at a time (the modeller lets only
 * the newest request of a kind finish, so asking them all at once would cancel all but one).
 */
async function runScenarios(
  client: ModellerClient,
  scenarios: Scenario[],
): Promise<ScenarioResult[]> {
  const results: ScenarioResult[] = [];
  for (const s of scenarios) {
    const [from, to] = wholeDomain(s.plan, 0);
    const analysis = await client.analyze(s.plan);
    const first = analysis.models[0];
    if (isSectionAnalysis(first)) {
      // a section's arrivals come from its 2-D analysis
      results.push({ analysis, ...sectionOverlayData(first, 0) });
      continue;
    }
    const model = layeredModel(s.plan.models[0]);
    const curves = await client.curves(model, s.plan.spread.shots[0].position, from, to, 600, {
      reflections: false,
    });
    const arrivals = await client.arrivals(model, s.plan.spread, 0);
    results.push({ analysis, curves, arrivals });
  }
  return results;
}

/** Side by side: 2–4 candidate models of this plan, or 2–4 plans of the site. */
export function CompareView({
  plan,
  detail,
  units,
}: {
  plan: Plan | null;
  detail: PlanDetail;
  units: UnitSystem;
}) {
  const [source, setSource] = useState<"models" | "plans">(
    (plan?.models.length ?? 0) > 1 ? "models" : "plans",
  );
  const [models, setModels] = useState<number[]>(() =>
    Array.from({ length: Math.min(MAX, plan?.models.length ?? 0) }, (_, i) => i),
  );
  const [planIds, setPlanIds] = useState<string[]>([detail.id]);
  const sitePlans = useSitePlans(detail.siteId);
  const others = (sitePlans.data ?? []).filter((p) => p.status !== "archived");
  const details = useQueries({
    queries: planIds.filter((id) => id !== detail.id).map((id) => planQueryOptions(id)),
  });

  const scenarios: Scenario[] | null = useMemo(() => {
    if (!plan) return null;
    if (source === "models") {
      return modelScenarios(
        plan,
        models.filter((i) => i < plan.models.length),
      );
    }
    const list: Scenario[] = [];
    for (const id of planIds) {
      if (id === detail.id) list.push(planScenario(id, `${detail.name} (as edited)`, plan));
      else {
        const d = details.find((q) => q.data?.id === id)?.data;
        if (d) list.push(planScenario(id, d.name, d.document));
      }
    }
    return list;
  }, [plan, source, models, planIds, detail, details]);

  const enough = scenarios !== null && scenarios.length >= 2;
  // Side by side asks its questions of a modeller of its own, so that editing the plan (the
  // designer's live analysis) and comparing never cancel each other.
  const [own, setOwn] = useState<ReturnType<typeof privateModeller> | null>(null);
  useEffect(() => {
    const m = privateModeller();
    setOwn(m);
    return () => m.dispose();
  }, []);
  const results = useModellerQuery(enough && own ? scenarios : null, (list) =>
    runScenarios(own!.client, list),
  );
  const loadingPlans = details.some((q) => q.isPending);
  const failedPlan = details.find((q) => q.isError);

  const toggle = <T,>(list: T[], value: T) =>
    list.includes(value)
      ? list.filter((v) => v !== value)
      : list.length < MAX
        ? [...list, value]
        : list;

  return (
    <div className="grid gap-5 xl:grid-cols-[minmax(0,2fr)_minmax(0,5fr)]">
      <Card>
        <h2 className="mb-3 text-lg font-semibold text-ink-deep">Side by side</h2>
        <div role="radiogroup" aria-label="Compare" className="mb-3 flex gap-1 text-sm">
          {(
            [
              ["models", "Ground models of this plan"],
              ["plans", "Plans of this site"],
            ] as const
          ).map(([value, label]) => (
            <button
              key={value}
              type="button"
              role="radio"
              aria-checked={source === value}
              onClick={() => setSource(value)}
              className={`rounded-full px-3 py-1 text-xs ${source === value ? "bg-ink text-card" : "bg-paper-deep text-ink"}`}
            >
              {label}
            </button>
          ))}
        </div>
        <fieldset>
          <legend className="mb-1 text-sm text-ink-soft">Pick two to four.</legend>
          {source === "models" ? (
            plan ? (
              <ul className="flex flex-col gap-1.5">
                {plan.models.map((m, i) => (
                  <li key={i}>
                    <label className="flex items-center gap-2 text-sm">
                      <input
                        type="checkbox"
                        checked={models.includes(i)}
                        disabled={!models.includes(i) && models.length >= MAX}
                        onChange={() => setModels((list) => toggle(list, i).sort((a, b) => a - b))}
                      />
                      {m.name}
                    </label>
                  </li>
                ))}
              </ul>
            ) : null
          ) : sitePlans.isPending ? (
            <Loading label="Loading the site's plans…" />
          ) : sitePlans.isError ? (
            <ErrorNotice error={sitePlans.error} title="Cannot list the site's plans" />
          ) : (
            <ul className="flex flex-col gap-1.5">
              {others.map((p) => (
                <li key={p.id}>
                  <label className="flex flex-wrap items-center gap-2 text-sm">
                    <input
                      type="checkbox"
                      checked={planIds.includes(p.id)}
                      disabled={!planIds.includes(p.id) && planIds.length >= MAX}
                      onChange={() => setPlanIds((list) => toggle(list, p.id))}
                    />
                    {p.name}
                    {p.id === detail.id ? (
                      <span className="text-xs text-ink-soft">(this plan, as edited)</span>
                    ) : null}
                    {p.sandbox ? <span className="text-xs text-ink-soft">· sandbox</span> : null}
                  </label>
                </li>
              ))}
            </ul>
          )}
        </fieldset>
        {source === "models" && plan && plan.models.length < 2 ? (
          <p className="mt-3 text-sm text-ink-soft">
            This plan has one ground model. Add a candidate model in Ground models, or compare plans
            of the site.
          </p>
        ) : null}
      </Card>
      <Card className="min-w-0">
        {!plan ? (
          <Notice tone="caution">
            Fix the marked fields in Ground models and Spread to compare.
          </Notice>
        ) : failedPlan ? (
          <ErrorNotice error={failedPlan.error} title="Cannot open a plan to compare" />
        ) : loadingPlans ? (
          <Loading label="Opening the plans…" />
        ) : !enough ? (
          <Notice>Pick at least two to compare.</Notice>
        ) : results.error ? (
          <ErrorNotice error={results.error} title="The modeller could not compare these" />
        ) : results.result && results.resultInput ? (
          <Comparison
            scenarios={results.resultInput}
            results={results.result}
            units={units}
            stale={!results.current}
          />
        ) : (
          <Loading label="Comparing…" />
        )}
      </Card>
    </div>
  );
}

function Comparison({
  scenarios,
  results,
  units,
  stale,
}: {
  scenarios: Scenario[];
  results: ScenarioResult[];
  units: UnitSystem;
  stale: boolean;
}) {
  const { ref, width } = useElementWidth<HTMLDivElement>(720);
  const overlay = useMemo(
    () => buildOverlay(scenarios, results, Math.max(360, width), 320, units),
    [scenarios, results, width, units],
  );
  const rows = useMemo(() => compareRows(scenarios, results, units), [scenarios, results, units]);
  const svgRef = useRef<SVGSVGElement>(null);
  const { margin } = overlay;
  const bottom = overlay.height - margin.bottom;

  return (
    <div ref={ref} className={stale ? "opacity-60" : ""}>
      {stale ? <p className="mb-2 text-sm text-ochre">Updating…</p> : null}
      <h3 className="mb-1 font-semibold text-ink-deep">First arrivals from shot 1, overlaid</h3>
      <svg
        ref={svgRef}
        width={overlay.width}
        height={overlay.height}
        viewBox={`0 0 ${overlay.width} ${overlay.height}`}
        role="img"
        aria-label="First arrivals of the scenarios, overlaid"
        fontFamily={chartFont}
        className="block h-auto max-w-full"
      >
        <HorizontalGrid
          ticks={overlay.yTicks}
          left={margin.left}
          right={overlay.width - margin.right}
        />
        {overlay.xTicks.map((t) => (
          <text
            key={`x${t.label}`}
            x={t.px}
            y={bottom + 18}
            textAnchor="middle"
            fontSize={11}
            fill={palette.inkSoft}
          >
            {t.label}
          </text>
        ))}
        <line
          x1={margin.left}
          x2={overlay.width - margin.right}
          y1={bottom}
          y2={bottom}
          stroke={palette.ink}
        />
        <line x1={margin.left} x2={margin.left} y1={margin.top} y2={bottom} stroke={palette.ink} />
        {overlay.lines.map((l, i) => (
          <g key={l.key} data-scenario={l.name}>
            <path
              d={l.path}
              fill="none"
              stroke={l.colour}
              strokeWidth={2}
              strokeDasharray={i % 2 ? "6 3" : undefined}
            />
            {l.dots.map((d, k) => (
              <circle key={k} cx={d.x} cy={d.y} r={2.2} fill={l.colour} />
            ))}
          </g>
        ))}
        <text
          x={(margin.left + overlay.width - margin.right) / 2}
          y={overlay.height - 6}
          textAnchor="middle"
          fontSize={12}
          fill={palette.ink}
        >
          {overlay.xLabel}
        </text>
        <text
          transform={`translate(14 ${(margin.top + bottom) / 2}) rotate(-90)`}
          textAnchor="middle"
          fontSize={12}
          fill={palette.ink}
        >
          Time (ms)
        </text>
      </svg>
      <ul className="mt-1 flex flex-wrap gap-4 text-xs text-ink-soft" aria-label="Scenarios">
        {overlay.lines.map((l, i) => (
          <li key={l.key} className="flex items-center gap-1.5">
            <svg width="22" height="6" aria-hidden>
              <line
                x1="0"
                x2="22"
                y1="3"
                y2="3"
                stroke={l.colour}
                strokeWidth="2"
                strokeDasharray={i % 2 ? "6 3" : undefined}
              />
            </svg>
            {l.name}
          </li>
        ))}
      </ul>
      <div className="mt-2">
        <ExportButtons svgRef={svgRef} title="Side by side arrivals" />
      </div>

      <div className="mt-4 overflow-x-auto">
        <table className="w-full text-sm" aria-label="Verdicts and depth errors side by side">
          <thead className="text-left text-xs tracking-wide text-ink-soft uppercase">
            <tr className="border-b border-rule">
              <th scope="col" className="py-1.5 pr-3 font-semibold">
                <span className="sr-only">Row</span>
              </th>
              {scenarios.map((s, i) => (
                <th
                  key={s.key}
                  scope="col"
                  className="py-1.5 pr-3 pl-1.5 font-semibold normal-case"
                >
                  <span
                    className="mr-1 inline-block h-2 w-2 rounded-full"
                    style={{ background: overlay.lines[i]?.colour }}
                  />
                  {s.name}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.key} className="border-b border-rule/60 align-top">
                <th scope="row" className="py-2 pr-3 text-left font-medium">
                  {row.label}
                </th>
                {row.cells.map((c, i) => (
                  <td
                    key={i}
                    className={`py-2 pr-3 pl-1.5 ${c.differs ? "bg-ochre-soft/70 outline-1 -outline-offset-2 outline-ochre" : ""}`}
                    data-differs={c.differs ? "true" : undefined}
                  >
                    {c.status && row.key !== "worst" ? <VerdictBadge verdict={c.status} /> : null}
                    {row.key === "worst" && c.status ? (
                      <VerdictBadge verdict={c.status} />
                    ) : (
                      <span
                        className={`block font-mono text-xs ${c.warn ? "font-semibold text-brick" : ""}`}
                      >
                        {c.text}
                      </span>
                    )}
                    {c.differs ? <span className="sr-only"> (differs from the first)</span> : null}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-2 text-xs text-ink-soft">
          Depth error: interpreted minus true depth under shot 1 (intercept-time method on the
          resolved segments). Shaded cells differ from the first column.
        </p>
      </div>
    </div>
  );
}

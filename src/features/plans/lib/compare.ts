/**
 * Side by side: the overlaid first-arrival curves of 2–4 scenarios (plans or candidate
 * models) and the table of their verdicts and depth errors, with the cells that differ from
 * the first scenario marked. Pure; every number comes from the engine's answers.
 */
import { scaleLinear, type ScaleLinear } from "d3-scale";
import { line } from "d3-shape";
import { SCENARIO_COLOURS } from "@/lib/chart/palette";
import { formatQuantity, formatSigned, toDisplay, unitLabel, type UnitSystem } from "@/lib/units";
import type {
  ArrivalCurves,
  ModelAnalysis,
  Plan,
  PlanAnalysis,
  ShotArrivals,
  Status,
} from "./engine";
import { tickCount } from "@/lib/chart/tick-count";

export interface Scenario {
  key: string;
  name: string;
  /** A plan holding the scenario's ground model as its only model. */
  plan: Plan;
}

export interface ScenarioResult {
  analysis: PlanAnalysis;
  curves: ArrivalCurves;
  arrivals: ShotArrivals;
}

/** One scenario per candidate model of a plan. */
export function modelScenarios(plan: Plan, indexes: number[]): Scenario[] {
  return indexes.map((i) => ({
    key: `model-${i}`,
    name: plan.models[i].name,
    plan: { ...plan, models: [plan.models[i]] },
  }));
}

/** A saved plan as a scenario: its first candidate model, with its spread and criteria. */
export function planScenario(key: string, name: string, plan: Plan): Scenario {
  return {
    key,
    name: `${name} · ${plan.models[0].name}`,
    plan: { ...plan, models: [plan.models[0]] },
  };
}

export interface OverlayChart {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
  xTicks: Array<{ px: number; label: string }>;
  yTicks: Array<{ px: number; label: string }>;
  xLabel: string;
  lines: Array<{
    key: string;
    name: string;
    colour: string;
    path: string;
    dots: Array<{ x: number; y: number }>;
  }>;
}

export function buildOverlay(
  scenarios: Scenario[],
  results: ScenarioResult[],
  width: number,
  height: number,
  units: UnitSystem,
): OverlayChart {
  const margin = { top: 14, right: 16, bottom: 44, left: 56 };
  let lo = 0;
  let hi = 1;
  let tMax = 0.01;
  results.forEach((r) => {
    const o = r.curves.offsets;
    lo = Math.min(lo, o[0]);
    hi = Math.max(hi, o[o.length - 1]);
    r.curves.first.times.forEach((t) => {
      if (Number.isFinite(t)) tMax = Math.max(tMax, t);
    });
  });
  const x = scaleLinear()
    .domain([lo, hi])
    .range([margin.left, width - margin.right]);
  const y = scaleLinear()
    .domain([0, tMax * 1.1])
    .range([height - margin.bottom, margin.top]);
  const per = toDisplay("length", 1, units);
  const xTicks = scaleLinear()
    .domain([lo * per, hi * per])
    .ticks(tickCount(width - margin.left - margin.right))
    .map((v) => ({ px: x(v / per), label: String(v) }));
  const yTicks = scaleLinear()
    .domain([0, tMax * 1100])
    .ticks(6)
    .map((v) => ({ px: y(v / 1000), label: String(v) }));
  const lines = results.map((r, i) => {
    const idx = Array.from(r.curves.offsets, (_, k) => k);
    const path =
      line<number>()
        .defined((k) => Number.isFinite(r.curves.first.times[k]))
        .x((k) => x(r.curves.offsets[k]))
        .y((k) => y(r.curves.first.times[k]))(idx) ?? "";
    return {
      key: scenarios[i].key,
      name: scenarios[i].name,
      colour: SCENARIO_COLOURS[i % SCENARIO_COLOURS.length],
      path,
      dots: r.arrivals.geophones.map((g) => ({
        x: x(g.position - r.arrivals.shotPosition),
        y: y(g.first.time),
      })),
    };
  });
  return {
    width,
    height,
    margin,
    x,
    y,
    xTicks,
    yTicks,
    xLabel: `Offset from shot 1 (${unitLabel("length", units)})`,
    lines,
  };
}

export interface CompareCell {
  text: string;
  status?: Status;
  /** Differs from the first scenario's cell. */
  differs: boolean;
  /** Beyond the plan's depth tolerance. */
  warn?: boolean;
}

export interface CompareRow {
  key: string;
  label: string;
  cells: CompareCell[];
}

function layerCell(model: ModelAnalysis, layer: number, units: UnitSystem) {
  const r = model.refractors.find((x) => x.layer === layer);
  if (!r)
    return {
      status: undefined,
      text: "no such layer",
      depth: null as number | null,
      error: null as number | null,
      warn: false,
    };
  const i = model.interpretation?.refractors.find((x) => x.layer === layer);
  const error = i?.error ?? null;
  const errorText =
    error === null ? "not interpreted" : `error ${formatSigned("length", error, units)}`;
  return {
    status: r.status,
    text: `depth ${formatQuantity("length", r.depth, units)} · ${errorText}`,
    depth: r.depth,
    error,
    warn: !!i?.exceedsTolerance,
  };
}

const differsBy = (a: number | null, b: number | null, tolerance: number) =>
  (a === null) !== (b === null) || (a !== null && b !== null && Math.abs(a - b) > tolerance);

/** The verdict-and-depth-error table, one column per scenario. */
export function compareRows(
  scenarios: Scenario[],
  results: ScenarioResult[],
  units: UnitSystem,
): CompareRow[] {
  const models = results.map((r) => r.analysis.models[0]);
  const rows: CompareRow[] = [];
  const mark = (cells: Omit<CompareCell, "differs">[], same: (a: number, b: number) => boolean) =>
    cells.map((c, i) => ({ ...c, differs: i > 0 && !same(0, i) }));

  rows.push({
    key: "worst",
    label: "Worst verdict",
    cells: mark(
      models.map((m) => ({ text: m.worstStatus, status: m.worstStatus })),
      (a, b) => models[a].worstStatus === models[b].worstStatus,
    ),
  });
  const spreads = scenarios.map((s) => s.plan.spread);
  rows.push({
    key: "spread",
    label: "Spread",
    cells: mark(
      spreads.map((s) => ({
        text: `${s.channels} × ${formatQuantity("length", s.spacing, units)}`,
      })),
      (a, b) =>
        spreads[a].channels === spreads[b].channels && spreads[a].spacing === spreads[b].spacing,
    ),
  });
  const layerCount = Math.max(...models.map((m) => m.refractors.length + 1));
  for (let layer = 2; layer <= layerCount; layer++) {
    const cells = models.map((m) => layerCell(m, layer, units));
    rows.push({
      key: `layer-${layer}`,
      label: `Layer ${layer}`,
      cells: cells.map((c, i) => ({
        text: c.text,
        status: c.status,
        warn: c.warn,
        differs:
          i > 0 &&
          (c.status !== cells[0].status ||
            differsBy(c.depth, cells[0].depth, 1e-6) ||
            differsBy(c.error, cells[0].error, scenarios[0].plan.criteria.depthTolerance / 10)),
      })),
    });
  }
  const recs = results.map((r) => r.analysis.recommendation);
  rows.push({
    key: "max-spacing",
    label: "Largest spacing",
    cells: mark(
      recs.map((r) => ({
        text: r.maxSpacing === null ? "any" : formatQuantity("length", r.maxSpacing, units),
      })),
      (a, b) =>
        recs[a].maxSpacing === recs[b].maxSpacing ||
        (recs[a].maxSpacing !== null &&
          recs[b].maxSpacing !== null &&
          Math.abs((recs[a].maxSpacing as number) - (recs[b].maxSpacing as number)) < 1e-6),
    ),
  });
  return rows;
}

/**
 * Scales and paths of the Field check's time–distance chart (observed picks over the modelled
 * first arrivals, sampled in the field worker) and of the residual chart, as pure functions; the
 * components only bind them to SVG. Scales map SI values (m, s); ticks are chosen at round
 * values of what the user reads: ms for times, m or ft for positions.
 */
import { scaleLinear, type ScaleLinear } from "d3-scale";
import { line } from "d3-shape";
import type { FirstBreakPick } from "@/contracts/field";
import { fromDisplay, toDisplay, type UnitSystem } from "@/lib/units";

export interface ChartFrame {
  width: number;
  height: number;
  margin: { left: number; right: number; top: number; bottom: number };
}

export interface TdScales {
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
}

/** Position (m) and time (s) scales covering every pick and shot, time upwards from 0. */
export function tdScales(
  frame: ChartFrame,
  picks: readonly FirstBreakPick[],
  extraPositions: readonly number[] = [],
  maxModelTime = 0,
): TdScales {
  const positions = [
    ...picks.flatMap((p) => [p.sourcePosition, p.receiverPosition]),
    ...extraPositions,
  ];
  const lo = positions.length ? Math.min(...positions) : 0;
  const hi = positions.length ? Math.max(...positions) : 1;
  const pad = Math.max(1, (hi - lo) * 0.02);
  const tMax = Math.max(0.001, maxModelTime, ...picks.map((p) => p.time)) * 1.08;
  return {
    x: scaleLinear()
      .domain([lo - pad, hi + pad])
      .range([frame.margin.left, frame.width - frame.margin.right]),
    y: scaleLinear()
      .domain([0, tMax])
      .nice()
      .range([frame.height - frame.margin.bottom, frame.margin.top]),
  };
}

/**
 * A modelled first-arrival curve (positions m, times s, as the field worker samples them) as an
 * SVG path; "" when it has no point.
 */
export function curvePath(
  curve: { positions: readonly number[]; times: readonly number[] },
  scales: TdScales,
): string {
  const points = curve.positions.map((x, i) => [x, curve.times[i]] as [number, number]);
  return (
    line<[number, number]>()
      .x((d) => scales.x(d[0]))
      .y((d) => scales.y(d[1]))(points) ?? ""
  );
}

/** Symmetric residual scale (s) covering every residual, at least ±`floor` s. */
export function residualDomain(
  residuals: readonly (number | null)[],
  floor = 0.002,
): [number, number] {
  let m = floor;
  for (const r of residuals) if (r !== null && Number.isFinite(r)) m = Math.max(m, Math.abs(r));
  return [-m * 1.1, m * 1.1];
}

/** A tick of an SI scale at a round value in the user's unit: where it goes and what it reads. */
export interface DisplayTick {
  /** The tick's value in SI (m), for the scale. */
  si: number;
  /** The round value the user reads (m or ft). */
  shown: number;
}

/**
 * About `count` ticks of a position scale (SI, m) at round values in the user's unit: a feet
 * user reads 0, 20, 40 ft, not the feet of 0, 5, 10 m (d3's ticks on the shown domain).
 */
export function lengthTicks(
  scale: ScaleLinear<number, number>,
  units: UnitSystem,
  count = 10,
): DisplayTick[] {
  const [a, b] = scale.domain().map((v) => toDisplay("length", v, units));
  return scaleLinear()
    .domain([a, b])
    .ticks(count)
    .map((shown) => ({ si: fromDisplay("length", shown, units), shown }));
}

export interface ResidualScales {
  /** Geophone position (m) → x. */
  x: ScaleLinear<number, number>;
  /** Residual (s) → y, symmetric about 0 and extended to round ms values. */
  y: ScaleLinear<number, number>;
  /** Position ticks at round values in the user's unit. */
  xTicks: DisplayTick[];
  /** Residual ticks (s) at round ms values: −5, 0, 5 ms, never 3.7 or 7.5. */
  yTicks: number[];
}

/**
 * Scales of the residual chart: x over the geophone positions (padded, at least 1 m), y over
 * every residual and at least ±`floor` s, made nice (d3 `nice`) so its ticks fall on round ms.
 */
export function residualScales(
  frame: ChartFrame,
  rows: readonly { receiverPosition: number; residual: number | null }[],
  floor: number,
  units: UnitSystem,
): ResidualScales {
  const positions = rows.map((r) => r.receiverPosition);
  const lo = positions.length ? Math.min(...positions) : 0;
  const hi = positions.length ? Math.max(...positions) : 1;
  const pad = Math.max(1, (hi - lo) * 0.03);
  const x = scaleLinear()
    .domain([lo - pad, hi + pad])
    .range([frame.margin.left, frame.width - frame.margin.right]);
  // Ticks are chosen in ms (a power of ten from s, so round in s is round in ms).
  const y = scaleLinear()
    .domain(
      residualDomain(
        rows.map((r) => r.residual),
        floor,
      ),
    )
    .nice(5)
    .range([frame.height - frame.margin.bottom, frame.margin.top]);
  const plotWidth = frame.width - frame.margin.left - frame.margin.right;
  return {
    x,
    y,
    xTicks: lengthTicks(x, units, Math.max(2, Math.floor(plotWidth / 70))),
    yTicks: y.ticks(5),
  };
}

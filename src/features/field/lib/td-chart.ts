/**
 * Scales and paths of the Field check's time–distance chart (observed picks over the modelled
 * first arrivals, sampled in the field worker) and of the residual chart, as pure functions; the
 * components only bind them to SVG. Times are drawn in ms, positions in m.
 */
import { scaleLinear, type ScaleLinear } from "d3-scale";
import { line } from "d3-shape";
import type { FirstBreakPick } from "@/contracts/field";

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

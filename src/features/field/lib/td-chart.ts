/**
 * Scales and paths of the Field check's time–distance chart (observed picks over the modelled
 * first arrivals) and of the residual chart, as pure functions; the components only bind them
 * to SVG. Times are drawn in ms, positions in m.
 */
import { scaleLinear, type ScaleLinear } from "d3-scale";
import { line } from "d3-shape";
import { sampleCurves, type GroundModel } from "@engine";
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
 * The modelled first-arrival curve of one shot over [from, to] (positions, m) as an SVG path,
 * with the largest time on it (s). Stretches without an arrival are left out.
 */
export function modelledCurve(
  model: GroundModel,
  sourcePosition: number,
  from: number,
  to: number,
  scales: TdScales,
  samples = 161,
): { path: string; maxTime: number } {
  let curves;
  try {
    curves = sampleCurves(
      model,
      sourcePosition,
      from - sourcePosition,
      to - sourcePosition,
      samples,
      {
        reflections: false,
      },
    );
  } catch {
    return { path: "", maxTime: 0 };
  }
  const points: [number, number][] = [];
  let maxTime = 0;
  for (let i = 0; i < samples; i++) {
    const t = curves.first.times[i];
    if (!Number.isFinite(t)) continue;
    points.push([curves.positions[i], t]);
    maxTime = Math.max(maxTime, t);
  }
  const path =
    line<[number, number]>()
      .x((d) => scales.x(d[0]))
      .y((d) => scales.y(d[1]))(points) ?? "";
  return { path, maxTime };
}

/** Largest modelled first-arrival time over [from, to] for a shot, s (0 when none). */
export function maxModelledTime(
  model: GroundModel,
  sourcePosition: number,
  from: number,
  to: number,
): number {
  try {
    const c = sampleCurves(model, sourcePosition, from - sourcePosition, to - sourcePosition, 41, {
      reflections: false,
    });
    let m = 0;
    for (const t of c.first.times) if (Number.isFinite(t)) m = Math.max(m, t);
    return m;
  } catch {
    return 0;
  }
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

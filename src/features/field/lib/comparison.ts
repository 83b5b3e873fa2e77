/**
 * The Field check's comparison of observed picks with the plan (pure functions over the field
 * core in workers/field and the engine): fit of every candidate ground model, residuals per
 * geophone, misfit warnings, and user-chosen segments read by the intercept-time method.
 */
import type { FirstBreakPick } from "@/contracts/field";
import { sampleCurves, type GroundModel } from "@engine";
import {
  compareModels,
  fitSegment,
  groupByShotSide,
  interceptTimeDepths,
  localOutliers,
  misfitWarnings,
  modelFirstArrival,
  shotSidePoints,
  type InterceptTimeResult,
  type MisfitWarning,
  type ModelFit,
  type SegmentFit,
  type SpreadSide,
} from "../../../../workers/field/index";

/** A ground model the picks are compared with. */
export interface Candidate {
  name: string;
  model: GroundModel;
  /** "plan": one of the plan's models; "borehole": built from an uploaded log. */
  source: "plan" | "borehole";
}

export interface Comparison {
  fits: ModelFit[];
  /** Index of the best-fitting candidate (lowest RMS among those modelling the most picks). */
  best: number | null;
}

/** Fits every candidate model to the picks. */
export function compareCandidates(
  picks: readonly FirstBreakPick[],
  candidates: readonly Candidate[],
): Comparison {
  if (picks.length === 0 || candidates.length === 0) return { fits: [], best: null };
  return compareModels(
    picks,
    candidates.map((c) => ({ name: c.name, firstArrival: modelFirstArrival(c.model) })),
  );
}

/** Misfit-pattern warnings of the picks against one candidate. */
export function warningsFor(
  picks: readonly FirstBreakPick[],
  candidate: Candidate | undefined,
  pickError: number,
): MisfitWarning[] {
  if (!candidate || picks.length === 0) return [];
  return misfitWarnings(picks, modelFirstArrival(candidate.model), {
    pickError: Math.max(pickError, 0.0002),
  });
}

/** The shots and sides that hold picks, with how many. */
export function shotSides(
  picks: readonly FirstBreakPick[],
): { sourcePosition: number; side: SpreadSide; count: number }[] {
  return groupByShotSide(picks).map((g) => ({
    sourcePosition: g.sourcePosition,
    side: g.side,
    count: g.picks.length,
  }));
}

/** A segment as the user chose it: an offset range, m. */
export type SegmentRange = [number, number];

export interface SegmentReading {
  fits: SegmentFit[];
  /** Offsets of picks left out as outliers (far off the trend of their neighbours), m. */
  excluded: number[];
  /** Intercept-time interpretation of the fitted segments, when two or more fitted. */
  interpretation: InterceptTimeResult | null;
}

/**
 * Fits each segment of one shot and side and, when at least two fitted, interprets them as flat
 * layers with the intercept-time method (Telford et al. 1990 §4.3): segment 1 the direct wave,
 * segment k the head wave from the top of layer k.
 */
export function readSegments(
  picks: readonly FirstBreakPick[],
  sourcePosition: number,
  side: SpreadSide,
  ranges: readonly SegmentRange[],
  pickError = 0.0005,
): SegmentReading {
  const all = shotSidePoints(picks, sourcePosition, side);
  // A single mis-pick would bend a segment's line: leave out picks far off their neighbours'
  // trend (the same local check as the misfit warnings, on the times themselves).
  const outliers = new Set(
    localOutliers(
      all.map((p) => p.offset),
      all.map((p) => p.time),
      Math.max(pickError, 0.0002),
    ).map((o) => o.index),
  );
  const points = all.filter((_, i) => !outliers.has(i));
  const fits = ranges.map((r) => fitSegment(points, r));
  const ok = fits.filter((f): f is Extract<SegmentFit, { ok: true }> => f.ok);
  const interpretation =
    ok.length >= 2 && ok.length === fits.length
      ? interceptTimeDepths(
          ok.map((f) => ({
            velocity: f.velocity,
            intercept: f.intercept,
            velocityError: f.velocityError,
            interceptError: f.interceptError,
            velocityInterceptCovariance: f.velocityInterceptCovariance,
          })),
        )
      : null;
  return {
    fits,
    excluded: all.filter((_, i) => outliers.has(i)).map((p) => p.offset),
    interpretation,
  };
}

/**
 * Segments suggested from a model: consecutive picks whose modelled first arrival is the same
 * wave (direct, or the head wave of one layer) form one offset range.
 */
export function suggestSegments(
  picks: readonly FirstBreakPick[],
  sourcePosition: number,
  side: SpreadSide,
  model: GroundModel,
): SegmentRange[] {
  const points = shotSidePoints(picks, sourcePosition, side);
  const sign = side === "forward" ? 1 : -1;
  const ranges: SegmentRange[] = [];
  let layer = -1;
  for (const p of points) {
    let l: number;
    try {
      const offset = sign * p.offset;
      l = sampleCurves(model, sourcePosition, offset, offset, 1, { reflections: false }).first
        .layer[0];
    } catch {
      continue;
    }
    if (l !== layer || ranges.length === 0) {
      ranges.push([p.offset, p.offset]);
      layer = l;
    } else ranges[ranges.length - 1][1] = p.offset;
  }
  return ranges.filter(([a, b]) => b > a);
}

/**
 * The Field check's comparison of observed picks with the plan: the candidate ground models and
 * user-chosen segments read by the intercept-time method (pure functions over the field core's
 * line fits). The fit of every candidate, the misfit warnings, the modelled curves and the
 * suggested segments need the engine and run in the field worker (lib/field-worker.ts).
 */
import type { FirstBreakPick } from "@/contracts/field";
import type { GroundModel } from "@engine";
import {
  fitSegment,
  groupByShotSide,
  interceptTimeDepths,
  localOutliers,
  shotSidePoints,
  type InterceptTimeResult,
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

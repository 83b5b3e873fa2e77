/**
 * The functions the field worker exposes (plain data in, plain data out). Kept apart from the
 * worker entry (workers/field.worker.ts) so the same object can be exercised without a worker.
 */
import { sampleCurves, type GroundModel } from "@engine";
import { pickAic } from "./aic-picker";
import { groupByShotSide, shotSidePoints, type ObservedPick, type SpreadSide } from "./field-picks";
import { localOutliers, misfitWarnings, type MisfitWarning } from "./misfit-pattern";
import { modelFirstArrival } from "./modelled-arrivals";
import { compareModels, type ModelFit } from "./residuals";
import { candidateDepth } from "./plan-interpretation";
import { parsePicksCsv } from "./picks-csv";
import { fitSegment, type SegmentFit } from "./segment-fit";
import { interceptTimeDepths, type InterceptTimeResult } from "./intercept-time";
import { parseElevationCsv } from "./station-elevations";
import { pickEnergyRatio } from "./energy-ratio-picker";
import { pickOnset } from "./onset-picker";
import { interpretPlanPicks } from "./plan-interpretation";
import { pickRecord, pickTrace } from "./pick-record";
import { readSeg2 } from "./seg2-reader";
import { pickStaLta } from "./sta-lta-picker";

/** A ground model compared with the picks, by name. */
export interface NamedModel {
  name: string;
  model: GroundModel;
}

/** Fit of every candidate model and the misfit warnings against the one shown. */
export interface CandidateComparison {
  fits: ModelFit[];
  /** Index of the best-fitting candidate (lowest RMS among those modelling the most picks). */
  best: number | null;
  /** Index of the candidate shown: the chosen one, else the best, else 0. */
  shown: number;
  /** Misfit-pattern warnings of the picks against the shown candidate. */
  warnings: MisfitWarning[];
}

/**
 * Fits every candidate to the picks (RMS of residuals, s) and reads the misfit pattern against
 * the chosen candidate (`selected`, or the best fit when null). `pickError` in s (at least 0.2 ms
 * is used for the misfit check).
 */
export function compareCandidates(
  picks: readonly ObservedPick[],
  candidates: readonly NamedModel[],
  selected: number | null,
  pickError: number,
): CandidateComparison {
  const { fits, best } =
    picks.length === 0 || candidates.length === 0
      ? { fits: [], best: null }
      : compareModels(
          picks,
          candidates.map((c) => ({ name: c.name, firstArrival: modelFirstArrival(c.model) })),
        );
  const shown = selected ?? best ?? 0;
  const candidate = candidates[shown];
  const warnings =
    !candidate || picks.length === 0
      ? []
      : misfitWarnings(picks, modelFirstArrival(candidate.model), {
          pickError: Math.max(pickError, 0.0002),
        });
  return { fits, best, shown, warnings };
}

/**
 * Modelled first-arrival times (s) of `model` for each [source, receiver] pair of positions (m);
 * null where no wave arrives.
 */
export function modelledTimes(
  model: GroundModel,
  pairs: readonly (readonly [number, number])[],
): (number | null)[] {
  const f = modelFirstArrival(model);
  return pairs.map(([s, r]) => {
    const t = f(s, r);
    return Number.isFinite(t) ? t : null;
  });
}

/** One shot's modelled first-arrival curve: positions (m) and times (s), only where finite. */
export interface ModelledCurve {
  sourcePosition: number;
  positions: number[];
  times: number[];
}

/**
 * Modelled first-arrival curves of every model for every shot position (m) over the positions
 * [from, to] (m), `samples` samples each; `curves[model][shot]`. A model the engine cannot
 * sample gives empty curves. `maxTime` is the largest time on any curve, s (0 when none).
 */
export function modelledCurves(
  models: readonly GroundModel[],
  shots: readonly number[],
  from: number,
  to: number,
  samples = 161,
): { curves: ModelledCurve[][]; maxTime: number } {
  let maxTime = 0;
  const curves = models.map((model) =>
    shots.map((s) => {
      const out: ModelledCurve = { sourcePosition: s, positions: [], times: [] };
      let c;
      try {
        c = sampleCurves(model, s, from - s, to - s, samples, { reflections: false });
      } catch {
        return out;
      }
      for (let i = 0; i < samples; i++) {
        const t = c.first.times[i];
        if (!Number.isFinite(t)) continue;
        out.positions.push(c.positions[i]);
        out.times.push(t);
        maxTime = Math.max(maxTime, t);
      }
      return out;
    }),
  );
  return { curves, maxTime };
}

/**
 * Segments suggested from a model for one shot (m) and side: consecutive picks whose modelled
 * first arrival is the same wave (direct, or the head wave of one layer) form one offset range
 * [from, to], m. Ranges of a single pick are left out.
 */
export function suggestSegments(
  picks: readonly ObservedPick[],
  sourcePosition: number,
  side: SpreadSide,
  model: GroundModel,
): [number, number][] {
  const points = shotSidePoints(picks, sourcePosition, side);
  const sign = side === "forward" ? 1 : -1;
  const ranges: [number, number][] = [];
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

/** A shot (position, m) and side that holds picks, with how many. */
export interface ShotSideCount {
  sourcePosition: number;
  side: SpreadSide;
  count: number;
}

/** The shots and sides that hold picks, with how many. */
export function shotSides(picks: readonly ObservedPick[]): ShotSideCount[] {
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
  picks: readonly ObservedPick[],
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
 * Depth (m below the ground) of the top of `layer` (1-based, from 2) of each model at each
 * position (m); `depths[model][position]`, null where the model has no such interface.
 */
export function candidateDepths(
  models: readonly Pick<GroundModel, "layers">[],
  layer: number,
  positions: readonly number[],
): (number | null)[][] {
  return models.map((m) => positions.map((x) => candidateDepth(m, layer, x)));
}

/** SEG-2 reading, first-break picking and the interpretation under the line offered by the field worker. */
export const fieldApi = {
  readSeg2,
  pickRecord,
  pickTrace,
  pickStaLta,
  pickAic,
  pickEnergyRatio,
  pickOnset,
  interpretPlanPicks,
  compareCandidates,
  modelledTimes,
  modelledCurves,
  suggestSegments,
  shotSides,
  readSegments,
  candidateDepths,
  parsePicksCsv,
  parseElevationCsv,
};

/** Type of the field worker's API (wrap it with comlink's Remote<>). */
export type FieldApi = typeof fieldApi;

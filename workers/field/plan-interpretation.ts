/**
 * The interpretation of a plan's field picks as both the Field check screen and the command
 * line run it (one function, so both show the same numbers): picks are assigned to refractors
 * as the user chose or, by default, as the best-fitting candidate model suggests; station
 * elevations come from a CSV or, by default, from the surface of the plan's section model;
 * the pick error is the plan's. Each candidate's depths are compared with the interpreted ones.
 * Positions and depths m, times s, velocities m/s.
 */
import { sampleCurves, type GroundModel } from "@engine";
import type { ObservedPick } from "./field-picks";
import { interpretLine, type LineInterpretation, type LineMethod } from "./line-interpretation";
import { modelFirstArrival } from "./modelled-arrivals";
import { suggestAssignments, type LayerAssignment } from "./refractor-assignment";
import { compareModels } from "./residuals";
import { elevationProfile, surfaceFromModels, type ElevationPoint } from "./station-elevations";

/** The parts of a plan the interpretation reads. */
export interface PlanForInterpretation {
  models: readonly unknown[];
  criteria?: { pickError?: number };
}

/** Choices of the user; everything has a default. */
export interface PlanInterpretationOptions {
  method?: LineMethod;
  /** Picks assigned to refractors; default: suggested by the best-fitting layered candidate. */
  assignments?: readonly LayerAssignment[] | null;
  /** Station elevations (e.g. from a CSV); default: the plan's section surface, else flat 0 m. */
  elevations?: readonly ElevationPoint[] | null;
  /** Datum elevation, m; default the lowest station. */
  datum?: number | null;
  /** GRM: fixed XY, m; default the optimum. */
  xy?: number | null;
  /** σ of a pick, s; default the plan's criteria.pickError (0.5 ms when absent). */
  pickError?: number | null;
}

/** How far a candidate's refractor depths are from the interpreted ones. */
export interface CandidateMisfit {
  name: string;
  /** Per interpreted refractor: RMS of (interpreted − candidate) depth over the geophones, m;
   * null when the candidate has no such layer. */
  layers: { layer: number; rms: number | null }[];
}

/** The interpretation with where its inputs came from. */
export interface PlanInterpretation {
  result: LineInterpretation;
  assignments: LayerAssignment[];
  /** Name of the candidate the assignments were suggested from, or null (the user's). */
  suggestedFrom: string | null;
  elevationSource: "csv" | "plan" | "flat";
  misfits: CandidateMisfit[];
}

/** The layered candidates of a plan (section models are not used for suggestions yet). */
export function layeredCandidates(models: readonly unknown[]): GroundModel[] {
  return models.filter((m): m is GroundModel => {
    const kind = (m as { kind?: unknown }).kind;
    return (kind === undefined || kind === "layered") && Array.isArray((m as GroundModel).layers);
  });
}

/** Depth of the top of layer `layer` (1-based, ≥ 2) of a layered model at x, m. */
export function candidateDepth(
  model: Pick<GroundModel, "layers">,
  layer: number,
  x: number,
): number | null {
  if (layer < 2 || layer > model.layers.length) return null;
  let depth = 0;
  for (let i = 0; i < layer - 1; i++) depth += model.layers[i].thickness ?? 0;
  const dip = model.layers[layer - 2].dip ?? 0;
  return depth + x * Math.tan((dip * Math.PI) / 180);
}

/** The modelled first-arrival wave (1 = direct, L = head wave of layer L) of a model. */
export function modelArrivalLayer(model: Pick<GroundModel, "layers">) {
  return (shot: number, receiver: number): number | null => {
    try {
      const offset = receiver - shot;
      const l = sampleCurves(model, shot, offset, offset, 1, { reflections: false }).first.layer[0];
      return l >= 1 ? l : null;
    } catch {
      return null;
    }
  };
}

/**
 * Interprets a plan's picks.
 * @throws RangeError for bad picks or assignments, or when no assignment can be made
 */
export function interpretPlanPicks(
  plan: PlanForInterpretation,
  picks: readonly ObservedPick[],
  options: PlanInterpretationOptions = {},
): PlanInterpretation {
  const candidates = layeredCandidates(plan.models);
  let assignments = options.assignments ? [...options.assignments] : null;
  let suggestedFrom: string | null = null;
  if (!assignments) {
    if (candidates.length === 0) {
      throw new RangeError(
        "the plan has no layered ground model to suggest which picks belong to which refractor; assign them yourself",
      );
    }
    const fit = compareModels(
      picks,
      candidates.map((m) => ({ name: m.name, firstArrival: modelFirstArrival(m) })),
    );
    const best = candidates[fit.best ?? 0];
    assignments = suggestAssignments(picks, modelArrivalLayer(best));
    suggestedFrom = best.name;
  }
  let elevationSource: PlanInterpretation["elevationSource"] = "flat";
  let points: readonly ElevationPoint[] | null = null;
  if (options.elevations && options.elevations.length > 0) {
    points = options.elevations;
    elevationSource = "csv";
  } else {
    const surface = surfaceFromModels(plan.models);
    if (surface) {
      points = surface;
      elevationSource = "plan";
    }
  }
  const result = interpretLine({
    picks,
    assignments,
    method: options.method ?? "plus-minus",
    pickError: options.pickError ?? plan.criteria?.pickError ?? 0.0005,
    elevation: points ? elevationProfile(points) : null,
    datum: options.datum ?? null,
    xy: options.xy ?? null,
  });
  const misfits: CandidateMisfit[] = candidates.map((m) => ({
    name: m.name,
    layers: result.refractors.map((r) => {
      let sum = 0;
      let n = 0;
      for (const d of r.depth) {
        // candidates are measured below a flat surface: compare depths below the ground
        const c = candidateDepth(m, r.layer, d.position);
        if (c === null) continue;
        sum += (d.depth - c) ** 2;
        n++;
      }
      return { layer: r.layer, rms: n ? Math.sqrt(sum / n) : null };
    }),
  }));
  return { result, assignments, suggestedFrom, elevationSource, misfits };
}

/**
 * The reading a crew would make of a section model with the reciprocal methods: the modelled
 * first arrivals of every shot (noise-free picks) are assigned to the refractor each ray
 * travelled along (the section analysis tells, `SectionGeophoneArrival.via`), the line is
 * interpreted with the plus-minus method (Hagedoorn 1959) and, on request, the generalized
 * reciprocal method (Palmer 1980) through `interpretLine`, and the interpreted interfaces are
 * compared with the true ones under every geophone. Every reversed pair of shots enters:
 * `interpretLine` picks the pair covering most stations and phantoms from the others.
 * Positions, depths and elevations m (elevation up), times s, velocities m/s.
 */
import {
  analyzeSection,
  polylineAt,
  type Plan,
  type SectionModel,
  type SectionModelAnalysis,
} from "@engine";
import type { ObservedPick } from "./field-picks";
import { interpretLine, type LineMethod } from "./line-interpretation";
import type { LayerAssignment } from "./refractor-assignment";
import { elevationProfile } from "./station-elevations";

/** Methods a section reading may use. */
export type SectionReadingMethod = Extract<LineMethod, "plus-minus" | "grm">;

/** Choices; everything has a default. */
export interface SectionReadingOptions {
  /** Also read the line with the GRM (default false: plus-minus only). */
  grm?: boolean;
  /** σ of a pick used for the standard errors, s; default the plan's criteria.pickError. */
  pickError?: number;
}

/** The reading under one geophone. */
export interface ReadingPoint {
  /** Geophone position, m. */
  position: number;
  /** Interpreted depth below the ground and elevation of the interface, m. */
  depth: number;
  elevation: number;
  /** True depth below the ground and elevation of the interface there, m. */
  trueDepth: number;
  trueElevation: number;
  /** depth − trueDepth, m (positive: interpreted too deep). */
  error: number;
}

/** One interface as read by one method. */
export interface ReadingInterface {
  /** Layer whose top the interface is (2 = base of the first layer). */
  layer: number;
  /** Interpreted velocity below it (mean over the overlap), m/s. */
  velocity: number;
  points: ReadingPoint[];
  /** The largest |error| along the line and where, m; null without points. */
  worst: { position: number; error: number } | null;
}

/** The reading of one method. */
export interface MethodReading {
  method: SectionReadingMethod;
  /** Datum used, m; null when the method gave nothing. */
  datum: number | null;
  interfaces: ReadingInterface[];
  /** The largest |error| over every interface, m; null when nothing was read. */
  worst: { layer: number; position: number; error: number } | null;
  /** Plain notes of the interpretation (e.g. phantoming), and why a method gave nothing. */
  notes: string[];
}

/** The reading of a section model by the requested methods (plus-minus first). */
export interface SectionReading {
  modelIndex: number;
  readings: MethodReading[];
}

/** Noise-free picks of every shot at every geophone (offset-0 geophones included). */
export function picksFromArrivals(
  analysis: Pick<SectionModelAnalysis, "arrivals">,
): ObservedPick[] {
  return analysis.arrivals.flatMap((s) =>
    s.geophones.map((g) => ({
      sourcePosition: s.position,
      receiverPosition: g.position,
      time: g.time,
    })),
  );
}

/**
 * Assignments from the ray paths: per shot, runs of consecutive geophones whose first arrival
 * came along the same layer's top form one segment (a geophone at the shot ends a run).
 */
export function assignmentsFromArrivals(
  analysis: Pick<SectionModelAnalysis, "arrivals">,
): LayerAssignment[] {
  const out: LayerAssignment[] = [];
  for (const s of analysis.arrivals) {
    let run: LayerAssignment | null = null;
    for (const g of s.geophones) {
      const side = Math.sign(g.position - s.position);
      const prevSide = run ? Math.sign(run.from - s.position) : 0;
      if (run && run.layer === g.via && (side === prevSide || side === 0)) {
        run.to = g.position;
      } else {
        run = { shot: s.position, layer: g.via, from: g.position, to: g.position };
        out.push(run);
      }
    }
  }
  return out;
}

/** True elevation of the top of layer `layer` (1-based, ≥ 2) of a section model at x, m. */
export function trueTopAt(model: SectionModel, layer: number, x: number): number {
  let z = polylineAt(model.surface, x);
  for (let k = 0; k < layer - 1 && k < model.layers.length - 1; k++) {
    const base = model.layers[k].base;
    if (base && base.length > 0) z = Math.min(z, polylineAt(base, x));
  }
  return z;
}

/**
 * Reads a section model from its analysis.
 * @throws RangeError when the model is not a section model or the pick error is not in (0, 0.1) s
 */
export function sectionReading(
  plan: Pick<Plan, "models" | "criteria">,
  modelIndex: number,
  analysis: Pick<SectionModelAnalysis, "arrivals">,
  options: SectionReadingOptions = {},
): SectionReading {
  const model = plan.models[modelIndex];
  if (!model || model.kind !== "section") {
    throw new RangeError(`model ${modelIndex + 1} is not a section model`);
  }
  const picks = picksFromArrivals(analysis);
  const assignments = assignmentsFromArrivals(analysis);
  const elevation = elevationProfile(
    model.surface.map(([position, z]) => ({ position, elevation: z })),
  );
  const pickError = options.pickError ?? plan.criteria?.pickError ?? 0.0005;
  const methods: SectionReadingMethod[] = options.grm ? ["plus-minus", "grm"] : ["plus-minus"];
  const readings = methods.map((method): MethodReading => {
    let result;
    try {
      result = interpretLine({ picks, assignments, method, pickError, elevation });
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
      return { method, datum: null, interfaces: [], worst: null, notes: [error.message] };
    }
    let worst: MethodReading["worst"] = null;
    const interfaces = result.refractors.map((r): ReadingInterface => {
      let iw: ReadingInterface["worst"] = null;
      const points = r.depth
        .filter((d) => Number.isFinite(d.depth) && Number.isFinite(d.elevation))
        .map((d): ReadingPoint => {
          const ground = polylineAt(model.surface, d.position);
          const trueElevation = trueTopAt(model, r.layer, d.position);
          const trueDepth = ground - trueElevation;
          const error = d.depth - trueDepth;
          if (!iw || Math.abs(error) > Math.abs(iw.error)) iw = { position: d.position, error };
          return {
            position: d.position,
            depth: d.depth,
            elevation: d.elevation,
            trueDepth,
            trueElevation,
            error,
          };
        });
      const w = iw as ReadingInterface["worst"];
      if (w && (!worst || Math.abs(w.error) > Math.abs(worst.error))) {
        worst = { layer: r.layer, ...w };
      }
      return { layer: r.layer, velocity: r.meanVelocity, points, worst: w };
    });
    return {
      method,
      datum: result.datum,
      interfaces,
      worst,
      notes: [...result.notes, ...result.refractors.flatMap((r) => r.notes)],
    };
  });
  return { modelIndex, readings };
}

/**
 * Reads a plan's section model (the worker's entry point): from `analysis`, the model's
 * analysis already made (the page has it), or else analysing the model first.
 * @throws RangeError when the model is not a section model
 */
export function readSectionOfPlan(
  plan: Plan,
  modelIndex: number,
  options: SectionReadingOptions = {},
  analysis?: Pick<SectionModelAnalysis, "arrivals">,
): SectionReading {
  const model = plan.models[modelIndex];
  if (!model || model.kind !== "section") {
    throw new RangeError(`model ${modelIndex + 1} is not a section model`);
  }
  const arrivals = analysis ?? analyzeSection(model, modelIndex, plan.spread, plan.criteria);
  return sectionReading(plan, modelIndex, arrivals, options);
}

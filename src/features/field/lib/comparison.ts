/**
 * The Field check's comparison of observed picks with the plan: the candidate ground models and
 * the shapes of the answers. The fit of every candidate, the misfit warnings, the modelled curves,
 * the segments and the suggested segments are computed in the field worker (lib/field-worker.ts,
 * workers/field/worker-api.ts), never on the main thread.
 */
import type { GroundModel } from "@engine";
import type { ModelFit } from "../../../../workers/field/index";

export type {
  SegmentRange,
  SegmentReading,
  ShotSideCount,
} from "../../../../workers/field/worker-api";

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

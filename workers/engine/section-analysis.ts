/**
 * The analysis of a section model: first arrivals of every shot at every geophone from the
 * 2-D eikonal solver, the stretches of each interface sampled by head waves with the layered
 * verdicts per stretch, a recommendation for weak stretches, and the intercept-time
 * interpretation a crew would make under each shot.
 */
import type { Criteria, Plan, SectionModel, Spread } from "./plan-schema";
import type { ModelAnalysis } from "./analysis";
import type {
  SectionModelAnalysis,
  SectionShotField,
  SectionSweepResult,
  SectionSweepSpec,
} from "./section-types";
import type { SweepHooks } from "./sweep";

/** True when a model analysis comes from a section model (it carries arrivals and coverage). */
export function isSectionAnalysis(model: ModelAnalysis): model is SectionModelAnalysis {
  return (model as Partial<SectionModelAnalysis>).kind === "section";
}

/**
 * Analyse one section model of a validated plan (see parsePlan): `index` is its place in
 * `plan.models`. Throws RangeError for geometry the schema refuses.
 */
export function analyzeSection(
  model: SectionModel,
  index: number,
  spread: Spread,
  criteria: Criteria,
): SectionModelAnalysis {
  void model;
  void index;
  void spread;
  void criteria;
  throw new Error("not implemented");
}

/**
 * The time field and first-arrival ray paths of one shot over a section model (for the
 * section chart). `modelIndex` must point at a section model; `shot` is 0-based.
 */
export function sectionShotField(plan: Plan, modelIndex: number, shot: number): SectionShotField {
  void plan;
  void modelIndex;
  void shot;
  throw new Error("not implemented");
}

/** Design sweep over geophone spacing × one section parameter (see SectionSweepSpec). */
export function runSectionSweep(
  plan: Plan,
  spec: SectionSweepSpec,
  hooks: SweepHooks = {},
): SectionSweepResult {
  void plan;
  void spec;
  void hooks;
  throw new Error("not implemented");
}

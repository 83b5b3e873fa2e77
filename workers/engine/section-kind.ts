/**
 * Telling a section model's analysis from a layered one (a type guard only, kept apart from the
 * section solver so that screens can ask without loading it).
 */
import type { ModelAnalysis } from "./analysis";
import type { SectionModelAnalysis } from "./section-types";

/** True when a model analysis comes from a section model (it carries arrivals and coverage). */
export function isSectionAnalysis(model: ModelAnalysis): model is SectionModelAnalysis {
  return (model as Partial<SectionModelAnalysis>).kind === "section";
}

/**
 * The resolvability summary of a revision: per ground model, the verdict of every refractor and
 * the depth error a standard interpretation would make. Taken from the summary the server
 * stores with the revision (`RevisionAnalysisSummary`); when a revision has none, computed here
 * from its document with the engine's `analyzePlan`.
 */
import { analyzePlan, type Plan, type PlanAnalysis } from "@engine";
import type { RevisionAnalysisSummary } from "@/contracts/plans";

/** The summary as the Review screen shows it, whichever way it was obtained. */
export type ResolvabilitySummary = RevisionAnalysisSummary & {
  /** "stored": saved with the revision; "computed": analysed here from its document. */
  source: "stored" | "computed";
};

/** Condenses the engine's full analysis into the stored summary's shape. */
export function summarise(analysis: PlanAnalysis): RevisionAnalysisSummary {
  return {
    format: "spreadsight-revision-summary/1",
    worstVerdict: analysis.worstStatus,
    recommendation: analysis.recommendation,
    models: analysis.models.map((model) => {
      const interpreted = new Map(
        (model.interpretation?.refractors ?? []).map((r) => [r.layer, r] as const),
      );
      return {
        name: model.name,
        worstStatus: model.worstStatus,
        direct: model.direct.status,
        recommendation: model.recommendation.text,
        refractors: model.refractors.map((r) => {
          const seen = interpreted.get(r.layer);
          return {
            layer: r.layer,
            name: r.name,
            status: r.status,
            trueDepth: r.depth,
            interpretedDepth: seen?.interpretedDepth ?? null,
            error: seen?.error ?? null,
            exceedsTolerance: seen?.exceedsTolerance ?? false,
            minimumThickness: r.minimumThickness,
          };
        }),
      };
    }),
  };
}

const isStoredSummary = (value: unknown): value is RevisionAnalysisSummary =>
  typeof value === "object" &&
  value !== null &&
  (value as { format?: unknown }).format === "spreadsight-revision-summary/1" &&
  Array.isArray((value as { models?: unknown }).models);

/**
 * The summary of a revision: `stored` when the server saved one, otherwise the engine's
 * analysis of `document`. Throws only if the engine refuses the document.
 */
export function resolvabilityOf(document: Plan, stored?: unknown): ResolvabilitySummary {
  if (isStoredSummary(stored)) return { ...stored, source: "stored" };
  return { ...summarise(analyzePlan(document)), source: "computed" };
}

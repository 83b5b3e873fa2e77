/**
 * The resolvability summary of a revision: per ground model, the verdict of every refractor and
 * the depth error a standard interpretation would make. Taken from the summary the server
 * stores with the revision (`RevisionAnalysisSummary`); when a revision has none, computed
 * from its document by the engine's `analyzePlan` in the modeller's Web Worker (never on the
 * main thread).
 */
import type { Plan, PlanAnalysis } from "@engine";
import type { RevisionAnalysisSummary } from "@/contracts/plans";
import { getModeller } from "@/lib/modeller";

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

/** The engine's full analysis, run by the shared modeller (its worker). */
const analyseOffThread = (plan: Plan): Promise<PlanAnalysis> => getModeller().analyzeOne(plan);

/**
 * The summary of a revision: `stored` when the server saved one, otherwise the engine's
 * analysis of `document` (by `analyse`, the modeller's worker unless a test passes another).
 * Rejects only if the engine refuses the document.
 */
export async function resolvabilityOf(
  document: Plan,
  stored?: unknown,
  analyse: (plan: Plan) => Promise<PlanAnalysis> = analyseOffThread,
): Promise<ResolvabilitySummary> {
  if (isStoredSummary(stored)) return { ...stored, source: "stored" };
  return { ...summarise(await analyse(document)), source: "computed" };
}

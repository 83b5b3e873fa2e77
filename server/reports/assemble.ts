/**
 * The report's computed parts: the engine's analysis of the plan document and the field check
 * of the saved picks. Pure (no database), so the worker-thread pool runs it beside the drawing.
 */
import { analyzePlan } from "@engine";
import {
  compareModels,
  misfitWarnings,
  modelFirstArrival,
  type ObservedPick,
} from "../../workers/field/index";
import type { InterpretationChoices } from "@/contracts/field";
import type { UnitSystem } from "@/lib/units";
import { interpretationSummary } from "./field-interpretation";
import { reportUnits } from "./layout";
import type { PlanReportInput, ReportFieldCheck } from "./types";

/** What the database gives the report; the rest is computed by `completeReportInput`. */
export type ReportSource = Omit<PlanReportInput, "analysis" | "fieldCheck"> & {
  /** The plan's saved first-break picks, or null when none were saved. */
  picks: ObservedPick[] | null;
  /** The interpretation choices stored with the picks; null or absent: the defaults. */
  interpretation?: InterpretationChoices | null;
};

/** Best model, RMS per model and misfit warnings (written in `units`) for the saved picks. */
export function fieldCheckSummary(
  picks: readonly ObservedPick[],
  models: PlanReportInput["document"]["models"],
  pickError: number,
  units: UnitSystem = "metric",
  choices: InterpretationChoices | null = null,
): ReportFieldCheck | null {
  const u = reportUnits(units);
  if (picks.length === 0) return null;
  const candidates = models.map((m) => ({ name: m.name, firstArrival: modelFirstArrival(m) }));
  const { fits, best } = compareModels(picks, candidates);
  const bestIndex = best;
  const warnings =
    bestIndex === null
      ? []
      : misfitWarnings(picks, candidates[bestIndex].firstArrival, {
          pickError: Math.max(pickError, 0.0002),
        }).map(
          (w) =>
            `${candidates[bestIndex].name}, shot at ${u.lenU(w.sourcePosition)} (${w.side}): ${u.text(w.message)}`,
        );
  return {
    picks: picks.length,
    shots: [...new Set(picks.map((p) => p.sourcePosition))].sort((a, b) => a - b),
    fits: fits.map((f) => ({
      name: f.name,
      rms: f.rms,
      meanResidual: f.meanResidual,
      count: f.count,
    })),
    best: bestIndex === null ? null : fits[bestIndex].name,
    warnings,
    interpretation: interpretationSummary(picks, { models, criteria: { pickError } }, choices),
  };
}

/** Adds the analysis (or why there is none) and the field check to what the database gave. */
export function completeReportInput(source: ReportSource): PlanReportInput {
  const { picks, interpretation, ...rest } = source;
  let analysis: PlanReportInput["analysis"];
  try {
    analysis = { ok: true, value: analyzePlan(source.document) };
  } catch (error) {
    analysis = { ok: false, reason: (error as Error).message };
  }
  return {
    ...rest,
    analysis,
    fieldCheck: picks
      ? fieldCheckSummary(
          picks,
          source.document.models,
          source.document.criteria.pickError,
          source.units,
          interpretation ?? null,
        )
      : null,
  };
}

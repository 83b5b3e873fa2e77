/**
 * The functions the modeller worker exposes (plain data in, plain data out). Kept apart
 * from the worker entry so the same object can be exercised over any message channel.
 */
import { analyzePlan } from "./analysis";
import { computeArrivals, sampleCurves } from "./arrivals";
import type { Plan } from "./plan-schema";
import { firstArrivalRayPath } from "./ray-paths";
import { sectionShotField } from "./section-analysis";
import { runSectionSweep } from "./section-sweep";
import { sectionFromLayered } from "./section-convert";
import type { SectionSweepResult, SectionSweepSpec } from "./section-types";
import { runSweep, type SweepResult, type SweepSpec } from "./sweep";
import { parsePlan } from "./validate";

/** Engine functions offered by the worker. */
export const modellerApi = {
  parsePlan,
  analyzePlan,
  computeArrivals,
  sampleCurves,
  firstArrivalRayPath,
  /** Run a sweep; `onProgress` receives fractions 0..1 after each row. */
  runSweep(plan: Plan, spec: SweepSpec, onProgress?: (fraction: number) => void): SweepResult {
    return runSweep(plan, spec, { onProgress });
  },
  /** Time field and first-arrival rays of one shot over a section model. */
  sectionShotField,
  /** A layered model as a section over [from, to] m. */
  sectionFromLayered,
  /** Section design sweep; `onProgress` receives fractions 0..1 after each row. */
  runSectionSweep(
    plan: Plan,
    spec: SectionSweepSpec,
    onProgress?: (fraction: number) => void,
  ): SectionSweepResult {
    return runSectionSweep(plan, spec, { onProgress });
  },
};

/** Type of the worker's API (wrap it with comlink's Remote<>). */
export type ModellerApi = typeof modellerApi;

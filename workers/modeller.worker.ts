/**
 * The modeller's Web Worker entry: exposes the engine through comlink. Typed arrays in
 * results (sweep grids, chart curves) are transferred, not copied.
 */
import "./zod-jitless";
import { expose, transfer } from "comlink";
import {
  modellerApi,
  type Plan,
  type SectionModelAnalysis,
  type SectionSweepSpec,
  type SweepSpec,
} from "./engine";
import { readSectionOfPlan, type SectionReadingOptions } from "./field/section-reading";

function buffersOf(value: unknown, out: ArrayBuffer[] = []): ArrayBuffer[] {
  if (ArrayBuffer.isView(value)) {
    if (value.buffer instanceof ArrayBuffer && !out.includes(value.buffer)) out.push(value.buffer);
  } else if (Array.isArray(value)) value.forEach((v) => buffersOf(v, out));
  else if (value && typeof value === "object")
    Object.values(value).forEach((v) => buffersOf(v, out));
  return out;
}

const api = {
  ...modellerApi,
  sampleCurves(...args: Parameters<typeof modellerApi.sampleCurves>) {
    const curves = modellerApi.sampleCurves(...args);
    return transfer(curves, buffersOf(curves));
  },
  runSweep(plan: Plan, spec: SweepSpec, onProgress?: (fraction: number) => void) {
    const result = modellerApi.runSweep(plan, spec, onProgress);
    return transfer(result, buffersOf(result));
  },
  sectionShotField(...args: Parameters<typeof modellerApi.sectionShotField>) {
    const field = modellerApi.sectionShotField(...args);
    return transfer(field, buffersOf(field));
  },
  runSectionSweep(plan: Plan, spec: SectionSweepSpec, onProgress?: (fraction: number) => void) {
    const result = modellerApi.runSectionSweep(plan, spec, onProgress);
    return transfer(result, buffersOf(result));
  },
  /**
   * The crew's reading of a section model by the reciprocal methods (plain JSON), from the
   * analysis' arrivals when the page passes them (no second analysis).
   */
  sectionReading(
    plan: Plan,
    modelIndex: number,
    options?: SectionReadingOptions,
    analysis?: Pick<SectionModelAnalysis, "arrivals">,
  ) {
    return readSectionOfPlan(plan, modelIndex, options, analysis);
  },
};

/** The API as seen through comlink (wrap with `Remote<ModellerWorkerApi>`). */
export type ModellerWorkerApi = typeof api;

expose(api);

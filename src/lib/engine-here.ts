/**
 * The engine functions the modeller facade runs on this thread where no Worker exists (jsdom
 * tests, old browsers). Only ever imported dynamically (src/lib/modeller.ts), so this code is
 * a chunk of its own that a browser with workers never loads.
 */
export {
  analyzePlan,
  computeArrivals,
  createSweepRunner,
  firstArrivalRayPath,
  runSectionSweep,
  sampleCurves,
  sectionShotField,
} from "@engine";
export { readSectionOfPlan } from "../../workers/field/section-reading";

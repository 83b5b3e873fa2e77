/**
 * Spreadsight's modeller engine: the only public surface of workers/engine.
 * Pure TypeScript (no DOM, Node, React or comlink). Units: m, s, m/s, degrees.
 */
export * from "./plan-schema";
export { parsePlan, geometryIssues, layoutOf, type ParsePlanResult } from "./validate";
export {
  analyzePlan,
  type AnalyzeOptions,
  type PlanAnalysis,
  type ModelAnalysis,
  type DirectWaveAnalysis,
  type RefractorAnalysis,
  type BranchVerdict,
  type Segment,
  type Interpretation,
  type InterpretedRefractor,
  type DipCheck,
  type Uncertainty,
  type Recommendation,
  type HiddenLayer,
} from "./analysis";
export {
  computeArrivals,
  sampleCurves,
  type ArrivalKind,
  type ArrivalOptions,
  type GeophoneArrivals,
  type ShotArrivals,
  type ArrivalCurves,
} from "./arrivals";
export { firstArrivalRayPath, type RayPath } from "./ray-paths";
export {
  runSweep,
  createSweepRunner,
  sweepSpecSchema,
  MAX_SWEEP_CELLS,
  type SweepSpec,
  type SweepResult,
  type SweepHooks,
  type SweepRunner,
} from "./sweep";
export { followShots } from "./follow-shots";
export {
  anchorAt,
  anchorPoint,
  defaultAnchor,
  resolveShotPosition,
  resolveShotPositions,
  type AnchoredShot,
  type ShotAnchor,
  type ShotAnchorPoint,
  type SpreadGeometry,
} from "./shot-anchors";
export {
  MAX_ROLL_ALONG_SPREADS,
  lineStations,
  rollAlongFor,
  rollAlongLayout,
  type RollAlong,
  type RollAlongLayout,
  type RollAlongShot,
  type RollAlongSpread,
  type RollingSpread,
} from "./roll-along";
export {
  MAX_STACK,
  SITE_NOISE_LEVELS,
  SOURCE_REACH,
  SOURCE_TYPES,
  reachFlags,
  sourceReach,
  stacksToReach,
  type ReachFlag,
  type SiteNoise,
  type SourceType,
} from "./source-reach";
export {
  STATUSES,
  STATUS_CODE,
  CELL_INVALID,
  CELL_NOT_COMPUTED,
  worseStatus,
  worstStatus,
  statusFromCode,
  type Status,
} from "./statuses";
export type { Side } from "./branches";
export {
  interceptTimeMethod,
  crossoverMethod,
  recoverDip,
  type ObservedLine,
  type InterceptTimeResult,
  type DipRecovery,
} from "./interpretation";
export {
  MATERIALS,
  MATERIALS_SOURCE,
  findMaterial,
  matchMaterial,
  type Material,
} from "./materials";
export { polylineAt } from "./section-schema";
export { sectionFromLayered } from "./section-convert";
export { analyzeSection, sectionShotField } from "./section-analysis";
export { isSectionAnalysis } from "./section-kind";
export { runSectionSweep, MAX_SECTION_SWEEP_CELLS } from "./section-sweep";
export type * from "./section-types";
export { modellerApi, type ModellerApi } from "./worker-api";

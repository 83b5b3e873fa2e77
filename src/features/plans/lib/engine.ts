/**
 * The engine's types and constants the plans feature uses, gathered in one place (the engine's
 * public surface is workers/engine/index.ts, imported as `@engine`).
 */
export type {
  ArrivalCurves,
  BranchVerdict,
  GeophoneArrivals,
  GroundModel,
  Material,
  ModelAnalysis,
  Plan,
  PlanAnalysis,
  RayPath,
  RefractorAnalysis,
  Segment,
  ShotArrivals,
  Spread,
  Status,
  SweepResult,
  SweepSpec,
} from "@engine";
export {
  CELL_INVALID,
  CELL_NOT_COMPUTED,
  MATERIALS,
  MATERIALS_SOURCE,
  STATUSES,
  followShots,
  statusFromCode,
  isLayeredModel,
  isSectionModel,
  layeredModel,
} from "@engine";

/**
 * The plans feature's door to the modeller. Every engine computation the designer shows goes
 * through here, so that it runs off the main thread (the worker facade) and so that tests
 * can substitute it.
 */
import {
  analyzePlan,
  computeArrivals,
  createSweepRunner,
  firstArrivalRayPath,
  geometryIssues,
  sampleCurves,
} from "@engine";
import type {
  ArrivalCurves,
  GroundModel,
  Plan,
  PlanAnalysis,
  RayPath,
  ShotArrivals,
  Spread,
  SweepResult,
  SweepSpec,
} from "./engine";

export interface SweepControl {
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
}

export interface ModellerClient {
  analyze(plan: Plan): Promise<PlanAnalysis>;
  arrivals(model: GroundModel, spread: Spread, shotIndex: number): Promise<ShotArrivals>;
  curves(
    model: GroundModel,
    shotPosition: number,
    fromOffset: number,
    toOffset: number,
    samples: number,
    options?: { reflections?: boolean },
  ): Promise<ArrivalCurves>;
  rayPath(model: GroundModel, shotPosition: number, geophonePosition: number): Promise<RayPath>;
  sweep(plan: Plan, spec: SweepSpec, control?: SweepControl): Promise<SweepResult>;
}

class GeometryError extends Error {
  constructor(issues: string[]) {
    super(issues.join("; "));
    this.name = "GeometryError";
  }
}

const pause = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

/** Runs the engine on this thread (used until the worker facade is available, and in tests). */
export const directModeller: ModellerClient = {
  async analyze(plan) {
    const issues = geometryIssues(plan);
    if (issues.length > 0) throw new GeometryError(issues);
    return analyzePlan(plan);
  },
  async arrivals(model, spread, shotIndex) {
    return computeArrivals(model, spread, shotIndex);
  },
  async curves(model, shotPosition, fromOffset, toOffset, samples, options) {
    return sampleCurves(model, shotPosition, fromOffset, toOffset, samples, options);
  },
  async rayPath(model, shotPosition, geophonePosition) {
    return firstArrivalRayPath(model, shotPosition, geophonePosition);
  },
  async sweep(plan, spec, control = {}) {
    const runner = createSweepRunner(plan, spec);
    while (!runner.step(4)) {
      control.onProgress?.(runner.progress);
      await pause();
      if (control.signal?.aborted) runner.cancel();
    }
    control.onProgress?.(1);
    return runner.result;
  },
};

let current: ModellerClient = directModeller;

/** The modeller the feature uses now. */
export const modeller = (): ModellerClient => current;

/** Replace the modeller (tests; the worker facade at start-up). Returns the previous one. */
export function setModeller(next: ModellerClient): ModellerClient {
  const previous = current;
  current = next;
  return previous;
}

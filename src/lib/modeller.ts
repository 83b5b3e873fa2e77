/**
 * Client facade of the modeller. Runs the engine in a Web Worker through comlink (one
 * worker for quick requests, a separate one for design sweeps so that cancelling a sweep
 * never disturbs an analysis), or directly on this thread where no Worker exists (jsdom
 * tests, old browsers).
 *
 * Stale results are discarded: a newer request of the same kind supersedes an older one,
 * whose promise then rejects with a ModellerCancelledError (reason "superseded"). A sweep
 * reports progress (fractions 0..1) and can be cancelled with an AbortSignal or
 * cancelSweep(); its promise then rejects with reason "cancelled".
 */
import * as Comlink from "comlink";
import type {
  AnalyzeOptions,
  ArrivalCurves,
  GroundModel,
  Plan,
  PlanAnalysis,
  RayPath,
  SectionModelAnalysis,
  SectionShotField,
  SectionSweepResult,
  SectionSweepSpec,
  ShotArrivals,
  Spread,
  SweepResult,
  SweepSpec,
} from "@engine";
import type { SectionReading } from "../../workers/field/section-reading";
import type { ModellerWorkerApi } from "../../workers/modeller.worker";

/** Why a modeller request ended without a result. */
export type CancelReason = "superseded" | "cancelled";

/** Rejection of a request that was superseded by a newer one or cancelled. */
export class ModellerCancelledError extends Error {
  constructor(readonly reason: CancelReason) {
    super(reason === "superseded" ? "superseded by a newer request" : "cancelled");
    this.name = "ModellerCancelledError";
  }
}

/** True for the rejection of a superseded or cancelled request (ignore it in the UI). */
export function isModellerCancelled(error: unknown): error is ModellerCancelledError {
  return error instanceof ModellerCancelledError;
}

/** Progress and cancellation of a sweep. */
export interface SweepControl {
  /** Fraction of rows done, 0..1. */
  onProgress?: (fraction: number) => void;
  /** Abort to cancel the sweep. */
  signal?: AbortSignal;
}

/** The modeller as the client sees it (all times s, distances m, velocities m/s). */
export interface Modeller {
  /** Full analysis of a validated plan (see parsePlan in the engine). */
  analyze(plan: Plan, options?: AnalyzeOptions): Promise<PlanAnalysis>;
  /**
   * Full analysis that no later request supersedes (several plans at once, e.g. the revisions
   * on the Review screen); it still rejects as cancelled when the modeller is disposed.
   */
  analyzeOne(plan: Plan): Promise<PlanAnalysis>;
  /** Arrivals of one shot (0-based index) at every geophone. */
  arrivals(model: GroundModel, spread: Spread, shotIndex: number): Promise<ShotArrivals>;
  /** Dense curves of one shot between signed offsets, for the Arrivals chart. */
  curves(
    model: GroundModel,
    shotPosition: number,
    fromOffset: number,
    toOffset: number,
    samples: number,
    options?: { reflections?: boolean },
  ): Promise<ArrivalCurves>;
  /** First-arrival ray path for the Section. */
  rayPath(model: GroundModel, shotPosition: number, geophonePosition: number): Promise<RayPath>;
  /** Design sweep; a new sweep supersedes a running one. */
  sweep(plan: Plan, spec: SweepSpec, control?: SweepControl): Promise<SweepResult>;
  /** Cancel the running sweep, if any. */
  cancelSweep(): void;
  /** Time field and first-arrival rays of one shot over a section model (the Section chart). */
  sectionField(plan: Plan, modelIndex: number, shot: number): Promise<SectionShotField>;
  /**
   * The crew's reading of a section model: plus-minus (and the GRM when asked) on its modelled
   * first arrivals, compared with the true interfaces under every geophone.
   */
  sectionReading(
    plan: Plan,
    modelIndex: number,
    options?: { grm?: boolean },
    /** The model's analysis already made (its arrivals are read; no second analysis). */
    analysis?: Pick<SectionModelAnalysis, "arrivals">,
  ): Promise<SectionReading>;
  /**
   * Section design sweep in its own worker; a new one supersedes (ends) a running one, and
   * an abort signal cancels it.
   */
  sectionSweep(
    plan: Plan,
    spec: SectionSweepSpec,
    control?: SweepControl,
  ): Promise<SectionSweepResult>;
  /** Stop the workers; pending requests reject as cancelled. */
  dispose(): void;
  /** Start the quick worker now (it loads while the page fetches its data); no-op without one. */
  warm(): void;
}

/** Something that behaves like a module Worker (real, or a test double). */
export interface WorkerLike extends Comlink.Endpoint {
  terminate(): void;
}

/** Options of createModeller. */
export interface ModellerOptions {
  /**
   * Creates a worker. Defaults to the real module worker when `Worker` exists; pass null to
   * force running on this thread.
   */
  createWorker?: (() => WorkerLike) | null;
  /** Rows computed between yields when running a sweep on this thread. Default 4. */
  rowsPerSlice?: number;
}

function defaultWorkerFactory(): (() => WorkerLike) | null {
  if (typeof Worker === "undefined") return null;
  return () =>
    new Worker(new URL("../../workers/modeller.worker.ts", import.meta.url), { type: "module" });
}

const nextTask = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

/**
 * The engine itself, for running on this thread where no Worker exists (tests, old browsers):
 * loaded on first use, so the engine is in the application's chunks only as a fallback.
 */
type Engine = typeof import("./engine-here");
let engine: Promise<Engine> | null = null;
const loadEngine = (): Promise<Engine> => (engine ??= import("./engine-here"));
// Without workers (jsdom) the engine will be needed: start loading it with this module.
if (typeof Worker === "undefined") void loadEngine();

/** Create a modeller facade. */
export function createModeller(options: ModellerOptions = {}): Modeller {
  const factory =
    options.createWorker === undefined ? defaultWorkerFactory() : options.createWorker;
  const rowsPerSlice = Math.max(1, options.rowsPerSlice ?? 4);
  let quick: { worker: WorkerLike; api: Comlink.Remote<ModellerWorkerApi> } | null = null;
  let sweeper: { worker: WorkerLike; api: Comlink.Remote<ModellerWorkerApi> } | null = null;
  const latest = new Map<string, number>();
  const pending = new Set<(reason: CancelReason) => void>();
  let sweepSeq = 0;
  let oneSeq = 0;
  let stopSweep: ((reason: CancelReason) => void) | null = null;

  const spawn = () => {
    const worker = (factory as () => WorkerLike)();
    return { worker, api: Comlink.wrap<ModellerWorkerApi>(worker) };
  };
  const quickApi = () => (quick ??= spawn()).api;

  /**
   * Run `work` as request `kind`, discarding its result if a newer one of the kind started.
   * `work` may ask `stale()` to skip a computation whose answer would be discarded anyway.
   */
  function latestOnly<T>(kind: string, work: (stale: () => boolean) => Promise<T>): Promise<T> {
    const seq = (latest.get(kind) ?? 0) + 1;
    latest.set(kind, seq);
    return new Promise<T>((resolve, reject) => {
      const cancel = (reason: CancelReason) => reject(new ModellerCancelledError(reason));
      pending.add(cancel);
      work(() => latest.get(kind) !== seq).then(
        (value) => {
          pending.delete(cancel);
          if (latest.get(kind) !== seq) cancel("superseded");
          else resolve(value);
        },
        (error: unknown) => {
          pending.delete(cancel);
          if (latest.get(kind) !== seq) cancel("superseded");
          else reject(error);
        },
      );
    });
  }

  // On this thread: yield a task first, so that of a burst of requests (typing) only the last
  // one is computed; the others end as superseded without costing the page any work.
  const local = async <T>(fn: (engine: Engine) => T, stale?: () => boolean): Promise<T> => {
    const loaded = await loadEngine();
    if (stale) {
      await nextTask();
      if (stale()) throw new ModellerCancelledError("superseded");
    }
    return fn(loaded);
  };

  async function sweepHere(
    plan: Plan,
    spec: SweepSpec,
    control: SweepControl,
    stopped: () => CancelReason | null,
  ): Promise<SweepResult> {
    const { createSweepRunner } = await loadEngine();
    const runner = createSweepRunner(plan, spec);
    for (;;) {
      const reason = stopped();
      if (reason) throw new ModellerCancelledError(reason);
      const done = runner.step(rowsPerSlice);
      control.onProgress?.(runner.progress);
      if (done) return runner.result;
      await nextTask();
    }
  }

  function sweep(plan: Plan, spec: SweepSpec, control: SweepControl = {}): Promise<SweepResult> {
    stopSweep?.("superseded");
    const seq = ++sweepSeq;
    let stoppedBy: CancelReason | null = null;
    return new Promise<SweepResult>((resolve, reject) => {
      const stop = (reason: CancelReason) => {
        if (stoppedBy) return;
        stoppedBy = reason;
        if (sweeper) {
          // a sweep in a worker cannot be interrupted: end the worker, a fresh one comes next time
          sweeper.worker.terminate();
          sweeper = null;
        }
        reject(new ModellerCancelledError(reason));
      };
      stopSweep = stop;
      const onAbort = () => stop("cancelled");
      if (control.signal?.aborted) {
        stop("cancelled");
        return;
      }
      control.signal?.addEventListener("abort", onAbort, { once: true });
      const finish = () => {
        control.signal?.removeEventListener("abort", onAbort);
        if (seq === sweepSeq) stopSweep = null;
      };
      let run: Promise<SweepResult>;
      if (factory) {
        sweeper ??= spawn();
        // The worker reports after every row; pass on at most one report per 40 ms (and the
        // last), so a fast grid does not re-render the page hundreds of times.
        let reported = -Infinity;
        const progress = control.onProgress
          ? Comlink.proxy((f: number) => {
              const now = performance.now();
              if (stoppedBy || (f < 1 && now - reported < 40)) return;
              reported = now;
              control.onProgress?.(f);
            })
          : undefined;
        run = sweeper.api.runSweep(plan, spec, progress) as Promise<SweepResult>;
      } else {
        run = sweepHere(plan, spec, control, () => stoppedBy);
      }
      run.then(
        (result) => {
          finish();
          if (!stoppedBy) resolve(result);
        },
        (error: unknown) => {
          finish();
          if (!stoppedBy) reject(error);
        },
      );
    });
  }

  let sectionSweeper: { worker: WorkerLike; api: Comlink.Remote<ModellerWorkerApi> } | null = null;
  let stopSectionSweep: ((reason: CancelReason) => void) | null = null;
  function sectionSweep(
    plan: Plan,
    spec: SectionSweepSpec,
    control: SweepControl = {},
  ): Promise<SectionSweepResult> {
    stopSectionSweep?.("superseded");
    return new Promise<SectionSweepResult>((resolve, reject) => {
      let stopped = false;
      const stop = (reason: CancelReason) => {
        if (stopped) return;
        stopped = true;
        // a worker cannot be interrupted: end it, a fresh one comes next time
        sectionSweeper?.worker.terminate();
        sectionSweeper = null;
        reject(new ModellerCancelledError(reason));
      };
      stopSectionSweep = stop;
      if (control.signal?.aborted) return stop("cancelled");
      control.signal?.addEventListener("abort", () => stop("cancelled"), { once: true });
      const progress = (f: number) => {
        if (!stopped) control.onProgress?.(f);
      };
      const run = factory
        ? ((sectionSweeper ??= spawn()).api.runSectionSweep(
            plan,
            spec,
            control.onProgress ? Comlink.proxy(progress) : undefined,
          ) as Promise<SectionSweepResult>)
        : local((e) => e.runSectionSweep(plan, spec, { onProgress: progress }));
      run.then(
        (result) => {
          if (stopSectionSweep === stop) stopSectionSweep = null;
          if (!stopped) resolve(result);
        },
        (error: unknown) => {
          if (stopSectionSweep === stop) stopSectionSweep = null;
          if (!stopped) reject(error);
        },
      );
    });
  }

  return {
    sectionField: (plan, modelIndex, shot) =>
      latestOnly("sectionField", () =>
        factory
          ? (quickApi().sectionShotField(plan, modelIndex, shot) as Promise<SectionShotField>)
          : local((e) => e.sectionShotField(plan, modelIndex, shot)),
      ),
    sectionReading: (plan, modelIndex, options, analysis) =>
      latestOnly("sectionReading", () =>
        factory
          ? (quickApi().sectionReading(
              plan,
              modelIndex,
              options,
              analysis && { arrivals: analysis.arrivals },
            ) as Promise<SectionReading>)
          : local((e) => e.readSectionOfPlan(plan, modelIndex, options, analysis)),
      ),
    sectionSweep,
    analyze: (plan, options) =>
      latestOnly("analyze", (stale) =>
        factory
          ? (quickApi().analyzePlan(plan, options) as Promise<PlanAnalysis>)
          : local((e) => e.analyzePlan(plan, options), stale),
      ),
    analyzeOne: (plan) =>
      latestOnly(`analyze-one:${++oneSeq}`, () =>
        factory
          ? (quickApi().analyzePlan(plan) as Promise<PlanAnalysis>)
          : local((e) => e.analyzePlan(plan)),
      ),
    arrivals: (model, spread, shotIndex) =>
      latestOnly("arrivals", (stale) =>
        factory
          ? (quickApi().computeArrivals(model, spread, shotIndex) as Promise<ShotArrivals>)
          : local((e) => e.computeArrivals(model, spread, shotIndex), stale),
      ),
    curves: (model, shotPosition, fromOffset, toOffset, samples, opts) =>
      latestOnly("curves", (stale) =>
        factory
          ? (quickApi().sampleCurves(
              model,
              shotPosition,
              fromOffset,
              toOffset,
              samples,
              opts,
            ) as Promise<ArrivalCurves>)
          : local(
              (e) => e.sampleCurves(model, shotPosition, fromOffset, toOffset, samples, opts),
              stale,
            ),
      ),
    rayPath: (model, shotPosition, geophonePosition) =>
      latestOnly("rayPath", (stale) =>
        factory
          ? (quickApi().firstArrivalRayPath(
              model,
              shotPosition,
              geophonePosition,
            ) as Promise<RayPath>)
          : local((e) => e.firstArrivalRayPath(model, shotPosition, geophonePosition), stale),
      ),
    sweep,
    warm: () => {
      if (factory) quickApi();
    },
    cancelSweep: () => stopSweep?.("cancelled"),
    dispose() {
      stopSweep?.("cancelled");
      for (const cancel of [...pending]) cancel("cancelled");
      pending.clear();
      for (const kind of latest.keys()) latest.set(kind, (latest.get(kind) ?? 0) + 1);
      quick?.worker.terminate();
      quick = null;
      sweeper?.worker.terminate();
      sweeper = null;
      stopSectionSweep?.("cancelled");
      sectionSweeper?.worker.terminate();
      sectionSweeper = null;
    },
  };
}

let shared: Modeller | null = null;

/** The application's shared modeller (created on first use). */
export function getModeller(): Modeller {
  return (shared ??= createModeller());
}

/**
 * Design sweep: a grid over geophone spacing (or channel count) × one model parameter (a
 * layer's thickness or velocity), giving the worst verdict and the interpreted depth error
 * per cell. Rows follow the parameter, columns the spread axis; cell (row i, column j) is at
 * index i · cols + j of the row-major typed arrays.
 *
 * Everything that does not depend on the spread (the model's lines or critical rays) is
 * computed once per row; per cell only the branch geometry, the geophone counts per segment
 * (closed form, no per-geophone loop) and the intercept-time depths are evaluated.
 */
import { z } from "zod";
import { layoutExtent, type Layout } from "./branches";
import { followShots } from "./follow-shots";
import { resolveShotPositions } from "./shot-anchors";
import {
  earthFromModel,
  findInterfaceProblem,
  interfaceDepth,
  withThickness,
  withVelocity,
  type Earth,
} from "./geometry";
import { linesFor, prepareEarth, type PreparedEarth } from "./head-waves";
import { interceptTimeDepths } from "./interpretation";
import type { Plan } from "./plan-schema";
import { countOnSegments, firstArrivalPieces } from "./segments";
import { CELL_INVALID, CELL_NOT_COMPUTED, STATUS_CODE } from "./statuses";
import { layoutOf } from "./validate";
import { spreadOfLine } from "./roll-along";
import {
  branchCodes,
  coverageOf,
  createJudgeScratch,
  judgedBranches,
  primaryBranch,
  worstCodes,
  type JudgeScratch,
} from "./verdicts";

/** Most cells a sweep may hold. */
export const MAX_SWEEP_CELLS = 250_000;

const steps = z
  .number()
  .int("steps must be a whole number")
  .min(1, "steps must be at least 1")
  .max(1000, "steps must be at most 1000");
const finite = (label: string) =>
  z
    .number({ error: `${label} must be a number` })
    .refine(Number.isFinite, `${label} must be finite`);

/** Schema of a sweep request (see SweepSpec). */
export const sweepSpecSchema = z
  .strictObject({
    modelIndex: z.number().int().min(0, "modelIndex must be ≥ 0"),
    axis: z.enum(["spacing", "channels"]),
    axisValues: z.array(finite("axis value")).min(1).max(1000).optional(),
    min: finite("axis min").optional(),
    max: finite("axis max").optional(),
    steps: steps.optional(),
    parameter: z.strictObject({
      layer: z.number().int().min(1, "parameter.layer is 1-based"),
      kind: z.enum(["thickness", "velocity"]),
      min: finite("parameter min").refine((v) => v > 0, "parameter min must be > 0"),
      max: finite("parameter max").refine((v) => v > 0, "parameter max must be > 0"),
      steps,
    }),
    shotLayout: z.enum(["follow", "fixed"]).optional(),
  })
  .refine(
    (s) =>
      s.axisValues !== undefined ||
      (s.min !== undefined && s.max !== undefined && s.steps !== undefined),
    {
      message: "give axisValues or min, max and steps",
      path: ["axisValues"],
    },
  );

/**
 * A sweep request. `axis` varies spacing (m) or channels; give its values as `axisValues`
 * or as `min`/`max`/`steps` (evenly spaced; channel counts are rounded). `parameter.layer` is
 * the 1-based layer whose thickness (m, not the half-space) or velocity (m/s) varies from
 * `min` to `max` in `steps`. `shotLayout` "follow" (default) moves anchored shots with
 * the spread exactly as the designer does (shot-anchors.ts: start, end or centre plus offset)
 * and keeps fixed shots where they are; "fixed" keeps every shot's position.
 *
 * A roll-along plan (`spread.rollAlong`): each cell analyses one spread, the line's first,
 * with the shots that spread records (anchored shots, and the fixed shots nearest its centre);
 * the sweep maps how a spread of the line resolves the model, not the whole line.
 */
export type SweepSpec = z.input<typeof sweepSpecSchema>;

/** A sweep grid (transferable typed arrays). */
export interface SweepResult {
  rows: number;
  cols: number;
  axis: { kind: "spacing" | "channels"; values: Float64Array };
  parameter: { layer: number; kind: "thickness" | "velocity"; values: Float64Array };
  /** Worst status code per cell: 0 resolved, 1 under-sampled, 2 blind, 3 inverted, 254 not computed, 255 invalid model. */
  status: Uint8Array;
  /**
   * Signed depth error (m, interpreted − true, positive = too deep) of the resolved refractor
   * with the largest error on the first shot's longest branch; NaN when nothing is
   * interpreted (direct wave under-sampled, no resolved refractor, invalid or not computed).
   */
  depthError: Float64Array;
  cancelled: boolean;
  completedRows: number;
}

/** Progress and cancellation hooks. */
export interface SweepHooks {
  /** Called after each row with the fraction done (0..1]. */
  onProgress?: (fraction: number) => void;
  /** Polled before each row; return true to stop (the result is marked cancelled). */
  shouldCancel?: () => boolean;
}

function linspace(min: number, max: number, n: number): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = n === 1 ? min : min + ((max - min) * i) / (n - 1);
  return out;
}

function issueText(error: z.ZodError): string {
  return error.issues.map((i) => `${i.path.join(".") || "spec"}: ${i.message}`).join("; ");
}

/** Shot positions for a new spread, following the rule of SweepSpec.shotLayout (follow-shots.ts). */
export { followShots };

/** A sweep that can be advanced a few rows at a time (for cooperative cancellation). */
export interface SweepRunner {
  readonly result: SweepResult;
  /** Fraction of rows done. */
  readonly progress: number;
  /** Compute up to `rows` more rows; returns true when finished. */
  step(rows?: number): boolean;
  /** Stop: mark the result cancelled. */
  cancel(): void;
}

/**
 * Prepare a sweep over a validated plan. Throws RangeError for a bad spec (naming the
 * field), an unknown model or layer, a thickness sweep of the half-space or too many cells.
 */
export function createSweepRunner(plan: Plan, specInput: SweepSpec): SweepRunner {
  const parsed = sweepSpecSchema.safeParse(specInput);
  if (!parsed.success) throw new RangeError(issueText(parsed.error));
  const spec = parsed.data;
  const model = plan.models[spec.modelIndex];
  if (!model) throw new RangeError(`modelIndex: no model ${spec.modelIndex}`);
  const base = earthFromModel(model);
  const layer = spec.parameter.layer - 1;
  if (layer >= base.layerCount)
    throw new RangeError(`parameter.layer: no layer ${spec.parameter.layer}`);
  if (spec.parameter.kind === "thickness" && layer === base.layerCount - 1) {
    throw new RangeError("parameter.layer: the last layer is a half-space and has no thickness");
  }
  const axisValues = spec.axisValues
    ? Float64Array.from(spec.axisValues)
    : linspace(spec.min as number, spec.max as number, spec.steps as number);
  for (let j = 0; j < axisValues.length; j++) {
    if (spec.axis === "channels") {
      axisValues[j] = Math.round(axisValues[j]);
      if (!(axisValues[j] >= 1 && axisValues[j] <= 100000))
        throw new RangeError("axis: channels must be ≥ 1");
    } else if (!(axisValues[j] > 0)) throw new RangeError("axis: spacing must be > 0");
  }
  const paramValues = linspace(spec.parameter.min, spec.parameter.max, spec.parameter.steps);
  const rows = paramValues.length;
  const cols = axisValues.length;
  if (rows * cols > MAX_SWEEP_CELLS)
    throw new RangeError(`a sweep holds at most ${MAX_SWEEP_CELLS} cells`);
  const result: SweepResult = {
    rows,
    cols,
    axis: { kind: spec.axis, values: axisValues },
    parameter: { layer: spec.parameter.layer, kind: spec.parameter.kind, values: paramValues },
    status: new Uint8Array(rows * cols).fill(CELL_NOT_COMPUTED),
    depthError: new Float64Array(rows * cols).fill(NaN),
    cancelled: false,
    completedRows: 0,
  };
  // A roll-along line: every cell analyses the line's first spread with the shots it records
  // (see SweepSpec); without roll-along this is the plan's spread.
  const spread = plan.spread.rollAlong ? spreadOfLine(plan.spread, 1) : plan.spread;
  const baseLayout = layoutOf(spread);
  const follow = spec.shotLayout !== "fixed";
  const layouts: Layout[] = [];
  for (let j = 0; j < cols; j++) {
    const spacing = spec.axis === "spacing" ? axisValues[j] : baseLayout.spacing;
    const channels = spec.axis === "channels" ? axisValues[j] : baseLayout.channels;
    layouts.push({
      spacing,
      channels,
      firstGeophone: baseLayout.firstGeophone,
      shots: follow
        ? resolveShotPositions(spread.shots, {
            spacing,
            channels,
            firstGeophone: baseLayout.firstGeophone,
          })
        : Float64Array.from(baseLayout.shots),
    });
  }
  const branchLists = layouts.map((l) => judgedBranches(l));
  const primaries = layouts.map((l) => primaryBranch(l));
  const extents = layouts.map((l) => layoutExtent(l));
  const n = base.layerCount;
  const cell = new CellScratch(n, plan.criteria.minGeophones);
  let row = 0;
  const runner: SweepRunner = {
    result,
    get progress() {
      return rows === 0 ? 1 : row / rows;
    },
    step(maxRows = 1) {
      for (let r = 0; r < maxRows && row < rows && !result.cancelled; r++, row++) {
        const value = paramValues[row];
        let earth: Earth;
        try {
          earth =
            spec.parameter.kind === "thickness"
              ? withThickness(base, layer, value)
              : withVelocity(base, layer, value);
        } catch {
          result.status.fill(CELL_INVALID, row * cols, (row + 1) * cols);
          continue;
        }
        const prep = prepareEarth(earth);
        for (let j = 0; j < cols; j++) {
          const idx = row * cols + j;
          if (earth.dipping && findInterfaceProblem(earth, extents[j].from, extents[j].to)) {
            result.status[idx] = CELL_INVALID;
            result.depthError[idx] = NaN;
            continue;
          }
          cell.evaluate(prep, layouts[j], branchLists[j], primaries[j]);
          result.status[idx] = cell.status;
          result.depthError[idx] = cell.depthError;
        }
        result.completedRows = row + 1;
      }
      return row >= rows || result.cancelled;
    },
    cancel() {
      result.cancelled = true;
    },
  };
  return runner;
}

class CellScratch {
  readonly judge: JudgeScratch;
  readonly primary: JudgeScratch;
  readonly worst: Uint8Array;
  readonly velocities: Float64Array;
  readonly intercepts: Float64Array;
  readonly thicknesses: Float64Array;
  readonly depths: Float64Array;
  readonly layers: Int32Array;
  status = 0;
  depthError = NaN;

  constructor(
    readonly layerCount: number,
    readonly minGeophones: number,
  ) {
    this.judge = createJudgeScratch(layerCount);
    this.primary = createJudgeScratch(layerCount);
    this.worst = new Uint8Array(layerCount);
    this.velocities = new Float64Array(layerCount);
    this.intercepts = new Float64Array(layerCount);
    this.thicknesses = new Float64Array(layerCount);
    this.depths = new Float64Array(layerCount + 1);
    this.layers = new Int32Array(layerCount);
  }

  evaluate(
    prep: PreparedEarth,
    layout: Layout,
    branches: ReturnType<typeof judgedBranches>,
    primary: ReturnType<typeof primaryBranch>,
  ): void {
    const n = this.layerCount;
    const worst = worstCodes(prep, layout, this.minGeophones, this.judge, this.worst, branches);
    let status = 0;
    for (let m = 0; m < n; m++) if (worst[m] > status) status = worst[m];
    this.status = status;
    // intercept-time interpretation on the first shot's longest branch
    const p = this.primary;
    const lines = linesFor(prep, primary.shot, primary.sign, p.lines);
    firstArrivalPieces(lines, n, p.pieces);
    countOnSegments(p.pieces, layout, primary, p.counts);
    branchCodes(
      prep,
      lines,
      p.pieces,
      p.counts,
      this.minGeophones,
      coverageOf(layout, primary),
      p.codes,
      p.judged,
    );
    this.depthError = NaN;
    if (p.codes[0] !== STATUS_CODE.resolved) return;
    this.velocities[0] = 1 / lines.slowness[0];
    let k = 0;
    for (let m = 1; m < n; m++) {
      if (p.codes[m] !== STATUS_CODE.resolved) continue;
      k++;
      this.velocities[k] = 1 / lines.slowness[m];
      this.intercepts[k] = lines.intercept[m];
      this.layers[k] = m;
    }
    if (k === 0) return;
    interceptTimeDepths(this.velocities, this.intercepts, k, this.thicknesses, this.depths);
    let worstError = NaN;
    for (let j = 1; j <= k; j++) {
      const e = this.depths[j] - interfaceDepth(prep.earth, this.layers[j], primary.shot);
      if (Number.isNaN(e)) continue;
      if (!(Math.abs(e) <= Math.abs(worstError))) worstError = e;
    }
    this.depthError = worstError;
  }
}

/**
 * Run a whole sweep synchronously, reporting progress after each row and polling
 * `shouldCancel` before each row. See createSweepRunner for errors.
 */
export function runSweep(plan: Plan, spec: SweepSpec, hooks: SweepHooks = {}): SweepResult {
  const runner = createSweepRunner(plan, spec);
  for (;;) {
    if (hooks.shouldCancel?.()) {
      runner.cancel();
      break;
    }
    const done = runner.step(1);
    hooks.onProgress?.(runner.progress);
    if (done) break;
  }
  return runner.result;
}

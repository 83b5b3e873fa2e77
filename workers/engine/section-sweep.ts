/**
 * Design sweep for a section model: geophone spacing × one section parameter (the
 * elevation of one point of a layer's base, or a layer's velocity). Each cell is a full
 * 2-D analysis, so sweeps are small (at most MAX_SECTION_SWEEP_CELLS cells). The spread
 * keeps its extent (first to last geophone; the channel count follows the spacing) and the
 * shots keep their positions; the cell size stays the one chosen for the plan as given, so
 * cells differ only by the swept values.
 */
import type { Plan, SectionModel } from "./plan-schema";
import { analyzeSection } from "./section-analysis";
import { sectionGeometry, surfaceAt } from "./section-geometry";
import { rasteriseSection } from "./section-grid";
import { sectionIssues } from "./section-schema";
import type { SectionSweepResult, SectionSweepSpec } from "./section-types";
import { CELL_INVALID, CELL_NOT_COMPUTED, STATUS_CODE } from "./statuses";
import type { SweepHooks } from "./sweep";
import { spreadOfLine } from "./roll-along";

/** Most cells a section sweep may hold (each is a full 2-D analysis). */
export const MAX_SECTION_SWEEP_CELLS = 400;

function checkSpec(plan: Plan, spec: SectionSweepSpec): SectionModel {
  const model = plan.models[spec.modelIndex];
  if (!model || model.kind !== "section") {
    throw new RangeError(`modelIndex: model ${spec.modelIndex} is not a section model`);
  }
  const { spacings, parameter } = spec;
  if (!Array.isArray(spacings) || spacings.length === 0 || !spacings.every((s) => s > 0)) {
    throw new RangeError("spacings: give at least one spacing > 0 m");
  }
  if (!Array.isArray(parameter.values) || parameter.values.length === 0) {
    throw new RangeError("parameter.values: give at least one value");
  }
  if (!parameter.values.every(Number.isFinite)) {
    throw new RangeError("parameter.values: every value must be a finite number");
  }
  if (spacings.length * parameter.values.length > MAX_SECTION_SWEEP_CELLS) {
    throw new RangeError(`a section sweep has at most ${MAX_SECTION_SWEEP_CELLS} cells`);
  }
  const layer = model.layers[parameter.layer - 1];
  if (!layer) throw new RangeError(`parameter.layer: no layer ${parameter.layer}`);
  if (parameter.kind === "elevation") {
    if (!layer.base) throw new RangeError("parameter.layer: the half-space has no base");
    if (!layer.base[parameter.point]) {
      throw new RangeError(`parameter.point: the base has no point ${parameter.point}`);
    }
  } else if (!parameter.values.every((v) => v > 0 && v <= 10000)) {
    throw new RangeError("parameter.values: velocities must be > 0 and at most 10000 m/s");
  }
  return model;
}

function varied(model: SectionModel, spec: SectionSweepSpec, value: number): SectionModel {
  const p = spec.parameter;
  return {
    ...model,
    layers: model.layers.map((l, k) => {
      if (k !== p.layer - 1) return l;
      if (p.kind === "velocity") return { ...l, velocity: value, velocityAt: undefined };
      const base = (l.base ?? []).map((pt, i) =>
        i === p.point ? ([pt[0], value] as [number, number]) : pt,
      );
      return { ...l, base };
    }),
  };
}

/**
 * Run a section sweep over a validated plan (see SectionSweepSpec). Rows follow the
 * parameter values, columns the spacings. Throws RangeError for a bad spec, naming the field.
 */
export function runSectionSweep(
  plan: Plan,
  spec: SectionSweepSpec,
  hooks: SweepHooks = {},
): SectionSweepResult {
  // A roll-along line: cells analyse its first spread with the shots it records (as runSweep).
  if (plan.spread.rollAlong) plan = { ...plan, spread: spreadOfLine(plan.spread, 1) };
  const base = checkSpec(plan, spec);
  const rows = spec.parameter.values.length;
  const cols = spec.spacings.length;
  const status = new Uint8Array(rows * cols).fill(CELL_NOT_COMPUTED);
  const depthError = new Float64Array(rows * cols).fill(NaN);
  const g = sectionGeometry(base);
  const shots = plan.spread.shots.map((s) => ({
    x: s.position,
    z: surfaceAt(g, s.position) - (s.depth ?? 0),
  }));
  const cellSize =
    base.cellSize ??
    rasteriseSection(g, {
      spacing: plan.spread.spacing,
      firstGeophone: plan.spread.firstGeophone,
      shots,
    }).h;
  const length = (plan.spread.channels - 1) * plan.spread.spacing;
  const result: SectionSweepResult = {
    rows,
    cols,
    axis: { kind: "spacing", values: Float64Array.from(spec.spacings) },
    parameter: {
      layer: spec.parameter.layer,
      kind: spec.parameter.kind,
      point: spec.parameter.kind === "elevation" ? spec.parameter.point : null,
      values: Float64Array.from(spec.parameter.values),
    },
    status,
    depthError,
    cancelled: false,
    completedRows: 0,
  };
  for (let i = 0; i < rows; i++) {
    if (hooks.shouldCancel?.()) {
      result.cancelled = true;
      break;
    }
    const model = { ...varied(base, spec, spec.parameter.values[i]), cellSize };
    const valid = sectionIssues(model).length === 0;
    for (let j = 0; j < cols; j++) {
      const idx = i * cols + j;
      if (!valid) {
        status[idx] = CELL_INVALID;
        continue;
      }
      const spacing = spec.spacings[j];
      const spread = {
        ...plan.spread,
        spacing,
        channels: Math.max(1, Math.floor(length / spacing + 1e-9) + 1),
      };
      const a = analyzeSection(model, spec.modelIndex, spread, plan.criteria);
      status[idx] = STATUS_CODE[a.worstStatus];
      depthError[idx] = a.section.interpretation.worst?.error ?? NaN;
    }
    result.completedRows = i + 1;
    hooks.onProgress?.((i + 1) / rows);
  }
  return result;
}

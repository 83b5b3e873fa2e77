/**
 * Design sweep helpers: the default ranges offered for a parameter, and the plan a clicked
 * cell stands for (the copy the user gets when applying a cell).
 */
import { resolveShotPositions } from "@engine";
import type { Plan, SweepResult, SweepSpec } from "./engine";

export type SweepParameterKind = "thickness" | "velocity";

/** Default parameter range: the layer's sweep bounds when set, else half to twice its value. */
export function defaultParameterRange(
  plan: Plan,
  modelIndex: number,
  layer: number,
  kind: SweepParameterKind,
): [number, number] {
  const l = plan.models[modelIndex]?.layers[layer - 1];
  if (!l) return [1, 2];
  if (kind === "thickness") {
    if (l.thicknessRange) return l.thicknessRange;
    const h = l.thickness ?? 1;
    return [h / 4, h * 2];
  }
  if (l.velocityRange) return l.velocityRange;
  return [l.velocity / 2, l.velocity * 2];
}

/** Default spread axis: a quarter to twice the plan's spacing, or a third to twice its channels. */
export function defaultAxisRange(plan: Plan, axis: "spacing" | "channels"): [number, number] {
  if (axis === "spacing") return [plan.spread.spacing / 4, plan.spread.spacing * 2];
  return [
    Math.max(2, Math.round(plan.spread.channels / 3)),
    Math.min(1024, plan.spread.channels * 2),
  ];
}

export function sweepSpec(input: {
  modelIndex: number;
  axis: "spacing" | "channels";
  axisRange: [number, number];
  axisSteps: number;
  layer: number;
  kind: SweepParameterKind;
  range: [number, number];
  steps: number;
}): SweepSpec {
  return {
    modelIndex: input.modelIndex,
    axis: input.axis,
    min: input.axisRange[0],
    max: input.axisRange[1],
    steps: input.axisSteps,
    parameter: {
      layer: input.layer,
      kind: input.kind,
      min: input.range[0],
      max: input.range[1],
      steps: input.steps,
    },
    shotLayout: "follow",
  };
}

/**
 * The plan at one cell of a sweep: the swept model's layer takes the row's value, the spread
 * takes the column's spacing or channel count, and anchored shots follow the spread as the
 * sweep assumed (fixed shots stay). Other models are kept unchanged.
 */
export function planAtCell(
  plan: Plan,
  modelIndex: number,
  result: SweepResult,
  row: number,
  col: number,
): Plan {
  const value = result.parameter.values[row];
  const axisValue = result.axis.values[col];
  const spacing = result.axis.kind === "spacing" ? axisValue : plan.spread.spacing;
  const channels = result.axis.kind === "channels" ? Math.round(axisValue) : plan.spread.channels;
  const shots = resolveShotPositions(plan.spread.shots, {
    spacing,
    channels,
    firstGeophone: plan.spread.firstGeophone,
  });
  const layerIndex = result.parameter.layer - 1;
  return {
    ...plan,
    models: plan.models.map((m, i) =>
      i !== modelIndex || m.kind === "section"
        ? m
        : {
            ...m,
            layers: m.layers.map((l, k) =>
              k !== layerIndex
                ? l
                : result.parameter.kind === "thickness"
                  ? { ...l, thickness: value }
                  : { ...l, velocity: value },
            ),
          },
    ),
    spread: {
      ...plan.spread,
      spacing,
      channels,
      shots: plan.spread.shots.map((s, i) => ({ ...s, position: Number(shots[i].toFixed(6)) })),
    },
  };
}

/**
 * The designer's form values and their conversion to and from the stored plan document.
 *
 * The form holds exactly what the user typed (strings, in the user's display units); the
 * plan document is SI. `planFormSchema(units)` parses form values into SI and then validates
 * them with the engine's own plan schema, so the rules live in one place and every error
 * lands on the field path the user typed into.
 */
import { z } from "zod";
import type { FieldErrors, Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { planSchema, type Plan } from "@engine";
import { formatInput, localiseMessage, parseInput, type UnitSystem } from "@/lib/units";

export interface LayerRow {
  name: string;
  material: string;
  velocity: string;
  thickness: string;
  dip: string;
  velocityRange: [string, string];
  thicknessRange: [string, string];
}

export interface ModelForm {
  name: string;
  layers: LayerRow[];
}

export interface ShotRow {
  position: string;
  label: string;
}

export interface PlanForm {
  models: ModelForm[];
  spread: {
    spacing: string;
    channels: string;
    firstGeophone: string;
    shots: ShotRow[];
  };
  criteria: {
    minGeophones: string;
    /** Pick error in ms (both unit systems). */
    pickError: string;
    depthTolerance: string;
  };
}

export const emptyLayer = (velocity = ""): LayerRow => ({
  name: "",
  material: "",
  velocity,
  thickness: "",
  dip: "",
  velocityRange: ["", ""],
  thicknessRange: ["", ""],
});

const pair = (
  kind: "length" | "velocity",
  range: [number, number] | undefined,
  units: UnitSystem,
): [string, string] =>
  range ? [formatInput(kind, range[0], units), formatInput(kind, range[1], units)] : ["", ""];

/** Stored plan (SI) → form values in the user's units. */
export function planToForm(plan: Plan, units: UnitSystem): PlanForm {
  return {
    models: plan.models.map((model) => ({
      name: model.name,
      layers: model.layers.map((layer, i, all) => ({
        name: layer.name ?? "",
        material: layer.material ?? "",
        velocity: formatInput("velocity", layer.velocity, units),
        thickness: i === all.length - 1 ? "" : formatInput("length", layer.thickness, units),
        dip:
          layer.dip === undefined || layer.dip === 0 ? "" : formatInput("angle", layer.dip, units),
        velocityRange: pair("velocity", layer.velocityRange, units),
        thicknessRange: pair("length", layer.thicknessRange, units),
      })),
    })),
    spread: {
      spacing: formatInput("length", plan.spread.spacing, units),
      channels: String(plan.spread.channels),
      firstGeophone: formatInput("length", plan.spread.firstGeophone, units),
      shots: plan.spread.shots.map((shot) => ({
        position: formatInput("length", shot.position, units),
        label: shot.label ?? "",
      })),
    },
    criteria: {
      minGeophones: String(plan.criteria.minGeophones),
      pickError: formatInput("time", plan.criteria.pickError, units),
      depthTolerance: formatInput("length", plan.criteria.depthTolerance, units),
    },
  };
}

/** Missing required numbers become NaN so the plan schema names the field ("… must be a number"). */
const required = (v: number | undefined) => (v === undefined ? Number.NaN : v);

const rangeOf = (
  kind: "length" | "velocity",
  [lo, hi]: [string, string],
  units: UnitSystem,
): [number, number] | undefined => {
  const a = parseInput(kind, lo, units);
  const b = parseInput(kind, hi, units);
  if (a === undefined && b === undefined) return undefined;
  return [required(a), required(b)];
};

const text = (v: string) => (v.trim() === "" ? undefined : v.trim());

/**
 * Form values → plan document input (SI), before validation. The last layer of each model is
 * the half-space: its thickness and dip boxes are ignored.
 */
export function formToPlanInput(form: PlanForm, units: UnitSystem, name: string): unknown {
  return {
    format: "spreadsight-plan/1",
    name,
    models: form.models.map((model) => ({
      name: model.name,
      layers: model.layers.map((row, i) => {
        const last = i === model.layers.length - 1;
        const layer: Record<string, unknown> = {
          velocity: required(parseInput("velocity", row.velocity, units)),
        };
        if (text(row.name)) layer.name = text(row.name);
        if (text(row.material)) layer.material = text(row.material);
        if (!last) {
          const thickness = parseInput("length", row.thickness, units);
          if (thickness !== undefined) layer.thickness = thickness;
          const dip = parseInput("angle", row.dip, units);
          if (dip !== undefined) layer.dip = dip;
          const thicknessRange = rangeOf("length", row.thicknessRange, units);
          if (thicknessRange) layer.thicknessRange = thicknessRange;
        }
        const velocityRange = rangeOf("velocity", row.velocityRange, units);
        if (velocityRange) layer.velocityRange = velocityRange;
        return layer;
      }),
    })),
    spread: {
      spacing: required(parseInput("length", form.spread.spacing, units)),
      channels: required(parseInput("count", form.spread.channels, units)),
      firstGeophone: required(parseInput("length", form.spread.firstGeophone, units)),
      shots: form.spread.shots.map((shot) => {
        const out: Record<string, unknown> = {
          position: required(parseInput("length", shot.position, units)),
        };
        if (text(shot.label)) out.label = text(shot.label);
        return out;
      }),
    },
    criteria: {
      minGeophones: required(parseInput("count", form.criteria.minGeophones, units)),
      pickError: required(parseInput("time", form.criteria.pickError, units)),
      depthTolerance: required(parseInput("length", form.criteria.depthTolerance, units)),
    },
  };
}

/** Form values (display units) → validated SI plan; errors sit on the typed field's path. */
export const planFormSchema = (units: UnitSystem, name: string) =>
  z
    .custom<PlanForm>((v) => typeof v === "object" && v !== null)
    .transform((form) => formToPlanInput(form, units, name))
    .pipe(planSchema);

/** Parse form values without react-hook-form (live analysis): the SI plan, or null when invalid. */
export function parsePlanForm(form: PlanForm, units: UnitSystem, name: string): Plan | null {
  const result = planFormSchema(units, name).safeParse(form);
  return result.success ? result.data : null;
}

function localiseErrors(errors: FieldErrors, units: UnitSystem): void {
  for (const value of Object.values(errors)) {
    if (!value || typeof value !== "object") continue;
    const node = value as { message?: unknown };
    if (typeof node.message === "string") node.message = localiseMessage(node.message, units);
    localiseErrors(value as FieldErrors, units);
  }
}

/** The react-hook-form resolver: zod through the engine's schema, SI limits restated in feet. */
export function planFormResolver(
  units: UnitSystem,
  name: string,
): Resolver<PlanForm, unknown, Plan> {
  const base = zodResolver(planFormSchema(units, name)) as unknown as Resolver<
    PlanForm,
    unknown,
    Plan
  >;
  return async (values, context, options) => {
    const result = await base(values, context, options);
    if (units === "imperial") localiseErrors(result.errors as FieldErrors, units);
    return result;
  };
}

/**
 * The designer's form values and their conversion to and from the stored plan document.
 *
 * The form holds exactly what the user typed (strings, in the user's display units); the
 * plan document is SI. `planFormSchema(units)` parses form values into SI and then validates
 * them with the engine's own plan schema, so the rules live in one place and every error
 * lands on the field path the user typed into.
 */
import { z } from "zod";
import type { Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { anchorPoint, planSchema, type Plan, type ShotAnchorPoint } from "@engine";
import {
  formatInput,
  localiseMessage,
  parseInput as parseTyped,
  type Quantity,
  type UnitSystem,
} from "@/lib/units";

export interface LayerRow {
  name: string;
  material: string;
  velocity: string;
  thickness: string;
  dip: string;
  velocityRange: [string, string];
  thicknessRange: [string, string];
}

/**
 * A section model as the designer edits it: SI numbers (m, m/s) straight from the section
 * editor's tables and chart, which parse what is typed themselves (see section-editor.tsx).
 */
export interface SectionDraft {
  surface: [number, number][];
  layers: Array<{
    name?: string;
    material?: string;
    velocity: number;
    velocityAt?: [number, number][];
    base?: [number, number][];
  }>;
  cellSize?: number;
  /**
   * Boreholes imported along the line (section-import.ts), kept with the model as evidence:
   * position and top in m, depths of the layer bases below the top in m (null: absent).
   */
  boreholes?: Array<{
    name: string;
    position: number;
    top?: number;
    depths: Array<number | null>;
  }>;
}

export interface ModelForm {
  name: string;
  /** Layered models' rows; empty for a section model. */
  layers: LayerRow[];
  /** Present for a section model (kind "section"). */
  section?: SectionDraft;
}

export interface ShotRow {
  position: string;
  label: string;
  /** Depth of a buried charge below the surface (section models), display units; "" = 0. */
  depth?: string;
  /**
   * Anchor to the spread (shot-anchors.ts); absent or "" = fixed at `position`. An anchored
   * row's box is `offset` (display units) and its position is worked out from the spread.
   */
  anchor?: "" | ShotAnchorPoint;
  /** Offset from the anchor point, display units (anchored rows only). */
  offset?: string;
  /** Source used at this shot (source-reach.ts); "" or absent = not stated. */
  source?: string;
}

export interface PlanForm {
  models: ModelForm[];
  spread: {
    spacing: string;
    channels: string;
    firstGeophone: string;
    /** Site noise for the sources' reach; "" or absent = not stated. */
    noise?: string;
    shots: ShotRow[];
    /** Roll-along (roll-along.ts) as typed; off or absent = one spread. */
    rollAlong?: RollAlongRow;
  };
  criteria: {
    minGeophones: string;
    /** Pick error in ms (both unit systems). */
    pickError: string;
    depthTolerance: string;
  };
}

/** The roll-along boxes: off keeps what was typed so switching it back on restores it. */
export interface RollAlongRow {
  on: boolean;
  /** Number of spreads along the line. */
  spreads: string;
  /** Geophone stations shared by neighbouring spreads. */
  overlap: string;
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
    models: plan.models.map((model) =>
      model.kind === "section"
        ? {
            name: model.name,
            layers: [],
            section: structuredClone({
              surface: model.surface,
              layers: model.layers,
              ...(model.cellSize !== undefined ? { cellSize: model.cellSize } : {}),
              ...(model.boreholes?.length ? { boreholes: model.boreholes } : {}),
            }) as SectionDraft,
          }
        : {
            name: model.name,
            layers: model.layers.map((layer, i, all) => ({
              name: layer.name ?? "",
              material: layer.material ?? "",
              velocity: formatInput("velocity", layer.velocity, units),
              thickness: i === all.length - 1 ? "" : formatInput("length", layer.thickness, units),
              dip:
                layer.dip === undefined || layer.dip === 0
                  ? ""
                  : formatInput("angle", layer.dip, units),
              velocityRange: pair("velocity", layer.velocityRange, units),
              thicknessRange: pair("length", layer.thicknessRange, units),
            })),
          },
    ),
    spread: {
      spacing: formatInput("length", plan.spread.spacing, units),
      channels: String(plan.spread.channels),
      firstGeophone: formatInput("length", plan.spread.firstGeophone, units),
      ...(plan.spread.noise ? { noise: plan.spread.noise } : {}),
      shots: plan.spread.shots.map((shot) => ({
        position: formatInput("length", shot.position, units),
        label: shot.label ?? "",
        ...(shot.depth ? { depth: formatInput("length", shot.depth, units) } : {}),
        ...(shot.anchor
          ? { anchor: shot.anchor.to, offset: formatInput("length", shot.anchor.offset, units) }
          : {}),
        ...(shot.source ? { source: shot.source } : {}),
      })),
      rollAlong: plan.spread.rollAlong
        ? {
            on: true,
            spreads: String(plan.spread.rollAlong.spreads),
            overlap: String(plan.spread.rollAlong.overlap),
          }
        : { on: false, spreads: "", overlap: "" },
    },
    criteria: {
      minGeophones: String(plan.criteria.minGeophones),
      pickError: formatInput("time", plan.criteria.pickError, units),
      depthTolerance: formatInput("length", plan.criteria.depthTolerance, units),
    },
  };
}

/**
 * The stored SI value behind each number the form shows, keyed by quantity and shown text, so
 * that a value the user did not change is saved exactly as it was stored (the box shows it
 * rounded to six significant digits).
 */
export type ExactValues = ReadonlyMap<string, number>;

const exactKey = (quantity: Quantity, text: string) => `${quantity}:${text.trim()}`;

export function exactValues(
  plan: Plan,
  units: UnitSystem,
  map: Map<string, number> = new Map(),
): Map<string, number> {
  const add = (quantity: Quantity, value: number | null | undefined) => {
    if (typeof value === "number" && Number.isFinite(value))
      map.set(exactKey(quantity, formatInput(quantity, value, units)), value);
  };
  for (const model of plan.models) {
    for (const layer of model.layers) {
      add("velocity", layer.velocity);
      add("length", layer.thickness);
      add("angle", layer.dip);
      layer.velocityRange?.forEach((v) => add("velocity", v));
      layer.thicknessRange?.forEach((v) => add("length", v));
    }
  }
  add("length", plan.spread.spacing);
  add("length", plan.spread.firstGeophone);
  plan.spread.shots.forEach((s) => {
    add("length", s.position);
    if (s.anchor) add("length", s.anchor.offset);
  });
  add("time", plan.criteria.pickError);
  add("length", plan.criteria.depthTolerance);
  return map;
}

const NO_EXACT: ExactValues = new Map();

/** Missing required numbers become NaN so the plan schema names the field ("… must be a number"). */
const required = (v: number | undefined) => (v === undefined ? Number.NaN : v);

const rangeOf = (
  parseInput: Parse,
  kind: "length" | "velocity",
  [lo, hi]: [string, string],
  units: UnitSystem,
): [number, number] | undefined => {
  const a = parseInput(kind, lo, units);
  const b = parseInput(kind, hi, units);
  if (a === undefined && b === undefined) return undefined;
  return [required(a), required(b)];
};

type Parse = typeof parseTyped;

const text = (v: string) => (v.trim() === "" ? undefined : v.trim());

/**
 * Form values → plan document input (SI), before validation. The last layer of each model is
 * the half-space: its thickness and dip boxes are ignored.
 */
export function formToPlanInput(
  form: PlanForm,
  units: UnitSystem,
  name: string,
  exact: ExactValues = NO_EXACT,
): unknown {
  const parseInput: Parse = (quantity, typed, system) =>
    exact.get(exactKey(quantity, typed ?? "")) ?? parseTyped(quantity, typed, system);
  const sections = form.models.some((m) => m.section);
  return {
    format: sections ? "spreadsight-plan/2" : "spreadsight-plan/1",
    name,
    models: form.models.map((model) =>
      model.section
        ? sectionInput(model.name, model.section)
        : {
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
                const thicknessRange = rangeOf(parseInput, "length", row.thicknessRange, units);
                if (thicknessRange) layer.thicknessRange = thicknessRange;
              }
              const velocityRange = rangeOf(parseInput, "velocity", row.velocityRange, units);
              if (velocityRange) layer.velocityRange = velocityRange;
              return layer;
            }),
          },
    ),
    spread: {
      spacing: required(parseInput("length", form.spread.spacing, units)),
      channels: required(parseInput("count", form.spread.channels, units)),
      firstGeophone: required(parseInput("length", form.spread.firstGeophone, units)),
      ...(form.spread.noise ? { noise: form.spread.noise } : {}),
      shots: form.spread.shots.map((shot) => {
        const out: Record<string, unknown> = {};
        if (shot.anchor) {
          // The schema puts an anchored shot at anchor point + offset (shot-anchors.ts); the
          // position written here is that same point when the spread's numbers parse.
          const offset = required(parseInput("length", shot.offset ?? "", units));
          const geometry = {
            spacing: parseInput("length", form.spread.spacing, units) ?? Number.NaN,
            channels: parseInput("count", form.spread.channels, units) ?? Number.NaN,
            firstGeophone: parseInput("length", form.spread.firstGeophone, units) ?? Number.NaN,
          };
          const at = anchorPoint(shot.anchor, geometry) + offset;
          out.position = Number.isFinite(at) ? at : 0;
          out.anchor = { to: shot.anchor, offset };
        } else {
          out.position = required(parseInput("length", shot.position, units));
        }
        if (text(shot.label)) out.label = text(shot.label);
        if (shot.source) out.source = shot.source;
        const depth = sections ? parseInput("length", shot.depth ?? "", units) : undefined;
        if (depth !== undefined && depth !== 0) out.depth = depth;
        return out;
      }),
      ...(form.spread.rollAlong?.on
        ? {
            rollAlong: {
              spreads: required(parseInput("count", form.spread.rollAlong.spreads, units)),
              overlap: required(parseInput("count", form.spread.rollAlong.overlap, units)),
            },
          }
        : {}),
    },
    criteria: {
      minGeophones: required(parseInput("count", form.criteria.minGeophones, units)),
      pickError: required(parseInput("time", form.criteria.pickError, units)),
      depthTolerance: required(parseInput("length", form.criteria.depthTolerance, units)),
    },
  };
}

/** A section draft → its plan model input; an emptied borehole list is left out. */
function sectionInput(name: string, section: SectionDraft): Record<string, unknown> {
  const { boreholes, ...rest } = structuredClone(section);
  return { kind: "section", name, ...rest, ...(boreholes?.length ? { boreholes } : {}) };
}

/** Form values (display units) → validated SI plan; errors sit on the typed field's path. */
export const planFormSchema = (units: UnitSystem, name: string, exact: ExactValues = NO_EXACT) =>
  z
    .custom<PlanForm>((v) => typeof v === "object" && v !== null)
    .transform((form) => formToPlanInput(form, units, name, exact))
    .pipe(planSchema);

/** Parse form values without react-hook-form (live analysis): the SI plan, or null when invalid. */
export function parsePlanForm(
  form: PlanForm,
  units: UnitSystem,
  name: string,
  exact: ExactValues = NO_EXACT,
): Plan | null {
  const result = planFormSchema(units, name, exact).safeParse(form);
  return result.success ? result.data : null;
}

/**
 * Restate each error for the boxes: SI limits in the box's units, and an empty box that must
 * hold a number says so ("velocity is required") rather than "velocity must be a number".
 * `values` is the form subtree at the same path as `errors`.
 */
function localiseErrors(errors: unknown, units: UnitSystem, values: unknown): void {
  if (!errors || typeof errors !== "object") return;
  for (const [key, value] of Object.entries(errors)) {
    // `ref` points at the DOM element: never walk into it.
    if (key === "ref" || !value || typeof value !== "object") continue;
    const typed =
      values && typeof values === "object" ? (values as Record<string, unknown>)[key] : undefined;
    const node = value as { message?: unknown };
    if (typeof node.message === "string") {
      const missing = /^(.+) must be a number$/.exec(node.message);
      node.message =
        missing && typeof typed === "string" && typed.trim() === ""
          ? `${missing[1]} is required`
          : localiseMessage(node.message, units);
    }
    localiseErrors(value, units, typed);
  }
}

/** The react-hook-form resolver: zod through the engine's schema, SI limits restated in the units of the boxes (feet, ms). */
export function planFormResolver(
  units: UnitSystem,
  name: string,
  exact: ExactValues = NO_EXACT,
): Resolver<PlanForm, unknown, Plan> {
  const base = zodResolver(planFormSchema(units, name, exact)) as unknown as Resolver<
    PlanForm,
    unknown,
    Plan
  >;
  return async (values, context, options) => {
    const result = await base(values, context, options);
    localiseErrors(result.errors, units, values);
    return result;
  };
}

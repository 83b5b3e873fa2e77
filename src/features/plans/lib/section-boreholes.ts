/**
 * Boreholes stored with a section model (plan field `boreholes`, section-schema.ts), as pure
 * functions: where a log stands in elevation, and where a logged base and the model's
 * interface at the borehole disagree by more than a tolerance.
 *
 * Boreholes are evidence for the interfaces, never an input to the analysis.
 */
import { formatQuantity, type UnitSystem } from "@/lib/units";
import type { SectionDraft } from "./plan-form";
import { layerName, lineAt } from "./section-view";

/** A borehole as the section stores it: position and top in m, depths below the top in m. */
export type StoredBorehole = NonNullable<SectionDraft["boreholes"]>[number];

/** Elevation of a borehole's top, m: its own `top`, else the model's surface where it stands. */
export function boreholeTop(surface: readonly [number, number][], b: StoredBorehole): number {
  return b.top ?? lineAt(surface, b.position);
}

/** Deepest logged depth below the top, m (0 when nothing is logged). */
export function deepestDepth(b: { depths: ReadonlyArray<number | null> }): number {
  return Math.max(0, ...b.depths.filter((d): d is number => d !== null));
}

/**
 * The allowed gap between a logged base and the model's interface, m: 0.5 m or 10 % of the
 * logged depth, whichever is larger. Our choice, in line with common practice for reading
 * refraction interfaces against logs (a few decimetres of logging and levelling error, and
 * an interface that is only known to about a tenth of its depth).
 */
export function mismatchTolerance(depth: number): number {
  return Math.max(0.5, 0.1 * depth);
}

/** A logged base that disagrees with the model's interface at the borehole. */
export interface BoreholeMismatch {
  borehole: string;
  /** Index of the layer whose base was logged (0 = layer 1). */
  layer: number;
  /** Elevation of the base as logged (top − depth), m. */
  logged: number;
  /** Elevation of the model's base at the borehole, m. */
  model: number;
  /** Allowed gap, m (mismatchTolerance of the logged depth). */
  tolerance: number;
}

/**
 * Every logged base that lies farther than the tolerance from the model's base of the same
 * layer at the borehole. Bases the model does not have (more logged than its layers, or the
 * half-space) and absent layers (null depths) are not compared.
 */
export function boreholeMismatches(
  section: Pick<SectionDraft, "surface" | "layers" | "boreholes">,
): BoreholeMismatch[] {
  const out: BoreholeMismatch[] = [];
  if (section.surface.length < 2) return out;
  for (const b of section.boreholes ?? []) {
    const top = boreholeTop(section.surface, b);
    b.depths.forEach((depth, k) => {
      const base = section.layers[k]?.base;
      if (depth === null || !base || base.length < 2 || k >= section.layers.length - 1) return;
      const logged = top - depth;
      const model = lineAt(base, b.position);
      const tolerance = mismatchTolerance(depth);
      if (Math.abs(logged - model) > tolerance)
        out.push({ borehole: b.name, layer: k, logged, model, tolerance });
    });
  }
  return out;
}

/**
 * One line for the editor, e.g. "BH2: top of mudstone logged at 94.1 m, model has 92.8 m
 * (1.3 m apart, more than 0.5 m)". The base of layer k is the top of layer k + 1.
 */
export function mismatchNote(
  m: BoreholeMismatch,
  section: Pick<SectionDraft, "layers">,
  units: UnitSystem,
): string {
  const below = layerName(section as SectionDraft, m.layer + 1);
  const f = (v: number) => formatQuantity("length", v, units, 1);
  return `${m.borehole}: top of ${below} logged at ${f(m.logged)}, model has ${f(m.model)} (${f(Math.abs(m.logged - m.model))} apart, more than ${f(m.tolerance)})`;
}

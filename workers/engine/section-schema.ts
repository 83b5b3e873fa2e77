/**
 * The schema of a *section* ground model: a 2-D description of the ground along the survey
 * line (surface and interface polylines, a velocity per layer, optionally varying along the
 * line). It sits beside the layered model in a plan's `models` (plan-schema.ts) and is told
 * apart by `kind: "section"`.
 *
 * Units: positions and elevations in metres (elevation grows upwards), velocities in m/s.
 * A polyline is a list of `[position, elevation]` points with non-decreasing positions (two
 * points may share a position: a vertical step, e.g. a fault scarp). Between points the line
 * is straight; a base is evaluated only over the surface's range, which it must cover.
 */
import { z } from "zod";

const MAX_POINTS = 500;

const finite = (label: string) =>
  z.number({ error: `${label} must be a number` }).refine(Number.isFinite, {
    message: `${label} must be a finite number`,
  });

const positive = (label: string) => finite(label).refine((v) => v > 0, `${label} must be > 0`);

/** One `[position m, elevation m]` point. */
export const sectionPointSchema = z.tuple([finite("position"), finite("elevation")], {
  error: "a point is [position, elevation] in metres",
});

/** One `[position m, velocity m/s]` point of a lateral velocity law. */
export const velocityPointSchema = z.tuple(
  [
    finite("position"),
    positive("velocity").refine((v) => v <= 10000, "velocity must be at most 10000 m/s"),
  ],
  { error: "a point is [position m, velocity m/s]" },
);

const polyline = (label: string) =>
  z
    .array(sectionPointSchema, { error: `${label} must be a list of [position, elevation] points` })
    .min(2, `${label} needs at least two points`)
    .max(MAX_POINTS, `${label} has at most ${MAX_POINTS} points`);

/** One layer of a section, from the surface down; the last one is a half-space (no base). */
export const sectionLayerSchema = z.strictObject({
  /** Free label, e.g. "silty clay". */
  name: z.string().trim().max(80).optional(),
  /** Optional material key from the velocity table. */
  material: z.string().trim().max(40).optional(),
  /** P-wave velocity, m/s (the layer's velocity everywhere unless `velocityAt` is given). */
  velocity: positive("velocity").refine((v) => v <= 10000, "velocity must be at most 10000 m/s"),
  /**
   * Optional lateral velocity law `[[position m, velocity m/s], …]`, positions increasing,
   * linear between points and constant beyond the ends. Replaces `velocity` along the line.
   */
  velocityAt: z
    .array(velocityPointSchema, { error: "velocityAt must be a list of [position, velocity]" })
    .min(1, "velocityAt needs at least one point")
    .max(MAX_POINTS, `velocityAt has at most ${MAX_POINTS} points`)
    .optional(),
  /** Base of the layer as a polyline of `[position m, elevation m]`; omitted for the last layer. */
  base: polyline("base").optional(),
});

/** At most this many boreholes on a section, and this many logged bases per borehole. */
export const MAX_BOREHOLES = 50;
export const MAX_BOREHOLE_DEPTHS = 40;

/**
 * A borehole stored with a section model: evidence the interfaces were drawn from, never an
 * input to the analysis. The same shape as a borehole file's row (section-import.ts).
 */
export interface SectionBorehole {
  /** Free label, e.g. "BH2". */
  name: string;
  /** Position along the line, m. */
  position: number;
  /** Elevation of the borehole's top, m; omitted: the model's surface at `position`. */
  top?: number;
  /**
   * Depth below the top of the base of layer 1, 2, … as logged, m; `null` where the layer is
   * absent (it pinches out onto the one above) or the log does not say.
   */
  depths: Array<number | null>;
}

const isFiniteNumber = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v);

/**
 * Field checks of the stored boreholes, each message naming the borehole (e.g. `borehole
 * "BH2" position must be a finite number`). Written by hand rather than as a zod object so
 * the messages can say which borehole, which a per-field zod message cannot know.
 */
function boreholeFieldIssues(boreholes: readonly unknown[]): SectionIssue[] {
  const issues: SectionIssue[] = [];
  boreholes.forEach((raw, i) => {
    if (!raw || typeof raw !== "object" || Array.isArray(raw)) {
      issues.push({
        path: [i],
        message: `borehole ${i + 1} must be an object with name, position and depths`,
      });
      return;
    }
    const b = raw as Record<string, unknown>;
    const nameOk = typeof b.name === "string" && b.name.trim() !== "" && b.name.length <= 80;
    const label = nameOk ? `borehole "${(b.name as string).trim()}"` : `borehole ${i + 1}`;
    if (!nameOk) {
      issues.push({
        path: [i, "name"],
        message: `${label} needs a name (1 to 80 characters)`,
      });
    }
    for (const key of Object.keys(b)) {
      if (!["name", "position", "top", "depths"].includes(key))
        issues.push({ path: [i, key], message: `${label}: unknown field "${key}"` });
    }
    if (!isFiniteNumber(b.position))
      issues.push({ path: [i, "position"], message: `${label} position must be a finite number` });
    if (b.top !== undefined && !isFiniteNumber(b.top))
      issues.push({
        path: [i, "top"],
        message: `${label} top elevation must be a finite number (or left out: the surface there)`,
      });
    if (!Array.isArray(b.depths)) {
      issues.push({ path: [i, "depths"], message: `${label} depths must be a list of depths` });
      return;
    }
    if (b.depths.length > MAX_BOREHOLE_DEPTHS) {
      issues.push({
        path: [i, "depths"],
        message: `${label} logs at most ${MAX_BOREHOLE_DEPTHS} bases (it has ${b.depths.length})`,
      });
      return;
    }
    let previous = 0;
    b.depths.forEach((d, k) => {
      if (d === null) return;
      if (!isFiniteNumber(d)) {
        issues.push({
          path: [i, "depths", k],
          message: `${label} depth ${k + 1} must be a finite number or null (layer absent)`,
        });
        return;
      }
      if (d < 0) {
        issues.push({
          path: [i, "depths", k],
          message: `${label} depth ${k + 1} must not be negative`,
        });
      } else if (d < previous) {
        issues.push({
          path: [i, "depths", k],
          message: `${label} depth ${k + 1} (${fmt(d)} m) is above the base of the layer over it (${fmt(previous)} m)`,
        });
      }
      previous = Math.max(previous, d);
    });
    if (b.depths.every((d) => d === null))
      issues.push({ path: [i, "depths"], message: `${label} logs no depths` });
  });
  return issues;
}

/** The stored boreholes of a section: a list checked borehole by borehole (see above). */
export const sectionBoreholesSchema = z
  .array(
    z.custom<SectionBorehole>(() => true),
    {
      error: "boreholes must be a list of boreholes",
    },
  )
  .max(MAX_BOREHOLES, `a section has at most ${MAX_BOREHOLES} boreholes`)
  .superRefine((boreholes, ctx) => {
    for (const issue of boreholeFieldIssues(boreholes))
      ctx.addIssue({ code: "custom", path: issue.path, message: issue.message });
  });

/** Exported for the plan schema: the part of a section model zod checks field by field. */
export const sectionModelShape = {
  kind: z.literal("section"),
  name: z.string().trim().min(1, "model name is required").max(80),
  /** Ground surface as a polyline of `[position m, elevation m]`. */
  surface: polyline("surface"),
  /** Layers from the surface down; the last is a half-space. */
  layers: z.array(sectionLayerSchema).min(1, "a model needs at least one layer").max(12),
  /**
   * Optional grid cell size, m (0.02–10). Omitted: chosen from the geometry (thinnest layer,
   * geophone spacing); the analysis reports the size used.
   */
  cellSize: positive("cell size")
    .refine((v) => v >= 0.02 && v <= 10, "cell size must be between 0.02 and 10 m")
    .optional(),
  /**
   * Optional boreholes along the line (name, position, optional top elevation, logged depths
   * of the layer bases): stored as evidence for the interfaces, no effect on the analysis.
   */
  boreholes: sectionBoreholesSchema.optional(),
};

type Point = readonly [number, number];

const fmt = (x: number): string => {
  const r = Number(x.toFixed(2));
  return String(Object.is(r, -0) ? 0 : r);
};

/** Elevation of a polyline at a position within its range (the lower side of a vertical step). */
export function polylineAt(points: readonly Point[], x: number): number {
  const n = points.length;
  if (x <= points[0][0]) return points[0][1];
  if (x >= points[n - 1][0]) return points[n - 1][1];
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (points[mid][0] <= x) lo = mid;
    else hi = mid;
  }
  const [x0, z0] = points[lo];
  const [x1, z1] = points[hi];
  if (x1 === x0) return Math.min(z0, z1);
  return z0 + ((z1 - z0) * (x - x0)) / (x1 - x0);
}

/** A problem found in a section model: the path below the model and a message. */
export interface SectionIssue {
  path: (string | number)[];
  message: string;
}

function orderIssues(points: readonly Point[], path: (string | number)[]): SectionIssue[] {
  for (let i = 1; i < points.length; i++) {
    if (points[i][0] < points[i - 1][0]) {
      return [
        {
          path: [...path, i],
          message: `positions must increase along the line (${fmt(points[i][0])} m follows ${fmt(points[i - 1][0])} m)`,
        },
      ];
    }
    if (i >= 2 && points[i][0] === points[i - 2][0]) {
      return [
        {
          path: [...path, i],
          message: `at most two points may share a position (${fmt(points[i][0])} m)`,
        },
      ];
    }
  }
  return [];
}

/**
 * The first point where polyline `lower` rises above polyline `upper` (by more than 1 mm)
 * over [from, to]: checked at every vertex of both lines, which is enough for straight
 * pieces. Returns the index of the `lower` point at or just before the place, and where.
 */
function firstRise(
  lower: readonly Point[],
  upper: readonly Point[],
  from: number,
  to: number,
): { index: number; at: number; by: number } | null {
  const xs = [...lower.map((p) => p[0]), ...upper.map((p) => p[0])]
    .filter((x) => x >= from && x <= to)
    .sort((a, b) => a - b);
  for (const x of xs) {
    // both sides of a vertical step
    for (const side of [-1e-9, 0, 1e-9]) {
      const xx = Math.min(to, Math.max(from, x + side));
      const by = polylineAt(lower, xx) - polylineAt(upper, xx);
      if (by > 1e-3) {
        let index = 0;
        while (index + 1 < lower.length && lower[index + 1][0] <= x) index++;
        if (
          index + 1 < lower.length &&
          lower[index][0] !== x &&
          lower[index + 1][0] - x < x - lower[index][0]
        )
          index++;
        return { index, at: x, by };
      }
    }
  }
  return null;
}

/**
 * Geometric checks of a section model that passed the field checks: polylines in order,
 * bases covering the surface's range, no base above the surface or above the base of the
 * layer over it (touching is a pinch-out and is allowed), a base on every layer but the
 * last. Paths are relative to the model, e.g. `["layers", 1, "base", 3]`.
 */
export function sectionIssues(model: {
  surface: readonly Point[];
  layers: readonly { base?: readonly Point[]; velocityAt?: readonly Point[] }[];
  boreholes?: readonly { name?: unknown; position?: unknown }[];
}): SectionIssue[] {
  const issues: SectionIssue[] = [];
  const surface = model.surface;
  // the field checks report short or non-numeric polylines; judge only well-formed ones
  const wellFormed = (line: readonly Point[] | undefined) =>
    !!line &&
    line.length >= 2 &&
    line.every((p) => Array.isArray(p) && Number.isFinite(p[0]) && Number.isFinite(p[1]));
  if (!wellFormed(surface) || !Array.isArray(model.layers)) return issues;
  issues.push(...orderIssues(surface, ["surface"]));
  const from = surface[0][0];
  const to = surface[surface.length - 1][0];
  if (issues.length === 0 && !(to > from)) {
    issues.push({ path: ["surface"], message: "the surface must span more than one position" });
  }
  if (issues.length === 0 && Array.isArray(model.boreholes)) {
    model.boreholes.forEach((b, i) => {
      const x = b?.position;
      if (!isFiniteNumber(x) || (x >= from && x <= to)) return;
      const label = typeof b.name === "string" && b.name.trim() ? `"${b.name.trim()}"` : i + 1;
      issues.push({
        path: ["boreholes", i, "position"],
        message: `borehole ${label} at ${fmt(x)} m stands beyond the section's surface (${fmt(from)} to ${fmt(to)} m)`,
      });
    });
  }
  const n = model.layers.length;
  let above: readonly Point[] | null = issues.length === 0 ? surface : null;
  let aboveLabel = "the surface";
  model.layers.forEach((layer, i) => {
    const last = i === n - 1;
    if (layer.velocityAt && wellFormed(layer.velocityAt)) {
      const v = layer.velocityAt;
      for (let k = 1; k < v.length; k++) {
        if (!(v[k][0] > v[k - 1][0])) {
          issues.push({
            path: ["layers", i, "velocityAt", k],
            message: `positions must increase along the line (${fmt(v[k][0])} m follows ${fmt(v[k - 1][0])} m)`,
          });
          break;
        }
      }
    }
    if (last) {
      if (layer.base) {
        issues.push({
          path: ["layers", i, "base"],
          message: "the last layer is a half-space and has no base",
        });
      }
      return;
    }
    const base = layer.base;
    if (base && !wellFormed(base)) {
      above = null;
      return;
    }
    if (!base) {
      issues.push({
        path: ["layers", i, "base"],
        message: `layer ${i + 1} needs a base (only the last layer is a half-space)`,
      });
      above = null;
      return;
    }
    const order = orderIssues(base, ["layers", i, "base"]);
    if (order.length > 0) {
      issues.push(...order);
      above = null;
      return;
    }
    if (base[0][0] > from || base[base.length - 1][0] < to) {
      issues.push({
        path: ["layers", i, "base"],
        message: `the base must cover the surface from ${fmt(from)} to ${fmt(to)} m (it covers ${fmt(base[0][0])} to ${fmt(base[base.length - 1][0])} m)`,
      });
      above = null;
      return;
    }
    if (above) {
      const top = firstRise(base, surface, from, to);
      const rise = top ? null : firstRise(base, above, from, to);
      if (top) {
        issues.push({
          path: ["layers", i, "base", top.index],
          message: `base rises above the surface at ${fmt(top.at)} m`,
        });
      } else if (rise) {
        issues.push({
          path: ["layers", i, "base", rise.index],
          message: `base crosses ${aboveLabel} at ${fmt(rise.at)} m (${fmt(rise.by)} m above it)`,
        });
      }
    }
    above = base;
    aboveLabel = `the base of layer ${i + 1}`;
  });
  return issues;
}

/**
 * A section model in numeric form: the surface, the base of every layer but the last and
 * the velocity law of every layer as typed arrays, with lookups by position (m) and
 * elevation (m, up). Layers are 0-based here (1-based in every output).
 */
import { layoutExtent } from "./branches";
import type { SectionModel, Spread } from "./plan-schema";
import { layoutOf } from "./validate";

/** A polyline as typed arrays: non-decreasing positions xs (m) and values ys. */
export interface Polyline {
  readonly xs: Float64Array;
  readonly ys: Float64Array;
}

/** Numeric section. Never mutated after creation. */
export interface SectionGeometry {
  readonly layerCount: number;
  /** Range of the surface, m. */
  readonly from: number;
  readonly to: number;
  readonly surface: Polyline;
  /** Base of layer k (k = 0..n−2), elevation m. */
  readonly bases: readonly Polyline[];
  /** Velocity law of layer k, m/s (a single point: constant). */
  readonly velocities: readonly Polyline[];
  /** Smallest and largest velocity of each layer anywhere along the line, m/s. */
  readonly minVelocity: Float64Array;
  readonly maxVelocity: Float64Array;
}

function polyline(points: readonly (readonly [number, number])[]): Polyline {
  const xs = new Float64Array(points.length);
  const ys = new Float64Array(points.length);
  points.forEach(([x, y], i) => {
    if (!(Number.isFinite(x) && Number.isFinite(y))) {
      throw new RangeError(`point ${i}: position and value must be finite numbers`);
    }
    if (i > 0 && x < points[i - 1][0]) throw new RangeError(`point ${i}: positions must increase`);
    xs[i] = x;
    ys[i] = y;
  });
  if (points.length === 0) throw new RangeError("a polyline needs at least one point");
  return { xs, ys };
}

/**
 * Value of a polyline at x: linear between points, constant beyond the ends; at a vertical
 * step (two points at one position) the lower value.
 */
export function valueAt(line: Polyline, x: number): number {
  const { xs, ys } = line;
  const n = xs.length;
  if (x <= xs[0]) return n > 1 && xs[1] === xs[0] ? Math.min(ys[0], ys[1]) : ys[0];
  if (x >= xs[n - 1]) {
    return n > 1 && xs[n - 2] === xs[n - 1] ? Math.min(ys[n - 1], ys[n - 2]) : ys[n - 1];
  }
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (xs[mid] <= x) lo = mid;
    else hi = mid;
  }
  const x0 = xs[lo];
  const x1 = xs[hi];
  if (x1 === x0) return Math.min(ys[lo], ys[hi]);
  if (x === x0 && lo > 0 && xs[lo - 1] === x0) return Math.min(ys[lo - 1], ys[lo]);
  return ys[lo] + ((ys[hi] - ys[lo]) * (x - x0)) / (x1 - x0);
}

/** Build the numeric section from a schema-valid model. Throws RangeError on bad numbers. */
export function sectionGeometry(model: SectionModel): SectionGeometry {
  const n = model.layers.length;
  if (n < 1) throw new RangeError("a section needs at least one layer");
  if (model.surface.length < 2) throw new RangeError("the surface needs at least two points");
  const surface = polyline(model.surface);
  const bases: Polyline[] = [];
  const velocities: Polyline[] = [];
  const minVelocity = new Float64Array(n);
  const maxVelocity = new Float64Array(n);
  model.layers.forEach((layer, k) => {
    if (k < n - 1) {
      if (!layer.base || layer.base.length < 2) {
        throw new RangeError(`layer ${k + 1}: a base needs at least two points`);
      }
      bases.push(polyline(layer.base));
    }
    const law = polyline(layer.velocityAt ?? [[0, layer.velocity]]);
    for (const v of law.ys) {
      if (!(v > 0)) throw new RangeError(`layer ${k + 1}: velocity must be > 0`);
    }
    velocities.push(law);
    minVelocity[k] = Math.min(...law.ys);
    maxVelocity[k] = Math.max(...law.ys);
  });
  return {
    layerCount: n,
    from: surface.xs[0],
    to: surface.xs[surface.xs.length - 1],
    surface,
    bases,
    velocities,
    minVelocity,
    maxVelocity,
  };
}

/** Elevation of the surface at x, m. */
export function surfaceAt(g: SectionGeometry, x: number): number {
  return valueAt(g.surface, x);
}

/** Elevation of the top of layer k at x, m (k = 0: the surface), never above the layer over it. */
export function topAt(g: SectionGeometry, k: number, x: number): number {
  let z = valueAt(g.surface, x);
  for (let j = 0; j < k; j++) z = Math.min(z, valueAt(g.bases[j], x));
  return z;
}

/** Velocity of layer k at x, m/s. */
export function velocityAt(g: SectionGeometry, k: number, x: number): number {
  return valueAt(g.velocities[k], x);
}

/** Layer (0-based) at a point; −1 above the surface. Points on an interface belong below it. */
export function layerAt(g: SectionGeometry, x: number, z: number): number {
  let top = valueAt(g.surface, x);
  if (z > top) return -1;
  for (let k = 0; k < g.layerCount - 1; k++) {
    const base = Math.min(top, valueAt(g.bases[k], x));
    if (z > base) return k;
    top = base;
  }
  return g.layerCount - 1;
}

const fmt = (x: number): string => {
  const r = Number(x.toFixed(2));
  return String(Object.is(r, -0) ? 0 : r);
};

/**
 * Problems of a schema-valid section model with the plan's spread, one line each naming
 * the field: the surface must cover every geophone and shot.
 */
export function sectionSpreadIssues(model: SectionModel, spread: Spread, index: number): string[] {
  const extent = layoutExtent(layoutOf(spread));
  const from = model.surface[0][0];
  const to = model.surface[model.surface.length - 1][0];
  if (from <= extent.from && to >= extent.to) return [];
  return [
    `models[${index}].surface: the section covers ${fmt(from)} to ${fmt(to)} m but the geophones and shots reach ${fmt(extent.from)} to ${fmt(extent.to)} m (the section is shorter than the spread)`,
  ];
}

/**
 * Reading the time field: the first-arrival time at any point (a geophone) and the
 * first-arrival ray from a point back to the source, by descending the time gradient
 * (Podvin & Lecomte 1991 §5; the usual way to get rays from a time field).
 */
import { seesSourceDirectly, SOURCE_RADIUS_CELLS, type GridSource } from "./eikonal-source";
import { cellOf, type SectionGrid } from "./section-grid";

/**
 * Time at a point (s): the analytic time when the point sees the source directly within
 * the source neighbourhood (unless an earlier wave reached its cell: then the earlier of
 * that and the field), else bilinear interpolation in the cell holding it. A corner
 * above the surface (reached only through the staircase of surface cells, so late) is
 * replaced by linear extrapolation from the two nodes below it; corners without a time by
 * the nearest finite corner plus the straight path at the cell's slowness.
 */
export function timeAt(
  grid: SectionGrid,
  T: Float64Array,
  source: GridSource,
  x: number,
  z: number,
): number {
  const d = Math.hypot(x - source.x, z - source.z);
  if (d <= SOURCE_RADIUS_CELLS * grid.h && seesSourceDirectly(grid, source, x, z)) {
    // an earlier wave (e.g. a head wave) reached a corner of the cell: the field knows better
    const { i, j } = cellOf(grid, x, z);
    let overtaken = false;
    for (const [a, b] of [
      [i, j],
      [i + 1, j],
      [i, j + 1],
      [i + 1, j + 1],
    ]) {
      const straight =
        Math.hypot(grid.x0 + a * grid.h - source.x, grid.zTop - b * grid.h - source.z) *
        source.slowness;
      if (T[b * grid.nx + a] < straight * (1 - 1e-9)) overtaken = true;
    }
    const direct = d * source.slowness;
    return overtaken ? Math.min(direct, interpolatedTime(grid, T, x, z)) : direct;
  }
  return interpolatedTime(grid, T, x, z);
}

function interpolatedTime(grid: SectionGrid, T: Float64Array, x: number, z: number): number {
  const { nx, h, x0, zTop } = grid;
  const { i, j } = cellOf(grid, x, z);
  const fx = Math.min(1, Math.max(0, (x - (x0 + i * h)) / h));
  const fz = Math.min(1, Math.max(0, (zTop - j * h - z) / h));
  const node = (a: number, b: number): number => {
    const t = T[b * nx + a];
    if (zTop - b * h <= grid.surface[a] + 1e-9 || b + 2 >= grid.nz) return t;
    const below = 2 * T[(b + 1) * nx + a] - T[(b + 2) * nx + a];
    return Number.isFinite(below) ? below : t;
  };
  const t00 = node(i, j);
  const t10 = node(i + 1, j);
  const t01 = node(i, j + 1);
  const t11 = node(i + 1, j + 1);
  if (Number.isFinite(t00 + t10 + t01 + t11)) {
    return (t00 * (1 - fx) + t10 * fx) * (1 - fz) + (t01 * (1 - fx) + t11 * fx) * fz;
  }
  const s = grid.slowness[j * (nx - 1) + i];
  let best = Infinity;
  const corners: [number, number, number][] = [
    [t00, 0, 0],
    [t10, 1, 0],
    [t01, 0, 1],
    [t11, 1, 1],
  ];
  for (const [t, a, b] of corners) {
    if (!Number.isFinite(t)) continue;
    const cand = t + Math.hypot((fx - a) * h, (fz - b) * h) * (Number.isFinite(s) ? s : 0);
    if (cand < best) best = cand;
  }
  return best;
}

/**
 * Gradient of the time field at a point (s/m per axis: ∂T/∂x, ∂T/∂z with z up) written into
 * `out`; false where the cell (and the one below) has no time at every corner.
 */
function gradientAt(
  grid: SectionGrid,
  T: Float64Array,
  x: number,
  z: number,
  out: Float64Array,
): boolean {
  const { nx, nz, h, x0, zTop } = grid;
  const i = Math.min(nx - 2, Math.max(0, Math.floor((x - x0) / h + 1e-9)));
  let j = Math.min(nz - 2, Math.max(0, Math.floor((zTop - z) / h + 1e-9)));
  for (let attempt = 0; attempt < 2; attempt++) {
    const t00 = T[j * nx + i];
    const t10 = T[j * nx + i + 1];
    const t01 = T[(j + 1) * nx + i];
    const t11 = T[(j + 1) * nx + i + 1];
    if (Number.isFinite(t00 + t10 + t01 + t11)) {
      const fx = Math.min(1, Math.max(0, (x - (x0 + i * h)) / h));
      const fz = Math.min(1, Math.max(0, (zTop - j * h - z) / h));
      out[0] = ((t10 - t00) * (1 - fz) + (t11 - t01) * fz) / h;
      // row index grows downwards: ∂T/∂z(up) = −∂T/∂row / h
      out[1] = -((t01 - t00) * (1 - fx) + (t11 - t10) * fx) / h;
      return true;
    }
    if (j + 2 < nz) j += 1;
    else break;
  }
  return false;
}

/**
 * The first-arrival ray from (x, z) back to the source as interleaved x, elevation pairs
 * (m), ordered from the source to the point. Steps of ¾ cell down the gradient until two
 * cells from the source, then straight to the source.
 */
export function traceRay(
  grid: SectionGrid,
  T: Float64Array,
  source: GridSource,
  x: number,
  z: number,
): Float64Array {
  const step = grid.h * 0.75;
  const near = 2 * grid.h;
  const maxSteps = 8 * (grid.nx + grid.nz);
  let pts = new Float64Array(256);
  let n = 0;
  const push = (a: number, b: number) => {
    if (n + 2 > pts.length) {
      const bigger = new Float64Array(pts.length * 2);
      bigger.set(pts);
      pts = bigger;
    }
    pts[n++] = a;
    pts[n++] = b;
  };
  const g = new Float64Array(2);
  push(x, z);
  let px = x;
  let pz = z;
  for (let k = 0; k < maxSteps; k++) {
    const d = Math.hypot(px - source.x, pz - source.z);
    if (d <= near) break;
    if (!gradientAt(grid, T, px, pz, g)) break;
    const norm = Math.hypot(g[0], g[1]);
    if (!(norm > 0)) break;
    px -= (step * g[0]) / norm;
    pz -= (step * g[1]) / norm;
    push(px, pz);
  }
  push(source.x, source.z);
  const out = new Float64Array(n);
  for (let k = 0; k < n; k += 2) {
    out[k] = pts[n - 2 - k];
    out[k + 1] = pts[n - 1 - k];
  }
  return out;
}

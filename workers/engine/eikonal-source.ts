/**
 * The source neighbourhood of the eikonal solver: analytic straight-ray times (distance ×
 * slowness) at the grid nodes around the shot that see it through cells of the shot's own
 * slowness. Starting the fast march from exact times near the source removes most of the
 * error a grid makes where the wavefront is strongly curved (common practice for grid
 * eikonal solvers; Podvin & Lecomte 1991 §4 discuss the source region).
 */
import { cellOf, type SectionGrid } from "./section-grid";

/** Radius of the analytic neighbourhood, in cells. */
export const SOURCE_RADIUS_CELLS = 24;

/** A source on the grid: position (m, elevation m) and the slowness around it (s/m). */
export interface GridSource {
  readonly x: number;
  readonly z: number;
  readonly slowness: number;
}

/** Slowness of the cell holding a point (a point on a cell edge belongs to the cell below). */
export function slownessAt(grid: SectionGrid, x: number, z: number): number {
  const { nx, nz, h } = grid;
  const i = Math.min(nx - 2, Math.max(0, Math.floor((x - grid.x0) / h + 1e-9)));
  const j = Math.min(nz - 2, Math.max(0, Math.floor((grid.zTop - z) / h + 1e-9)));
  return grid.slowness[j * (nx - 1) + i];
}

/**
 * Whether the straight segment from the source to (x, z) stays in cells of the source's
 * slowness (sampled every half cell).
 */
export function seesSourceDirectly(
  grid: SectionGrid,
  source: GridSource,
  x: number,
  z: number,
): boolean {
  const d = Math.hypot(x - source.x, z - source.z);
  const steps = Math.max(1, Math.ceil((2 * d) / grid.h));
  for (let k = 0; k <= steps; k++) {
    const f = k / steps;
    const px = source.x + f * (x - source.x);
    const pz = source.z + f * (z - source.z);
    // a point exactly on a row may sit under air: accept either neighbouring cell
    const s1 = slownessAt(grid, px, pz);
    if (s1 === source.slowness) continue;
    const s2 = slownessAt(grid, px, pz - 1e-7 * grid.h);
    const s3 = slownessAt(grid, px - 1e-7 * grid.h, pz - 1e-7 * grid.h);
    if (s2 !== source.slowness && s3 !== source.slowness) return false;
  }
  return true;
}

/** The source for a shot point: the slowness of the cell holding it. */
export function gridSource(grid: SectionGrid, x: number, z: number): GridSource {
  let s = slownessAt(grid, x, z);
  if (s === Infinity) s = slownessAt(grid, x, z - 1e-6 * grid.h);
  if (s === Infinity) throw new RangeError(`the shot at ${x} m is not in the ground`);
  return { x, z, slowness: s };
}

/**
 * Initial times for the solver: analytic times at the nodes within SOURCE_RADIUS_CELLS of
 * the source that see it directly, Infinity elsewhere. At least the corners of the source
 * cell are set.
 */
export function sourceTimes(grid: SectionGrid, source: GridSource): Float64Array {
  const { nx, nz, h, x0, zTop } = grid;
  const T = new Float64Array(nx * nz).fill(Infinity);
  const ci = (source.x - x0) / h;
  const cj = (zTop - source.z) / h;
  const r = SOURCE_RADIUS_CELLS;
  const i0 = Math.max(0, Math.floor(ci) - r);
  const i1 = Math.min(nx - 1, Math.ceil(ci) + r);
  const j0 = Math.max(0, Math.floor(cj) - r);
  const j1 = Math.min(nz - 1, Math.ceil(cj) + r);
  for (let j = j0; j <= j1; j++) {
    for (let i = i0; i <= i1; i++) {
      const x = x0 + i * h;
      const z = zTop - j * h;
      const d = Math.hypot(x - source.x, z - source.z);
      if (d > r * h) continue;
      if (seesSourceDirectly(grid, source, x, z)) T[j * nx + i] = d * source.slowness;
    }
  }
  const { i, j } = cellOf(grid, source.x, source.z);
  for (const [a, b] of [
    [i, j],
    [i + 1, j],
    [i, j + 1],
    [i + 1, j + 1],
  ]) {
    const k = b * nx + a;
    if (!Number.isFinite(T[k])) {
      T[k] = Math.hypot(x0 + a * h - source.x, zTop - b * h - source.z) * source.slowness;
    }
  }
  return T;
}

/**
 * First arrivals over a section: grid the section once, solve the eikonal equation from
 * every shot, read the time at every geophone and trace its ray back to find which
 * interface it travelled along (the deepest layer it reached) and over which stretch.
 */
import { solveEikonal } from "./eikonal";
import { gridSource, sourceTimes, type GridSource } from "./eikonal-source";
import type { SectionModel, Spread } from "./plan-schema";
import { sectionGeometry, surfaceAt, topAt, type SectionGeometry } from "./section-geometry";
import { rasteriseSection, type SectionGrid } from "./section-grid";
import { timeAt, traceRay } from "./section-rays";

/** One shot's solution. */
export interface SolvedShot {
  readonly shot: number;
  readonly x: number;
  /** Elevation of the charge, m. */
  readonly z: number;
  readonly source: GridSource;
  /** Node times, s. */
  readonly times: Float64Array;
  /** Per geophone: first-arrival time, s (0 for a geophone at a surface shot). */
  readonly geophoneTimes: Float64Array;
  /** Per geophone: 0-based layer along whose top the ray travelled (0 = direct wave). */
  readonly via: Int32Array;
  /** Per geophone: stretch of that interface travelled, m (NaN for the direct wave). */
  readonly from: Float64Array;
  readonly to: Float64Array;
  /** Per geophone: the ray, interleaved x, elevation (empty at the shot). */
  readonly rays: Float64Array[];
  /**
   * Arrivals first between two neighbouring geophones but on neither: where the layers of
   * two neighbours' arrivals differ by two or more, surface points between them are traced
   * too; each entry is the geophone index before the point (by position), the layer
   * (0-based) and the stretch travelled.
   */
  readonly between: { after: number; via: number; from: number; to: number }[];
}

/** A solved section: geometry, grid, geophones and every shot. */
export interface SolvedSection {
  readonly geometry: SectionGeometry;
  readonly grid: SectionGrid;
  /** Geophone positions and elevations, m. */
  readonly geophoneX: Float64Array;
  readonly geophoneZ: Float64Array;
  readonly shots: SolvedShot[];
}

/** Distance a ray point may sit above an interface and still count as travelling on it, in cells. */
const ON_INTERFACE_CELLS = 0.3;

/** Elevation of the top of every layer at every node column, m (layer-major). */
export function columnTops(g: SectionGeometry, grid: SectionGrid): Float64Array {
  const tops = new Float64Array(g.layerCount * grid.nx);
  for (let i = 0; i < grid.nx; i++) {
    const x = grid.x0 + i * grid.h;
    for (let k = 0; k < g.layerCount; k++) tops[k * grid.nx + i] = topAt(g, k, x);
  }
  return tops;
}

function topFromTable(tops: Float64Array, grid: SectionGrid, k: number, x: number): number {
  const f = Math.min(grid.nx - 1, Math.max(0, (x - grid.x0) / grid.h));
  const i = Math.min(grid.nx - 2, Math.floor(f));
  const r = f - i;
  const base = k * grid.nx;
  return tops[base + i] * (1 - r) + tops[base + i + 1] * r;
}

/**
 * Which interface a ray travelled along: the deepest layer it reached (a point up to
 * `tol` m above a layer's top counts as in it), and the stretch it spent in that layer.
 */
function classify(
  layerCount: number,
  tops: Float64Array,
  grid: SectionGrid,
  ray: Float64Array,
  tol: number,
): { via: number; from: number; to: number } {
  let deepest = 0;
  for (let k = 0; k < ray.length; k += 2) {
    const x = ray[k];
    const z = ray[k + 1];
    for (let m = layerCount - 1; m > deepest; m--) {
      if (z <= topFromTable(tops, grid, m, x) + tol) {
        deepest = m;
        break;
      }
    }
  }
  if (deepest === 0) return { via: 0, from: NaN, to: NaN };
  let from = Infinity;
  let to = -Infinity;
  for (let k = 0; k < ray.length; k += 2) {
    const x = ray[k];
    if (ray[k + 1] <= topFromTable(tops, grid, deepest, x) + tol) {
      if (x < from) from = x;
      if (x > to) to = x;
    }
  }
  return { via: deepest, from, to };
}

/** Solve one shot over a gridded section (`shot` indexes spread.shots). */
export function solveShot(
  g: SectionGeometry,
  grid: SectionGrid,
  geophoneX: Float64Array,
  geophoneZ: Float64Array,
  tops: Float64Array,
  shot: number,
  x: number,
  depth: number,
  withRays = true,
): SolvedShot {
  const z = surfaceAt(g, x) - depth;
  const source = gridSource(grid, x, z);
  const times = solveEikonal(grid, sourceTimes(grid, source));
  const n = geophoneX.length;
  const geophoneTimes = new Float64Array(n);
  const via = new Int32Array(n);
  const from = new Float64Array(n).fill(NaN);
  const to = new Float64Array(n).fill(NaN);
  const rays: Float64Array[] = [];
  const tol = ON_INTERFACE_CELLS * grid.h;
  for (let k = 0; k < n; k++) {
    const gx = geophoneX[k];
    const gz = geophoneZ[k];
    if (Math.abs(gx - x) < 1e-9 && depth === 0) {
      geophoneTimes[k] = 0; // the geophone at the shot point
      rays.push(new Float64Array(0));
      continue;
    }
    geophoneTimes[k] = timeAt(grid, times, source, gx, gz);
    const ray = traceRay(grid, times, source, gx, gz);
    const c = classify(g.layerCount, tops, grid, ray, tol);
    via[k] = c.via;
    from[k] = c.from;
    to[k] = c.to;
    rays.push(withRays ? ray : new Float64Array(0));
  }
  const between: SolvedShot["between"] = [];
  for (let k = 0; k + 1 < n; k++) {
    if (Math.abs(via[k + 1] - via[k]) < 2) continue;
    const a = geophoneX[k];
    const b = geophoneX[k + 1];
    if ((a - x) * (b - x) < 0) continue; // the shot lies between them
    const samples = Math.max(2, Math.min(16, Math.floor(Math.abs(b - a) / grid.h)));
    const seen = new Set<number>();
    for (let q = 1; q < samples; q++) {
      const px = a + ((b - a) * q) / samples;
      const ray = traceRay(grid, times, source, px, surfaceAt(g, px));
      const c = classify(g.layerCount, tops, grid, ray, tol);
      const lo = Math.min(via[k], via[k + 1]);
      const hi = Math.max(via[k], via[k + 1]);
      if (c.via > lo && c.via < hi && !seen.has(c.via)) {
        seen.add(c.via);
        between.push({ after: k, via: c.via, from: c.from, to: c.to });
      }
    }
  }
  return { shot, x, z, source, times, geophoneTimes, via, from, to, rays, between };
}

/** Geophone positions and elevations of a spread on a section. */
export function geophonesOn(
  g: SectionGeometry,
  spread: Spread,
): { x: Float64Array; z: Float64Array } {
  const x = new Float64Array(spread.channels);
  const z = new Float64Array(spread.channels);
  for (let i = 0; i < spread.channels; i++) {
    x[i] = spread.firstGeophone + i * spread.spacing;
    z[i] = surfaceAt(g, x[i]);
  }
  return { x, z };
}

/**
 * Solve every shot of a spread over a section model (validated: see parsePlan). Throws
 * RangeError for geometry the schema refuses.
 */
export function solveSection(
  model: SectionModel,
  spread: Spread,
  options: { shots?: number[]; withRays?: boolean } = {},
): SolvedSection {
  const geometry = sectionGeometry(model);
  const shotPoints = spread.shots.map((s) => ({
    x: s.position,
    z: surfaceAt(geometry, s.position) - (s.depth ?? 0),
  }));
  const grid = rasteriseSection(
    geometry,
    { spacing: spread.spacing, firstGeophone: spread.firstGeophone, shots: shotPoints },
    { cellSize: model.cellSize, layerNames: model.layers.map((l) => l.name ?? null) },
  );
  const { x: geophoneX, z: geophoneZ } = geophonesOn(geometry, spread);
  const which = options.shots ?? spread.shots.map((_, i) => i);
  const tops = columnTops(geometry, grid);
  const shots = which.map((s) =>
    solveShot(
      geometry,
      grid,
      geophoneX,
      geophoneZ,
      tops,
      s,
      spread.shots[s].position,
      spread.shots[s].depth ?? 0,
      options.withRays ?? false,
    ),
  );
  return { geometry, grid, geophoneX, geophoneZ, shots };
}

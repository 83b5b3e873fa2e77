/**
 * Rasterisation of a section onto a grid of square cells for the eikonal solver: the cell
 * size chosen from the geometry, a slowness per cell (Infinity in the air), and warnings
 * where a layer is thinner than the grid can represent.
 *
 * Nodes (where times live) are at x0 + i·h, zTop − j·h (i < nx, j < nz); cell (i, j) lies
 * between nodes i, i+1 and rows j, j+1 (index j·(nx−1) + i). Geophones fall on node columns
 * when the cell size divides the spacing (the chosen size always does).
 *
 * A cell cut by interfaces gets the slowness that keeps the vertical intercept time of the
 * head wave along the bottom of the cell exact: with fractions f_k of the materials in the
 * cell (slowness s_k, measured down the cell's centre line) and p the slowness of the bottom
 * material, s² = p² + (Σ f_k √(s_k² − p²))² (the intercept-time sum, Telford et al. 1990
 * §4.3, applied inside one cell); when a slower material lies below (no head wave), the
 * arithmetic mean Σ f_k s_k (exact vertical time). A cell the surface cuts counts as ground
 * (the part in the air takes the top layer) so that geophones on the surface have a cell
 * of ground around them.
 */
import type { SectionGeometry } from "./section-geometry";
import { surfaceAt, topAt, velocityAt } from "./section-geometry";
import type { SectionGridInfo } from "./section-types";

/** Largest number of grid nodes; beyond it the cell size grows (and a warning says so). */
export const MAX_SECTION_NODES = 1_500_000;

/** The rasterised section. */
export interface SectionGrid {
  readonly info: SectionGridInfo;
  /** Cell size, m. */
  readonly h: number;
  readonly nx: number;
  readonly nz: number;
  readonly x0: number;
  readonly zTop: number;
  /** Slowness per cell, s/m (Infinity: air). Length (nx−1)·(nz−1). */
  readonly slowness: Float64Array;
  /** Surface elevation at every node column, m. */
  readonly surface: Float64Array;
  readonly warnings: string[];
}

/** Where the spread and shots are: geophone positions and shot points (x, elevation), m. */
export interface SectionLayout {
  readonly spacing: number;
  readonly firstGeophone: number;
  readonly shots: readonly { x: number; z: number }[];
}

const fmt = (x: number, digits = 2): string => {
  const r = Number(x.toFixed(digits));
  return String(Object.is(r, -0) ? 0 : r);
};

/** Positions where the geometry is sampled to find thicknesses: vertices and a fine comb. */
function samplePositions(g: SectionGeometry, count: number): number[] {
  const xs: number[] = [];
  for (let i = 0; i <= count; i++) xs.push(g.from + ((g.to - g.from) * i) / count);
  for (const line of [g.surface, ...g.bases]) for (const x of line.xs) xs.push(x);
  return xs.filter((x) => x >= g.from && x <= g.to).sort((a, b) => a - b);
}

/** Largest thickness of each layer but the half-space along the line, m. */
export function maxThicknesses(g: SectionGeometry): Float64Array {
  const n = g.layerCount;
  const out = new Float64Array(Math.max(0, n - 1));
  for (const x of samplePositions(g, 400)) {
    for (let k = 0; k < n - 1; k++) {
      const t = topAt(g, k, x) - topAt(g, k + 1, x);
      if (t > out[k]) out[k] = t;
    }
  }
  return out;
}

/**
 * Cell size chosen from the geometry (m): at most a quarter of the geophone spacing, a
 * quarter of the thinnest layer's greatest thickness and 1/200 of the section's length, made
 * to divide the spacing; grown when the grid would exceed MAX_SECTION_NODES.
 */
export function chooseCellSize(
  g: SectionGeometry,
  spacing: number,
  depthRange: number,
  requested?: number,
): { h: number; source: SectionGridInfo["cellSizeSource"] } {
  let h: number;
  let source: SectionGridInfo["cellSizeSource"];
  if (requested !== undefined) {
    h = requested;
    source = "plan";
  } else {
    h = Math.min(spacing / 4, (g.to - g.from) / 200);
    const thick = maxThicknesses(g);
    for (const t of thick) if (t > 0) h = Math.min(h, t / 4);
    h = spacing / Math.ceil(spacing / h - 1e-9);
    source = "geometry";
  }
  const nodes = (size: number) =>
    (Math.ceil((g.to - g.from) / size) + 3) * (Math.ceil(depthRange / size) + 6);
  if (nodes(h) > MAX_SECTION_NODES) {
    h = Math.sqrt(((g.to - g.from + 3 * h) * (depthRange + 6 * h)) / MAX_SECTION_NODES) * 1.05;
    while (nodes(h) > MAX_SECTION_NODES) h *= 1.05;
    source = "limit";
  }
  return { h, source };
}

function thinWarnings(g: SectionGeometry, h: number, names: readonly (string | null)[]): string[] {
  const warnings: string[] = [];
  const xs = samplePositions(g, Math.min(4000, Math.ceil((g.to - g.from) / (h / 2))));
  for (let k = 0; k < g.layerCount - 1; k++) {
    const stretches: [number, number][] = [];
    let start: number | null = null;
    let last = xs[0];
    for (const x of xs) {
      const t = topAt(g, k, x) - topAt(g, k + 1, x);
      const thin = t > 1e-9 && t < 2 * h;
      if (thin && start === null) start = x;
      if (!thin && start !== null) {
        stretches.push([start, last]);
        start = null;
      }
      last = x;
    }
    if (start !== null) stretches.push([start, last]);
    if (stretches.length === 0) continue;
    const label = names[k] ? ` (${names[k]})` : "";
    const where = stretches.map(([a, b]) => `${fmt(a, 1)} to ${fmt(b, 1)} m`).join(", ");
    warnings.push(
      `Layer ${k + 1}${label} is thinner than two cells (${fmt(2 * h)} m) from ${where}: ` +
        `the grid cannot carry its own head wave there; times through it use a blended ` +
        `velocity. Give a smaller cellSize to model it.`,
    );
  }
  return warnings;
}

/**
 * Rasterise a section for a spread: the grid covers the surface's range (extended to put
 * geophones on node columns) and reaches below the deepest base, surface point and shot.
 */
export function rasteriseSection(
  g: SectionGeometry,
  layout: SectionLayout,
  options: { cellSize?: number; layerNames?: readonly (string | null)[] } = {},
): SectionGrid {
  const n = g.layerCount;
  let zTop = -Infinity;
  let zLow = Infinity;
  for (const z of g.surface.ys) {
    zTop = Math.max(zTop, z);
    zLow = Math.min(zLow, z);
  }
  for (const b of g.bases) for (const z of b.ys) zLow = Math.min(zLow, z);
  for (const s of layout.shots) zLow = Math.min(zLow, s.z);
  const depthRange = Math.max(zTop - zLow, 1e-3);
  const { h, source } = chooseCellSize(g, layout.spacing, depthRange, options.cellSize);
  const margin = Math.max(4 * h, 1);
  const k0 = Math.ceil((layout.firstGeophone - g.from) / h - 1e-9);
  const x0 = layout.firstGeophone - k0 * h;
  const nx = Math.max(2, Math.ceil((g.to - x0) / h - 1e-9) + 1);
  const nz = Math.max(2, Math.ceil((zTop - zLow + margin) / h) + 1);
  const cx = nx - 1;
  const cz = nz - 1;
  const slowness = new Float64Array(cx * cz);
  const tops = new Float64Array(n + 1);
  const slow = new Float64Array(n);
  for (let i = 0; i < cx; i++) {
    const x = x0 + (i + 0.5) * h;
    for (let k = 0; k < n; k++) {
      tops[k] = topAt(g, k, x);
      slow[k] = 1 / velocityAt(g, k, x);
    }
    tops[n] = -Infinity;
    // a cell is ground when the surface rises above its bottom anywhere across it
    const surface = Math.max(surfaceAt(g, x), surfaceAt(g, x - 0.5 * h), surfaceAt(g, x + 0.5 * h));
    for (let j = 0; j < cz; j++) {
      const zt = zTop - j * h;
      const zb = zt - h;
      const idx = j * cx + i;
      if (zb >= surface) {
        slowness[idx] = Infinity;
        continue;
      }
      // fractions down the centre line; the part in the air goes to the top layer
      let bottom = -1;
      let sumRoot = 0;
      let mean = 0;
      let inverted = false;
      for (let k = 0; k < n; k++) {
        const hi = k === 0 ? zt : Math.min(zt, tops[k]);
        const lo = Math.max(zb, tops[k + 1]);
        if (hi > lo) bottom = k;
      }
      const p = slow[bottom];
      for (let k = 0; k <= bottom; k++) {
        const hi = k === 0 ? zt : Math.min(zt, tops[k]);
        const lo = Math.max(zb, tops[k + 1]);
        if (!(hi > lo)) continue;
        const f = (hi - lo) / h;
        mean += f * slow[k];
        if (slow[k] < p) inverted = true;
        else sumRoot += f * Math.sqrt(slow[k] * slow[k] - p * p);
      }
      slowness[idx] = inverted ? mean : Math.sqrt(p * p + sumRoot * sumRoot);
    }
  }
  const surfaceAtNodes = new Float64Array(nx);
  for (let i = 0; i < nx; i++) surfaceAtNodes[i] = surfaceAt(g, x0 + i * h);
  const warnings = thinWarnings(g, h, options.layerNames ?? []);
  if (source === "limit") {
    warnings.unshift(
      `The grid would exceed ${MAX_SECTION_NODES.toLocaleString("en")} nodes: cells are ${fmt(h, 3)} m, coarser than the geometry asks for; times may be less accurate.`,
    );
  }
  return {
    info: { cellSize: h, cellSizeSource: source, nx, nz, x0, zTop },
    h,
    nx,
    nz,
    x0,
    zTop,
    slowness,
    surface: surfaceAtNodes,
    warnings,
  };
}

/** Index of the cell holding a point (points on a cell edge go to the cell below/right), clamped. */
export function cellOf(grid: SectionGrid, x: number, z: number): { i: number; j: number } {
  const i = Math.min(grid.nx - 2, Math.max(0, Math.floor((x - grid.x0) / grid.h + 1e-9)));
  const j = Math.min(grid.nz - 2, Math.max(0, Math.floor((grid.zTop - z) / grid.h + 1e-9)));
  return { i, j };
}

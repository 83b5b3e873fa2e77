/**
 * Design figures for a spread (design.md):
 *  - per layer, the minimum thickness at which its refractor becomes resolved with this
 *    spread, other layers unchanged, in closed form (see minimumThickness);
 *  - the largest spacing that guarantees the minimum count on every bounded segment
 *    wherever the line starts: any interval of length L holds at least ⌊L/Δx⌋ geophones,
 *    so Δx = L_min / count;
 *  - the spread length (largest offset a branch must reach) that puts the minimum count of
 *    geophones past the last crossover distance.
 */
import { branchOffset, firstAtOrBeyond, type Branch, type Layout } from "./branches";
import { traceDown, type CriticalRay } from "./dipping";
import { findInterfaceProblem, withThickness, type Earth } from "./geometry";
import { linesFor, prepareEarth, type PreparedEarth } from "./head-waves";
import { createLineSet, type LineSet } from "./lines";
import { cosFromSin } from "./numbers";
import type { Pieces } from "./segments";
import { createPieces, firstArrivalPieces, longestBoundedPiece } from "./segments";
import { createJudgeScratch, judgedBranches, worstCodes, type JudgedBranch } from "./verdicts";

/** Largest thickness considered, m (the plan format's limit). */
export const MAX_DESIGN_THICKNESS = 1000;

/**
 * The deeper head waves (below layer m) of one branch as affine functions of layer m's
 * thickness h: each can take the first arrival from arrival m beyond
 * e_j(h) = max(start_j(h), crossover_j(h)), where start_j is its critical distance (clamped
 * at 0 for dipping rays) and crossover_j the offset where it overtakes arrival m. Both are
 * a + b·(h − h0), m. `count` entries are used.
 */
interface DeeperLines {
  count: number;
  readonly startA: Float64Array;
  readonly startB: Float64Array;
  readonly crossA: Float64Array;
  readonly crossB: Float64Array;
}

function createDeeperLines(n: number): DeeperLines {
  return {
    count: 0,
    startA: new Float64Array(n),
    startB: new Float64Array(n),
    crossA: new Float64Array(n),
    crossB: new Float64Array(n),
  };
}

/**
 * inf{h : E(h) > x} with E(h) = min_j e_j(h) the end of arrival m's segment (m), given the
 * affine pieces of every deeper line; −∞ when no deeper line exists (E = ∞) or x < 0.
 */
function thicknessBeyond(deeper: DeeperLines, h0: number, x: number): number {
  if (x === Infinity) return Infinity;
  if (x < 0) return -Infinity;
  let h = -Infinity;
  for (let i = 0; i < deeper.count; i++) {
    // e_j > x ⟺ start_j > x or crossover_j > x (slopes are > 0)
    const viaStart = h0 + (x - deeper.startA[i]) / deeper.startB[i];
    const viaCross = h0 + (x - deeper.crossA[i]) / deeper.crossB[i];
    const hj = viaStart < viaCross ? viaStart : viaCross;
    if (hj > h) h = hj;
  }
  return h;
}

const footA = new Float64Array(3);
const footB = new Float64Array(3);
const at0 = new Float64Array(2);
const at1 = new Float64Array(2);

/**
 * Intercept time (s) and unclamped critical distance (m) of the dipping head wave along
 * the top of layer j on one side, traced along the fixed critical-ray directions (as
 * dippingLines, without clamping the critical distance at 0). Writes [intercept, start].
 */
function tracedLine(
  earth: Earth,
  ray: CriticalRay,
  j: number,
  shot: number,
  sign: 1 | -1,
  out: Float64Array,
): void {
  traceDown(earth, ray.down, j, shot, footA);
  traceDown(earth, ray.back, j, shot, footB);
  const along = sign * ((footB[0] - footA[0]) * ray.tx + (footB[1] - footA[1]) * ray.tz);
  out[0] = footA[2] + footB[2] + along / earth.velocity[j];
  out[1] = -along / ray.footRate;
}

/**
 * Fill `out` with the deeper lines of a branch as affine functions of layer m's thickness.
 * Flat layers in closed form (Telford et al. 1990 §4.3): with sin θ = v_m / v_j,
 * d(intercept_j)/dh_m = 2 cos θ / v_m and d(critical distance_j)/dh_m = 2 tan θ. Dipping
 * layers: every traced quantity is affine in h (fixed ray directions, planar interfaces),
 * so two traces give it exactly. Returns false when the closed form does not apply (a deeper
 * line not faster along the offset than arrival m, or a slope that is not positive).
 */
function deeperLines(
  prep: PreparedEarth,
  lines: LineSet,
  m: number,
  branch: Branch,
  thicker: Earth | null,
  out: DeeperLines,
): boolean {
  const { earth } = prep;
  const n = earth.layerCount;
  const v = earth.velocity;
  const pm = lines.slowness[m];
  const rays = prep.flat ? null : branch.sign === 1 ? prep.forwardRays : prep.reverseRays;
  out.count = 0;
  for (let j = m + 1; j < n; j++) {
    if (lines.exists[j] !== 1) continue;
    const dp = pm - lines.slowness[j];
    if (!(dp > 0)) return false;
    let start: number;
    let startSlope: number;
    let interceptSlope: number;
    if (!rays || !thicker) {
      const sin = v[m] / v[j];
      const cos = cosFromSin(sin);
      start = lines.start[j];
      startSlope = (2 * sin) / cos;
      interceptSlope = (2 * cos) / v[m];
    } else {
      const dh = earth.depthAtZero[m + 1] - thicker.depthAtZero[m + 1];
      tracedLine(earth, rays[j], j, branch.shot, branch.sign, at0);
      tracedLine(thicker, rays[j], j, branch.shot, branch.sign, at1);
      start = at0[1];
      startSlope = (at0[1] - at1[1]) / dh;
      interceptSlope = (at0[0] - at1[0]) / dh;
    }
    if (!(startSlope > 0 && interceptSlope > 0)) return false;
    const k = out.count++;
    out.startA[k] = start;
    out.startB[k] = startSlope;
    out.crossA[k] = (lines.intercept[j] - lines.intercept[m]) / dp;
    out.crossB[k] = interceptSlope / dp;
  }
  return true;
}

/**
 * Offsets (m) that decide one branch's verdict on arrival m, from the offsets where m is
 * earlier than every shallower arrival (pieces of arrival m in the first-arrival curve of
 * arrivals 0..m, which do not depend on layer m's thickness). With E the end of m's
 * segment (the offset where a deeper head wave takes over), the branch
 *  - resolves m once E > `resolve` (its K-th geophone on those pieces is before E);
 *  - judges m blind or under-sampled while E ≤ `bad`: the segment is empty, or it holds
 *    fewer than K geophones while the branch's geophones span it (nearest offset ≤ from +
 *    spacing and the segment's end ≤ farthest offset + spacing; see verdicts.ts).
 * Infinity stands for "never".
 */
function branchLimits(
  layout: Layout,
  branch: Branch,
  pieces: Pieces,
  m: number,
  minGeophones: number,
): { resolve: number; bad: number } {
  let first = Infinity;
  let need = minGeophones;
  let kth = minGeophones <= 0 ? NaN : Infinity;
  let pastFar = Infinity;
  const near = branch.count > 0 ? branchOffset(layout, branch, 0) : Infinity;
  const far = branch.count > 0 ? branchOffset(layout, branch, branch.count - 1) : -Infinity;
  const reach = far + layout.spacing;
  for (let i = 0; i < pieces.count; i++) {
    if (pieces.arrival[i] !== m) continue;
    const from = pieces.from[i];
    const to = pieces.to[i];
    if (first === Infinity) first = from;
    if (kth === Infinity) {
      const k0 = firstAtOrBeyond(layout, branch, from);
      const inside = firstAtOrBeyond(layout, branch, to) - k0;
      if (inside >= need) kth = branchOffset(layout, branch, k0 + need - 1);
      else need -= inside;
    }
    if (pastFar === Infinity && to > reach) pastFar = from > reach ? from : reach;
  }
  if (first === Infinity) return { resolve: Infinity, bad: Infinity };
  if (Number.isNaN(kth)) kth = first;
  const spansFrom = near <= first + layout.spacing;
  const underSampled = spansFrom ? Math.min(kth, pastFar) : -Infinity;
  return { resolve: kth, bad: Math.max(first, underSampled) };
}

/**
 * Minimum vertical thickness (m, at position 0) of layer `m` (0-based, not the half-space)
 * at which the head wave along its top is resolved on every judged branch, other layers
 * unchanged; 0 when any thickness resolves it; null when no thickness below 1000 m does
 * (inverted, blind or under-sampled on some branch whatever the thickness, or its segment
 * beyond the spread).
 *
 * Closed form per branch: thickening layer m leaves the shallower arrivals and the start of
 * m's segment unchanged and moves every deeper head wave later, so m's segment ends at
 * E(h) = min_j max(critical distance_j(h), crossover_j(h)) over the deeper head waves j,
 * each linear in h (design.md; Telford et al. 1990 §4.3). E grows with h, so each verdict
 * condition "E(h) > offset" (branchLimits) is solved for h directly. Dipping models use the
 * prepared critical rays (their directions do not depend on depths) and the thickness must
 * also keep layer m's base below its top within `extent`. Where the closed form does not
 * apply (a deeper dipping head wave slower along the offset than arrival m), a bisection on
 * the full verdicts is used, reusing the prepared rays. The result is a hair (10⁻⁹
 * relative) above the exact threshold, so the refractor is resolved at that thickness.
 */
export function minimumThickness(
  prep: PreparedEarth,
  layout: Layout,
  minGeophones: number,
  m: number,
  extent: { from: number; to: number },
  branches: readonly JudgedBranch[] = judgedBranches(layout),
): number | null {
  return thicknessOf(prep, layout, minGeophones, m, extent, branches, createScratch(prep));
}

/**
 * minimumThickness (m) of every layer of the model, index = 0-based layer (null for layer 0,
 * the half-space and wherever minimumThickness is null), sharing buffers between layers.
 */
export function minimumThicknesses(
  prep: PreparedEarth,
  layout: Layout,
  minGeophones: number,
  extent: { from: number; to: number },
  branches: readonly JudgedBranch[] = judgedBranches(layout),
): (number | null)[] {
  const scratch = createScratch(prep);
  const out: (number | null)[] = [];
  for (let m = 0; m < prep.earth.layerCount; m++) {
    out.push(thicknessOf(prep, layout, minGeophones, m, extent, branches, scratch));
  }
  return out;
}

interface Scratch {
  readonly lines: LineSet;
  readonly shallow: Pieces;
  readonly deeper: DeeperLines;
}

function createScratch(prep: PreparedEarth): Scratch {
  const n = prep.earth.layerCount;
  return {
    // flat models: linesFor returns the shared set and never writes into the scratch
    lines: prep.flat ?? createLineSet(n),
    shallow: createPieces(n),
    deeper: createDeeperLines(n),
  };
}

function thicknessOf(
  prep: PreparedEarth,
  layout: Layout,
  minGeophones: number,
  m: number,
  extent: { from: number; to: number },
  branches: readonly JudgedBranch[],
  { lines: scratch, shallow, deeper }: Scratch,
): number | null {
  const { earth } = prep;
  const n = earth.layerCount;
  if (m < 1 || m >= n - 1 || prep.rule[m] !== 1) return null;
  const h0 = earth.depthAtZero[m + 1] - earth.depthAtZero[m];
  // the base of layer m stays below its top at both ends of the extent: h > x·(s_m − s_m+1)
  const ds = earth.slope[m] - earth.slope[m + 1];
  const geometric = Math.max(extent.from * ds, extent.to * ds, 0);
  const thicker = prep.flat ? null : withThickness(earth, m, h0 + Math.max(1, h0));
  let shallowOf: LineSet | null = null;
  let worstBad = -Infinity;
  let bestResolve = Infinity;
  for (const { branch } of branches) {
    const lines = linesFor(prep, branch.shot, branch.sign, scratch);
    if (lines.exists[m] !== 1) return null;
    if (shallowOf !== lines || !prep.flat) {
      firstArrivalPieces(lines, m + 1, shallow);
      shallowOf = lines;
    }
    if (!deeperLines(prep, lines, m, branch, thicker, deeper)) {
      return bisectMinimumThickness(prep, layout, minGeophones, m, extent, branches);
    }
    const limits = branchLimits(layout, branch, shallow, m, minGeophones);
    worstBad = Math.max(worstBad, thicknessBeyond(deeper, h0, limits.bad));
    bestResolve = Math.min(bestResolve, thicknessBeyond(deeper, h0, limits.resolve));
  }
  const threshold = Math.max(worstBad, bestResolve, geometric);
  if (!(threshold < MAX_DESIGN_THICKNESS)) return null;
  if (threshold <= 0) return 0;
  return threshold + 1e-9 * Math.max(1, threshold);
}

/**
 * The same minimum thickness by bisection on the full verdicts (upper bracket within 0.1 mm
 * or 10⁻⁵ relative), for the dipping cases the closed form does not cover. Reuses the
 * prepared critical rays: their directions do not depend on the thickness.
 */
function bisectMinimumThickness(
  prep: PreparedEarth,
  layout: Layout,
  minGeophones: number,
  m: number,
  extent: { from: number; to: number },
  branches: readonly JudgedBranch[],
): number | null {
  const { earth } = prep;
  const n = earth.layerCount;
  const scratch = createJudgeScratch(n);
  const worst = new Uint8Array(n);
  const list = [...branches];
  const resolvedAt = (h: number): boolean => {
    const e = withThickness(earth, m, h);
    if (findInterfaceProblem(e, extent.from, extent.to)) return false;
    const moved = prep.flat ? prepareEarth(e) : { ...prep, earth: e };
    worstCodes(moved, layout, minGeophones, scratch, worst, list);
    return worst[m] === 0;
  };
  let hi = earth.depthAtZero[m + 1] - earth.depthAtZero[m];
  let lo = 0;
  if (!resolvedAt(hi)) {
    lo = hi;
    do {
      hi = Math.min(2 * hi, MAX_DESIGN_THICKNESS);
      if (resolvedAt(hi)) break;
      lo = hi;
      if (hi >= MAX_DESIGN_THICKNESS) return null;
    } while (hi < MAX_DESIGN_THICKNESS);
  }
  while (hi - lo > Math.max(1e-4, 1e-5 * hi)) {
    const mid = 0.5 * (lo + hi);
    if (resolvedAt(mid)) hi = mid;
    else lo = mid;
  }
  return hi;
}
/**
 * Largest spacing (m) guaranteeing `minGeophones` on every bounded first-arrival segment of
 * the given branches' pieces, or null when no segment is bounded.
 */
export function maxSpacingFor(
  piecesList: readonly Pieces[],
  layerCount: number,
  minGeophones: number,
): number | null {
  let best = Infinity;
  for (const pieces of piecesList) {
    for (let a = 0; a < layerCount; a++) {
      const len = longestBoundedPiece(pieces, a);
      if (len > 0) best = Math.min(best, len / minGeophones);
    }
  }
  // a hair below L / count: a geophone standing exactly at the shot (offset 0) is on no
  // branch, so the direct-wave segment is open at 0
  return Number.isFinite(best) ? best * (1 - 1e-9) : null;
}

/** Start offset (m) of the last, unbounded first-arrival piece: the last crossover distance. */
export function lastCrossover(piecesList: readonly Pieces[]): number {
  let last = 0;
  for (const pieces of piecesList) {
    if (pieces.count > 0) last = Math.max(last, pieces.from[pieces.count - 1]);
  }
  return last;
}

/**
 * Spread length (largest offset a branch must reach, m) that puts `minGeophones` geophones
 * spaced `spacing` past `crossover`, and the channel count for a branch from offset 0.
 */
export function spreadLengthFor(
  crossover: number,
  spacing: number,
  minGeophones: number,
): { spreadLength: number; channels: number } {
  const spreadLength = crossover + minGeophones * spacing;
  // N channels at Δx span (N − 1)·Δx: enough intervals to reach the length from offset 0.
  return { spreadLength, channels: Math.ceil(spreadLength / spacing - 1e-9) + 1 };
}

/** Other evidence to seek for a layer no spread can reveal (design.md). */
export const OTHER_EVIDENCE =
  "boreholes or cone penetration tests, later (secondary) arrivals, reflection or surface-wave methods, " +
  "or carrying the layer as a thickness range into the interpretation with its worst-case depth error";

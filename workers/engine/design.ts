/**
 * Design figures for a spread (design.md):
 *  - per layer, the minimum thickness at which its refractor becomes resolved with this
 *    spread, other layers unchanged (segment length grows monotonically with that layer's
 *    thickness, so bisection works);
 *  - the largest spacing that guarantees the minimum count on every bounded segment
 *    wherever the line starts: any interval of length L holds at least ⌊L/Δx⌋ geophones,
 *    so Δx = L_min / count;
 *  - the spread length (largest offset a branch must reach) that puts the minimum count of
 *    geophones past the last crossover distance.
 */
import type { Layout } from "./branches";
import { findInterfaceProblem, withThickness, type Earth } from "./geometry";
import { prepareEarth } from "./head-waves";
import { headWaveRule } from "./lines";
import type { Pieces } from "./segments";
import { longestBoundedPiece } from "./segments";
import { createJudgeScratch, judgedBranches, worstCodes } from "./verdicts";

/** Largest thickness tried by the bisection, m (the plan format's limit). */
export const MAX_DESIGN_THICKNESS = 1000;

/**
 * Minimum vertical thickness (m, at position 0) of layer `m` (0-based, not the half-space)
 * at which the head wave along its top is resolved on every judged branch, or null when no
 * thickness up to 1000 m resolves it (inverted, or segment beyond the spread). The result
 * is an upper bracket within 0.1 mm or 10⁻⁵ relative.
 */
export function minimumThickness(
  earth: Earth,
  layout: Layout,
  minGeophones: number,
  m: number,
  extent: { from: number; to: number },
): number | null {
  if (m < 1 || m >= earth.layerCount - 1) return null;
  const n = earth.layerCount;
  const scratch = createJudgeScratch(n);
  const worst = new Uint8Array(n);
  const branches = judgedBranches(layout);
  const resolvedAt = (h: number): boolean => {
    const e = withThickness(earth, m, h);
    if (findInterfaceProblem(e, extent.from, extent.to)) return false;
    worstCodes(prepareEarth(e), layout, minGeophones, scratch, worst, branches);
    return worst[m] === 0;
  };
  if (headWaveRule(earth)[m] !== 1) return null;
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
  return { spreadLength, channels: Math.floor(spreadLength / spacing + 1e-9) + 1 };
}

/** Other evidence to seek for a layer no spread can reveal (design.md). */
export const OTHER_EVIDENCE =
  "boreholes or cone penetration tests, later (secondary) arrivals, reflection or surface-wave methods, " +
  "or carrying the layer as a thickness range into the interpretation with its worst-case depth error";

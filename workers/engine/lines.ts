/**
 * Arrival lines of one shot branch. On a time–offset plot the direct wave and every head
 * wave are straight lines t = intercept + slowness · offset, each valid from a start offset
 * (0 for the direct wave, the critical distance for a head wave). Index 0 is the direct
 * wave; index m (1..n−1) is the head wave travelling along the top of layer m (0-based).
 * Stored as parallel typed arrays so sweeps can reuse them without allocating.
 */
import type { Earth } from "./geometry";

/** Arrival lines of one branch (struct of arrays, length = layer count). */
export interface LineSet {
  /** 1 when the arrival exists on this branch (for head waves: reaches the surface). */
  readonly exists: Uint8Array;
  /** Intercept time at zero offset, s. */
  readonly intercept: Float64Array;
  /** Apparent slowness along the offset, s/m (1 / apparent velocity). */
  readonly slowness: Float64Array;
  /** Offset from which the arrival exists, m (critical distance for head waves). */
  readonly start: Float64Array;
}

/** Allocate a line set for `layerCount` arrivals (all marked absent). */
export function createLineSet(layerCount: number): LineSet {
  return {
    exists: new Uint8Array(layerCount),
    intercept: new Float64Array(layerCount),
    slowness: new Float64Array(layerCount),
    start: new Float64Array(layerCount),
  };
}

/** Time of arrival `i` at `offset` on its (unbounded) line, s. */
export function lineTime(lines: LineSet, i: number, offset: number): number {
  return lines.intercept[i] + lines.slowness[i] * offset;
}

/**
 * The head-wave existence rule (design.md; Telford et al. 1990 §4.3): a head wave travels
 * along the top of layer m only if v_m is greater than the velocity of every layer above.
 * Returns a flag per layer (index 0, the top layer, is flagged 1: its "arrival" is the
 * direct wave).
 */
export function headWaveRule(earth: Earth): Uint8Array {
  const flags = new Uint8Array(earth.layerCount);
  flags[0] = 1;
  let fastestAbove = earth.velocity[0];
  for (let m = 1; m < earth.layerCount; m++) {
    const v = earth.velocity[m];
    flags[m] = v > fastestAbove ? 1 : 0;
    if (v > fastestAbove) fastestAbove = v;
  }
  return flags;
}

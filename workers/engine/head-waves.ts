/**
 * Direct wave and head-wave lines for a ground model, flat or dipping.
 *
 * Flat layers (Telford, Geldart & Sheriff 1990 §4.3; Kearey, Brooks & Hill 2002 ch. 5):
 * with sin θ_i = v_i / v_m, the head wave along the top of layer m arrives at
 *   t_m(x) = x / v_m + Σ_{i<m} 2 h_i cos θ_i / v_i      for x ≥ x_crit,m = Σ_{i<m} 2 h_i tan θ_i.
 * Dipping planar interfaces are traced exactly in dipping.ts.
 */
import type { Earth } from "./geometry";
import { createLineSet, headWaveRule, type LineSet } from "./lines";
import { criticalRays, dippingLines, type CriticalRay } from "./dipping";
import { cosFromSin } from "./numbers";

/** Fill `out` with the flat-layer lines (ignores dips). */
export function flatLines(earth: Earth, rule: Uint8Array, out: LineSet): LineSet {
  const v = earth.velocity;
  const z = earth.depthAtZero;
  out.exists[0] = 1;
  out.intercept[0] = 0;
  out.slowness[0] = 1 / v[0];
  out.start[0] = 0;
  for (let m = 1; m < earth.layerCount; m++) {
    if (rule[m] !== 1) {
      out.exists[m] = 0;
      out.intercept[m] = NaN;
      out.slowness[m] = NaN;
      out.start[m] = NaN;
      continue;
    }
    let tau = 0;
    let xc = 0;
    for (let i = 0; i < m; i++) {
      const h = z[i + 1] - z[i];
      const sin = v[i] / v[m];
      const cos = cosFromSin(sin);
      tau += (2 * h * cos) / v[i];
      xc += (2 * h * sin) / cos;
    }
    out.exists[m] = 1;
    out.intercept[m] = tau;
    out.slowness[m] = 1 / v[m];
    out.start[m] = xc;
  }
  return out;
}

/** An earth with everything that does not depend on the shot position precomputed. */
export interface PreparedEarth {
  readonly earth: Earth;
  /** Head-wave existence rule per layer (1 = faster than every layer above). */
  readonly rule: Uint8Array;
  /** Lines shared by every shot and side (flat models only). */
  readonly flat: LineSet | null;
  /** Critical rays per side (dipping models only). */
  readonly forwardRays: CriticalRay[] | null;
  readonly reverseRays: CriticalRay[] | null;
}

/**
 * Precompute the lines (flat) or the critical-ray directions (dipping). Pass
 * `forceTracing` to trace even a flat model (used to check that dip 0 equals flat).
 */
export function prepareEarth(earth: Earth, forceTracing = false): PreparedEarth {
  const rule = headWaveRule(earth);
  if (!earth.dipping && !forceTracing) {
    return {
      earth,
      rule,
      flat: flatLines(earth, rule, createLineSet(earth.layerCount)),
      forwardRays: null,
      reverseRays: null,
    };
  }
  return {
    earth,
    rule,
    flat: null,
    forwardRays: criticalRays(earth, 1, rule),
    reverseRays: criticalRays(earth, -1, rule),
  };
}

/**
 * The lines of a shot at `shot` (m) on one side. For flat models the shared line set is
 * returned (do not mutate it); otherwise `scratch` is filled and returned.
 */
export function linesFor(
  prep: PreparedEarth,
  shot: number,
  sign: 1 | -1,
  scratch: LineSet,
): LineSet {
  if (prep.flat) return prep.flat;
  const rays = sign === 1 ? prep.forwardRays : prep.reverseRays;
  return dippingLines(prep.earth, rays as CriticalRay[], shot, sign, scratch);
}

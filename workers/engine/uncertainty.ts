/**
 * Pick uncertainty: a first-break pick error σ_t (s, independent per geophone) propagated
 * by least squares to the velocities and depths of the intercept-time interpretation.
 *
 * Each resolved segment is fitted by a straight line t = τ + p·x through its picks. The
 * direct wave too is fitted with a free intercept: field picks carry a trigger delay (the
 * time between the shot and the recorder's zero), and forcing the line through the origin
 * would make its slowness look 40–80 % better determined than it is. The line
 * covariances follow from ordinary least squares; depths depend on all lines above them,
 * and their variance is J C Jᵀ with J the Jacobian of the intercept-time depths (central
 * differences). Velocity σ_v = σ_p / p².
 */
import { countBetween, firstAtOrBeyond, branchOffset, type Branch, type Layout } from "./branches";
import { interceptTimeMethod, type ObservedLine } from "./interpretation";
import type { Pieces } from "./segments";

/** Offsets statistics of the picks on one segment. */
export interface PickStats {
  /** Number of picks. */
  readonly n: number;
  /** Σx, m. */
  readonly sum: number;
  /** Σx², m². */
  readonly sumSq: number;
}

/** Statistics of the branch's geophone offsets on an arrival's segment. */
export function pickStats(
  layout: Layout,
  branch: Branch,
  pieces: Pieces,
  arrival: number,
): PickStats {
  let n = 0;
  let sum = 0;
  let sumSq = 0;
  for (let i = 0; i < pieces.count; i++) {
    if (pieces.arrival[i] !== arrival) continue;
    const k0 = firstAtOrBeyond(layout, branch, pieces.from[i]);
    const count = countBetween(layout, branch, pieces.from[i], pieces.to[i]);
    for (let k = k0; k < k0 + count; k++) {
      const x = branchOffset(layout, branch, k);
      n++;
      sum += x;
      sumSq += x * x;
    }
  }
  return { n, sum, sumSq };
}

/** Covariance of a fitted line's intercept (s²) and slowness ((s/m)²). */
export interface LineCovariance {
  readonly varIntercept: number;
  readonly varSlowness: number;
  readonly covariance: number;
}

/**
 * Least-squares covariance of a line fitted to picks with error `sigma` (s). With
 * `throughOrigin` the intercept is fixed at 0. Infinite variances when the picks cannot
 * define the line (fewer than 2 picks, or 1 for a line through the origin).
 */
export function lineCovariance(
  stats: PickStats,
  sigma: number,
  throughOrigin = false,
): LineCovariance {
  const s2 = sigma * sigma;
  if (throughOrigin) {
    const varSlowness = stats.sumSq > 0 ? s2 / stats.sumSq : Infinity;
    return { varIntercept: 0, varSlowness, covariance: 0 };
  }
  const sxx = stats.sumSq - (stats.sum * stats.sum) / stats.n;
  if (!(stats.n >= 2 && sxx > 0))
    return { varIntercept: Infinity, varSlowness: Infinity, covariance: 0 };
  const mean = stats.sum / stats.n;
  return {
    varIntercept: (s2 * stats.sumSq) / (stats.n * sxx),
    varSlowness: s2 / sxx,
    covariance: (-s2 * mean) / sxx,
  };
}

/**
 * Covariance of the direct-wave line t = τ_0 + x/v_1 fitted with a free intercept τ_0 (the
 * trigger delay, s), from picks with error `sigma` (s). Only its slowness variance enters the
 * depths; the intercept absorbs the delay instead of biasing the slowness.
 */
export function directWaveCovariance(stats: PickStats, sigma: number): LineCovariance {
  return lineCovariance(stats, sigma, false);
}

/** Standard deviations of the interpreted velocities (top layer first) and refractor depths. */
export interface PropagatedUncertainty {
  /** σ of the interpreted velocity of the top layer and below each refractor, m/s. */
  readonly velocitySigma: number[];
  /** σ of the interpreted depth of each refractor, m. */
  readonly depthSigma: number[];
}

/**
 * Propagate line covariances to velocity and depth standard deviations. `directVariance`
 * is the variance of the direct-wave slowness; `covariances[j]` belongs to `refractors[j]`.
 */
export function propagateUncertainty(
  directSlowness: number,
  directVariance: number,
  refractors: readonly ObservedLine[],
  covariances: readonly LineCovariance[],
): PropagatedUncertainty {
  const k = refractors.length;
  const params = [directSlowness];
  for (const r of refractors) params.push(r.intercept, r.slowness);
  const depthsOf = (p: number[]): number[] => {
    const lines: ObservedLine[] = [];
    for (let j = 0; j < k; j++) lines.push({ intercept: p[1 + 2 * j], slowness: p[2 + 2 * j] });
    return interceptTimeMethod(p[0], lines).depths;
  };
  // Jacobian J[d][q] = ∂depth_d / ∂param_q by central differences
  const jac: number[][] = Array.from({ length: k }, () => new Array<number>(params.length).fill(0));
  for (let q = 0; q < params.length; q++) {
    const step = Math.abs(params[q]) * 1e-6 || 1e-12;
    const up = params.slice();
    const dn = params.slice();
    up[q] += step;
    dn[q] -= step;
    const du = depthsOf(up);
    const dd = depthsOf(dn);
    for (let d = 0; d < k; d++) jac[d][q] = (du[d] - dd[d]) / (2 * step);
  }
  // block-diagonal covariance of the parameters
  const cov = (a: number, b: number): number => {
    if (a === 0 || b === 0) return a === b ? directVariance : 0;
    const ja = Math.floor((a - 1) / 2);
    const jb = Math.floor((b - 1) / 2);
    if (ja !== jb) return 0;
    const c = covariances[ja];
    if (a !== b) return c.covariance;
    return a % 2 === 1 ? c.varIntercept : c.varSlowness;
  };
  const depthSigma: number[] = [];
  for (let d = 0; d < k; d++) {
    let v = 0;
    for (let a = 0; a < params.length; a++) {
      if (jac[d][a] === 0) continue;
      for (let b = 0; b < params.length; b++) {
        if (jac[d][b] === 0) continue;
        v += jac[d][a] * cov(a, b) * jac[d][b];
      }
    }
    depthSigma.push(Math.sqrt(Math.max(0, v)));
  }
  const velocitySigma = [Math.sqrt(directVariance) / (directSlowness * directSlowness)];
  refractors.forEach((r, j) => {
    velocitySigma.push(Math.sqrt(covariances[j].varSlowness) / (r.slowness * r.slowness));
  });
  return { velocitySigma, depthSigma };
}

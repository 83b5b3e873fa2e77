/**
 * What a practitioner would conclude from the first arrivals: the intercept-time method,
 * the crossover method for the first layer, and dip recovery from reversed shots.
 * Applied only to segments that are resolved, as if they were the whole model.
 */
import { cosFromSin, degrees } from "./numbers";

/** A straight first-arrival segment as read off the time–offset plot. */
export interface ObservedLine {
  /** Intercept time at zero offset, s. */
  readonly intercept: number;
  /** Slowness (1 / apparent velocity), s/m. */
  readonly slowness: number;
}

/** A flat layered model as interpreted by the intercept-time method. */
export interface InterceptTimeResult {
  /** Interpreted velocity of the top layer and below each observed refractor, m/s. */
  readonly velocities: number[];
  /** Interpreted vertical thickness of each layer above an observed refractor, m (NaN if impossible). */
  readonly thicknesses: number[];
  /** Interpreted depth to each observed refractor, m (NaN where it cannot be computed). */
  readonly depths: number[];
}

/**
 * Depths by the intercept-time method (Telford et al. 1990 §4.3; Kearey et al. 2002 ch. 5)
 * into preallocated arrays. `velocities[0]` is the top layer, `velocities[j]` (j ≥ 1) the
 * velocity below observed refractor j and `intercepts[j]` its intercept time (index 0
 * unused). Writes `thicknesses[0..k−1]` and `depths[1..k]` (depths[0] = 0). A refractor no
 * faster than every layer above cannot be interpreted: its depth (and those below) is NaN.
 */
export function interceptTimeDepths(
  velocities: ArrayLike<number>,
  intercepts: ArrayLike<number>,
  k: number,
  thicknesses: { [i: number]: number },
  depths: { [i: number]: number },
): void {
  depths[0] = 0;
  let ok = true;
  for (let j = 1; j <= k; j++) {
    const vj = velocities[j];
    let sum = 0;
    for (let i = 0; i < j - 1; i++) {
      const r = velocities[i] / vj;
      if (!(r < 1)) ok = false;
      sum += (2 * thicknesses[i] * cosFromSin(r)) / velocities[i];
    }
    const r = velocities[j - 1] / vj;
    if (!(r < 1)) ok = false;
    const h = ok ? ((intercepts[j] - sum) * velocities[j - 1]) / (2 * cosFromSin(r)) : NaN;
    thicknesses[j - 1] = h;
    depths[j] = depths[j - 1] + h;
  }
}

/**
 * Intercept-time interpretation of a direct-wave slowness and observed refractor lines in
 * depth order.
 */
export function interceptTimeMethod(
  directSlowness: number,
  refractors: readonly ObservedLine[],
): InterceptTimeResult {
  const k = refractors.length;
  const velocities = [1 / directSlowness, ...refractors.map((r) => 1 / r.slowness)];
  const intercepts = [0, ...refractors.map((r) => r.intercept)];
  const thicknesses = new Array<number>(k).fill(NaN);
  const depths = new Array<number>(k + 1).fill(0);
  interceptTimeDepths(velocities, intercepts, k, thicknesses, depths);
  return { velocities, thicknesses, depths: depths.slice(1) };
}

/**
 * Crossover method for the first layer (Kearey, Brooks & Hill 2002 ch. 5):
 * h = (x_co / 2) √((v2 − v1)/(v2 + v1)), with x_co where the direct-wave line meets the
 * first refractor line. Returns NaN values when the refractor is not faster.
 */
export function crossoverMethod(
  directSlowness: number,
  first: ObservedLine,
): { distance: number; thickness: number } {
  const distance = first.intercept / (directSlowness - first.slowness);
  const v1 = 1 / directSlowness;
  const v2 = 1 / first.slowness;
  if (!(v2 > v1) || !(distance > 0)) return { distance: NaN, thickness: NaN };
  return { distance, thickness: (distance / 2) * Math.sqrt((v2 - v1) / (v2 + v1)) };
}

/** True velocity and dip of a refractor recovered from reversed apparent velocities. */
export interface DipRecovery {
  /** Recovered refractor velocity, m/s. */
  readonly velocity: number;
  /** Recovered dip, degrees, positive when deepening towards increasing position. */
  readonly dip: number;
  /** Recovered critical angle, degrees. */
  readonly criticalAngle: number;
}

/**
 * Reversed-profile dip formulas (Telford et al. 1990 §4.3.3): with v_1 the velocity above,
 * down-dip v_d = v_1 / sin(θ_c + φ) and up-dip v_u = v_1 / sin(θ_c − φ), so
 * θ_c = ½[asin(v_1/v_d) + asin(v_1/v_u)], φ = ½[asin(v_1/v_d) − asin(v_1/v_u)].
 * `forwardSlowness` is measured shooting towards increasing position, `reverseSlowness`
 * towards decreasing position. Exact for a planar refractor under flat layers.
 * Returns null when an apparent velocity is not faster than `velocityAbove`.
 */
export function recoverDip(
  velocityAbove: number,
  forwardSlowness: number,
  reverseSlowness: number,
): DipRecovery | null {
  const sf = velocityAbove * forwardSlowness;
  const sr = velocityAbove * reverseSlowness;
  if (!(sf > 0 && sf < 1 && sr > 0 && sr < 1)) return null;
  const af = Math.asin(sf);
  const ar = Math.asin(sr);
  const theta = (af + ar) / 2;
  const phi = (af - ar) / 2;
  return {
    velocity: velocityAbove / Math.sin(theta),
    dip: degrees(phi),
    criticalAngle: degrees(theta),
  };
}

/**
 * Dip and velocity of a refractor under other dipping planar interfaces, from the apparent
 * slownesses of a reversed pair of shots (the layer-by-layer method of Adachi 1954 and
 * Johnson 1976, Geophysics 41; Sheriff & Geldart 1995 §11.3.2).
 *
 * Each apparent slowness p (s/m, measured along the flat surface) fixes the emerging head-wave
 * ray in the top layer: its slowness vector has horizontal component p and length 1/v_1.
 * Followed back down through the interfaces already recovered (Snell's law: the component
 * along each interface is kept), it gives the ray's slowness vector S in the layer just above
 * the refractor. Both rays (shooting towards + and − position) leave the refractor at the
 * critical angle, so their components along the refractor are +1/v_m and −1/v_m: the
 * refractor's tangent t̂ is perpendicular to S_f + S_r and v_m = 1/(S_f · t̂). With one layer
 * above this is the familiar θ_c = ½[asin(v_1 p_f) + asin(v_1 p_r)],
 * φ = ½[asin(v_1 p_f) − asin(v_1 p_r)] (Telford, Geldart & Sheriff 1990 §4.3.3).
 *
 * Geometry: x along the line, z depth (down); a dip is positive when the interface deepens
 * towards increasing position.
 */
import type { DipRecovery } from "./interpretation";

const DEG = Math.PI / 180;

/**
 * Refracts an up-going slowness vector (sx, sz; sz < 0) from the layer above an interface of
 * slope `slope` (tan dip) into the layer below (velocity `vBelow`, m/s), keeping the component
 * along the interface. Null when the ray cannot exist below (evanescent) or turns down.
 */
function refractDown(
  sx: number,
  sz: number,
  slope: number,
  vBelow: number,
): [number, number] | null {
  const norm = Math.hypot(1, slope);
  const tx = 1 / norm;
  const tz = slope / norm;
  const nx = -tz;
  const nz = tx; // downward normal
  const st = sx * tx + sz * tz;
  const sn = sx * nx + sz * nz;
  if (!(sn < 0)) return null;
  const q = 1 / vBelow;
  const sn2 = (q - st) * (q + st);
  if (!(sn2 > 0)) return null;
  const snBelow = -Math.sqrt(sn2);
  return [st * tx + snBelow * nx, st * tz + snBelow * nz];
}

/**
 * Recovers the velocity (m/s), dip (degrees) and critical angle (degrees) of refractor m from
 * the recovered layers above it.
 *
 * @param velocities velocities of the layers above the refractor, top first (m/s; length m ≥ 1)
 * @param dips dips of the interfaces between those layers, degrees: `dips[k]` is the base of
 *   layer k (0-based), for k = 0 … m − 2 (the refractor's own dip is what is recovered)
 * @param forwardSlowness apparent slowness shooting towards increasing position, s/m
 * @param reverseSlowness apparent slowness shooting towards decreasing position, s/m
 * @returns null when the slownesses cannot come from a head wave under these layers
 * @throws RangeError when the dips do not match the velocities (m − 1 of them)
 */
export function recoverDipLayered(
  velocities: readonly number[],
  dips: readonly number[],
  forwardSlowness: number,
  reverseSlowness: number,
): DipRecovery | null {
  const m = velocities.length;
  if (m < 1 || dips.length !== m - 1) {
    throw new RangeError(
      `dip recovery needs one dip per interface above the refractor (${Math.max(0, m - 1)}), got ${dips.length}`,
    );
  }
  const v1 = velocities[0];
  const trace = (p: number, sign: 1 | -1): [number, number] | null => {
    // emerging ray in the top layer: horizontal component sign·p, going up (z decreasing).
    // p may be 0 or negative: steep up-dip, the apparent velocity is infinite or reversed.
    const sx = sign * p;
    const sz2 = 1 / (v1 * v1) - sx * sx;
    if (!Number.isFinite(p) || !(sz2 > 0)) return null;
    let s: [number, number] | null = [sx, -Math.sqrt(sz2)];
    for (let k = 1; k < m && s; k++) {
      s = refractDown(s[0], s[1], Math.tan(dips[k - 1] * DEG), velocities[k]);
    }
    return s;
  };
  const f = trace(forwardSlowness, 1);
  const r = trace(reverseSlowness, -1);
  if (!f || !r) return null;
  // upward normal ∝ S_f + S_r; tangent perpendicular to it, pointing towards + position
  const ux = f[0] + r[0];
  const uz = f[1] + r[1];
  const un = Math.hypot(ux, uz);
  if (!(un > 0) || !(uz < 0)) return null;
  const tx = -uz / un;
  const tz = ux / un;
  const along = f[0] * tx + f[1] * tz;
  const vAbove = velocities[m - 1];
  if (!(along > 0) || !(along * vAbove < 1)) return null;
  return {
    velocity: 1 / along,
    dip: Math.atan2(tz, tx) / DEG,
    criticalAngle: Math.asin(along * vAbove) / DEG,
  };
}

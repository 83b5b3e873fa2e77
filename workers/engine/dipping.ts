/**
 * Head waves under planar dipping interfaces, traced exactly.
 *
 * The critical ray leaves the refractor (top of layer m) at the critical angle
 * θ = asin(v_{m−1}/v_m) measured from the refractor's normal, travelling along the refractor
 * in the branch direction. Snell's law (continuity of the slowness component along each
 * planar interface) fixes its direction in every layer above, so every head-wave ray of one
 * branch is made of parallel legs. The classic multi-layer dipping-layer solution (Telford,
 * Geldart & Sheriff 1990 §4.3; Palmer 1986; Adachi 1954) follows: t(offset) is a straight
 * line whose intercept and slope come from tracing the down-going leg from the shot and the
 * up-going leg back from the geophone. With every dip 0 this reduces to the flat formulas.
 *
 * Geometry: x = position along the line (m), z = depth (m, downwards). Interface k has unit
 * tangent t̂ = (1, s)/√(1+s²) and downward normal n̂ = (−s, 1)/√(1+s²), s = tan(dip).
 */
import type { Earth } from "./geometry";
import type { LineSet } from "./lines";
import { cosFromSin } from "./numbers";

/** The fixed ray directions of one refractor's head wave on one side. */
export interface CriticalRay {
  /** False when no critical ray reaches the surface on this side (or the rule fails). */
  readonly ok: boolean;
  /** Unit direction (dx, dz) of the down-going leg in layers 0..m−1 (2 numbers per layer). */
  readonly down: Float64Array;
  /** Unit direction of the up-going leg reversed (pointing down), layers 0..m−1. */
  readonly back: Float64Array;
  /** Apparent slowness along the offset, s/m. */
  readonly slowness: number;
  /** Unit tangent of the refractor. */
  readonly tx: number;
  readonly tz: number;
  /** d(B·t̂)/d(geophone position) for the up-leg foot B (1 for flat layers). */
  readonly footRate: number;
}

const NO_RAY: CriticalRay = {
  ok: false,
  down: new Float64Array(0),
  back: new Float64Array(0),
  slowness: NaN,
  tx: 1,
  tz: 0,
  footRate: NaN,
};

function unitTangent(slope: number): [number, number] {
  const norm = Math.hypot(1, slope);
  return [1 / norm, slope / norm];
}

/**
 * Refract a slowness vector (sx, sz) in the layer below interface k into the layer above
 * (velocity vAbove), keeping the tangential component (Snell's law). `downward` selects
 * the branch of the normal component. Returns null when the ray is evanescent above or does
 * not travel the expected way across the interface.
 */
function refractUp(
  sx: number,
  sz: number,
  slope: number,
  vAbove: number,
  downward: boolean,
): [number, number] | null {
  const [tx, tz] = unitTangent(slope);
  const nx = -tz;
  const nz = tx;
  const sn = sx * nx + sz * nz;
  if (downward ? !(sn > 0) : !(sn < 0)) return null;
  const st = sx * tx + sz * tz;
  const q = 1 / vAbove;
  const sn2 = (q - st) * (q + st);
  if (!(sn2 >= 0)) return null;
  const snAbove = (downward ? 1 : -1) * Math.sqrt(sn2);
  return [st * tx + snAbove * nx, st * tz + snAbove * nz];
}

/**
 * Trace from the surface point (x0, 0) along fixed unit directions `dirs` (dz > 0) through
 * layers 0..m−1 to interface m. Writes [x, z, time] of the arrival point into `out` and
 * optionally pushes every crossing point into `points`.
 */
export function traceDown(
  earth: Earth,
  dirs: Float64Array,
  m: number,
  x0: number,
  out: Float64Array,
  points?: [number, number][],
): void {
  let x = x0;
  let z = 0;
  let t = 0;
  for (let j = 0; j < m; j++) {
    const dx = dirs[2 * j];
    const dz = dirs[2 * j + 1];
    const k = j + 1;
    const s = earth.slope[k];
    const lambda = (earth.depthAtZero[k] + x * s - z) / (dz - dx * s);
    x += lambda * dx;
    z += lambda * dz;
    t += lambda / earth.velocity[j];
    points?.push([x, z]);
  }
  out[0] = x;
  out[1] = z;
  out[2] = t;
}

/**
 * The critical ray of the head wave along the top of layer m (0-based, m ≥ 1) for waves
 * travelling towards increasing position (sign +1, forward branch) or decreasing position
 * (sign −1, reverse branch). `ruleOk` is the head-wave existence rule for layer m.
 */
export function criticalRay(earth: Earth, m: number, sign: 1 | -1, ruleOk: boolean): CriticalRay {
  if (!ruleOk || m < 1 || m >= earth.layerCount) return NO_RAY;
  const v = earth.velocity;
  const [tx, tz] = unitTangent(earth.slope[m]);
  const nx = -tz;
  const nz = tx;
  const sinC = v[m - 1] / v[m];
  const cosC = cosFromSin(sinC);
  const q = 1 / v[m - 1];
  // slowness vectors in layer m−1
  let dsx = q * (cosC * nx + sign * sinC * tx);
  let dsz = q * (cosC * nz + sign * sinC * tz);
  let usx = q * (-cosC * nx + sign * sinC * tx);
  let usz = q * (-cosC * nz + sign * sinC * tz);
  const down = new Float64Array(2 * m);
  const back = new Float64Array(2 * m);
  for (let j = m - 1; j >= 0; j--) {
    down[2 * j] = dsx * v[j];
    down[2 * j + 1] = dsz * v[j];
    back[2 * j] = -usx * v[j];
    back[2 * j + 1] = -usz * v[j];
    if (j === 0) break;
    const d = refractUp(dsx, dsz, earth.slope[j], v[j - 1], true);
    const u = refractUp(usx, usz, earth.slope[j], v[j - 1], false);
    if (!d || !u) return NO_RAY;
    [dsx, dsz] = d;
    [usx, usz] = u;
  }
  // both legs must cross the surface (layer 0) going down / coming up
  if (!(down[1] > 0) || !(back[1] > 0)) return NO_RAY;
  // foot of the up-going leg moves with the geophone at this rate along the refractor
  const a = new Float64Array(3);
  const b = new Float64Array(3);
  const scale = Math.max(1, earth.depthAtZero[m]);
  traceDown(earth, back, m, 0, a);
  traceDown(earth, back, m, scale, b);
  const footRate = ((b[0] - a[0]) * tx + (b[1] - a[1]) * tz) / scale;
  if (!(footRate > 0)) return NO_RAY;
  return { ok: true, down, back, slowness: sign * usx, tx, tz, footRate };
}

/** Critical rays of every refractor on one side (index m; index 0 unused). */
export function criticalRays(earth: Earth, sign: 1 | -1, rule: Uint8Array): CriticalRay[] {
  const rays: CriticalRay[] = [NO_RAY];
  for (let m = 1; m < earth.layerCount; m++) rays.push(criticalRay(earth, m, sign, rule[m] === 1));
  return rays;
}

const scratchA = new Float64Array(3);
const scratchB = new Float64Array(3);

/**
 * Fill `out` with the head-wave lines of a shot at position `shot` (m) on one side, from
 * precomputed critical rays. The direct wave (index 0) is t = offset / v_0 from offset 0.
 */
export function dippingLines(
  earth: Earth,
  rays: CriticalRay[],
  shot: number,
  sign: 1 | -1,
  out: LineSet,
): LineSet {
  out.exists[0] = 1;
  out.intercept[0] = 0;
  out.slowness[0] = 1 / earth.velocity[0];
  out.start[0] = 0;
  for (let m = 1; m < earth.layerCount; m++) {
    const ray = rays[m];
    if (!ray.ok) {
      out.exists[m] = 0;
      out.intercept[m] = NaN;
      out.slowness[m] = NaN;
      out.start[m] = NaN;
      continue;
    }
    traceDown(earth, ray.down, m, shot, scratchA);
    traceDown(earth, ray.back, m, shot, scratchB);
    // signed distance along the refractor from A (down-leg foot) to B (up-leg foot)
    const along =
      sign * ((scratchB[0] - scratchA[0]) * ray.tx + (scratchB[1] - scratchA[1]) * ray.tz);
    out.exists[m] = 1;
    out.intercept[m] = scratchA[2] + scratchB[2] + along / earth.velocity[m];
    out.slowness[m] = ray.slowness;
    out.start[m] = Math.max(0, -along / ray.footRate);
  }
  return out;
}

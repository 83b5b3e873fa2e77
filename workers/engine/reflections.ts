/**
 * Reflections from each interface.
 *
 * Flat layers, parametric in the ray parameter p (Telford et al. 1990 §4.2; design.md):
 * for the reflection from the top of layer m with p < 1 / max(v_0..v_{m−1}),
 *   x(p) = Σ_{i<m} 2 h_i p v_i / √(1 − p² v_i²),   t(p) = Σ_{i<m} 2 h_i / (v_i √(1 − p² v_i²)).
 * x(p) increases from 0 to ∞, so each offset has one p, found by safeguarded Newton steps.
 * Dipping planar interfaces: rays are shot from the source over a fan of take-off angles,
 * refracted (Snell's law) down to the reflector, reflected and refracted back up; the
 * emergence point is bracketed on the fan and refined by bisection.
 */
import type { Earth } from "./geometry";

/** Offset (m) and time (s) of the flat reflection from the top of layer m for ray parameter p. */
export function flatReflectionAt(
  earth: Earth,
  m: number,
  p: number,
): { x: number; t: number; dxdp: number } {
  let x = 0;
  let t = 0;
  let dxdp = 0;
  for (let i = 0; i < m; i++) {
    const h = earth.depthAtZero[i + 1] - earth.depthAtZero[i];
    const v = earth.velocity[i];
    const pv = p * v;
    const c2 = (1 - pv) * (1 + pv);
    const c = Math.sqrt(c2);
    x += (2 * h * pv) / c;
    t += (2 * h) / (v * c);
    dxdp += (2 * h * v) / (c2 * c);
  }
  return { x, t, dxdp };
}

/** Time (s) of the flat reflection from the top of layer m (0-based, ≥ 1) at offset ≥ 0, m. */
export function flatReflectionTime(earth: Earth, m: number, offset: number): number {
  let vmax = 0;
  for (let i = 0; i < m; i++) vmax = Math.max(vmax, earth.velocity[i]);
  if (offset === 0) return flatReflectionAt(earth, m, 0).t;
  let lo = 0;
  let hi = 1 / vmax;
  let p = 0.5 * hi;
  for (let iter = 0; iter < 200; iter++) {
    const r = flatReflectionAt(earth, m, p);
    const f = r.x - offset;
    if (Math.abs(f) <= 1e-13 * Math.max(1, offset)) return r.t;
    if (f > 0) hi = p;
    else lo = p;
    let next = p - f / r.dxdp;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (next === p || hi - lo <= 1e-18 * hi) return flatReflectionAt(earth, m, next).t;
    p = next;
  }
  return flatReflectionAt(earth, m, p).t;
}

function unit(slope: number): [number, number] {
  const norm = Math.hypot(1, slope);
  return [1 / norm, slope / norm];
}

/**
 * Shoot one reflection ray from (x0, 0) at take-off angle `beta` (radians from vertical,
 * positive towards increasing position) to the top of layer m. Returns [emergence x, time]
 * or null when the ray does not return to the surface. Optional `points` collects the path.
 */
export function shootReflection(
  earth: Earth,
  m: number,
  x0: number,
  beta: number,
  points?: [number, number][],
): [number, number] | null {
  const v = earth.velocity;
  let sx = Math.sin(beta) / v[0];
  let sz = Math.cos(beta) / v[0];
  let x = x0;
  let z = 0;
  let t = 0;
  points?.push([x, z]);
  // down through layers 0..m−1
  for (let j = 0; j < m; j++) {
    const k = j + 1;
    const [tx, tz] = unit(earth.slope[k]);
    const nx = -tz;
    const nz = tx;
    if (!(sx * nx + sz * nz > 0)) return null;
    const dx = sx * v[j];
    const dz = sz * v[j];
    const lambda = (earth.depthAtZero[k] + x * earth.slope[k] - z) / (dz - dx * earth.slope[k]);
    if (!(lambda > 0)) return null;
    x += lambda * dx;
    z += lambda * dz;
    t += lambda / v[j];
    points?.push([x, z]);
    if (k === m) {
      const sn = sx * nx + sz * nz;
      sx -= 2 * sn * nx;
      sz -= 2 * sn * nz;
    } else {
      const st = sx * tx + sz * tz;
      const q = 1 / v[k];
      const sn2 = (q - st) * (q + st);
      if (!(sn2 >= 0)) return null;
      const sn = Math.sqrt(sn2);
      sx = st * tx + sn * nx;
      sz = st * tz + sn * nz;
    }
  }
  // back up through layers m−1..0
  for (let j = m - 1; j >= 0; j--) {
    const dx = sx * v[j];
    const dz = sz * v[j];
    if (!(dz < 0)) return null;
    let lambda: number;
    if (j === 0) lambda = -z / dz;
    else {
      const s = earth.slope[j];
      lambda = (earth.depthAtZero[j] + x * s - z) / (dz - dx * s);
    }
    if (!(lambda > 0)) return null;
    x += lambda * dx;
    z += lambda * dz;
    t += lambda / v[j];
    points?.push([x, j === 0 ? 0 : z]);
    if (j === 0) break;
    const [tx, tz] = unit(earth.slope[j]);
    const nx = -tz;
    const nz = tx;
    if (!(sx * nx + sz * nz < 0)) return null;
    const st = sx * tx + sz * tz;
    const q = 1 / v[j - 1];
    const sn2 = (q - st) * (q + st);
    if (!(sn2 >= 0)) return null;
    const sn = -Math.sqrt(sn2);
    sx = st * tx + sn * nx;
    sz = st * tz + sn * nz;
  }
  return [x, t];
}

const FAN = 721;

/**
 * A solver for the reflection from the top of layer m (0-based, ≥ 1) for a shot at `shot`
 * (m). The returned function gives the reflection time (s) at geophone position x (m), or
 * NaN where no reflected ray emerges. Flat models use the ray-parameter solution.
 */
export function reflectionSolver(earth: Earth, m: number, shot: number): (x: number) => number {
  if (!earth.dipping) return (x) => flatReflectionTime(earth, m, Math.abs(x - shot));
  const betas = new Float64Array(FAN);
  const xs = new Float64Array(FAN);
  const ok = new Uint8Array(FAN);
  const limit = (Math.PI / 2) * (1 - 1e-9);
  for (let i = 0; i < FAN; i++) {
    const beta = -limit + (2 * limit * i) / (FAN - 1);
    betas[i] = beta;
    const r = shootReflection(earth, m, shot, beta);
    if (r) {
      ok[i] = 1;
      xs[i] = r[0];
    }
  }
  return (target) => {
    let best = NaN;
    for (let i = 0; i + 1 < FAN; i++) {
      if (!ok[i] || !ok[i + 1]) continue;
      const fa = xs[i] - target;
      const fb = xs[i + 1] - target;
      if (fa === 0) {
        const r = shootReflection(earth, m, shot, betas[i]);
        if (r && !(r[1] >= best)) best = r[1];
        continue;
      }
      if (fa * fb > 0) continue;
      let a = betas[i];
      let b = betas[i + 1];
      let flo = fa;
      for (let it = 0; it < 80; it++) {
        const mid = 0.5 * (a + b);
        const r = shootReflection(earth, m, shot, mid);
        if (!r) break;
        const f = r[0] - target;
        if (f === 0) {
          a = b = mid;
          break;
        }
        if (f * flo > 0) {
          a = mid;
          flo = f;
        } else b = mid;
      }
      const r = shootReflection(earth, m, shot, 0.5 * (a + b));
      if (r && !(r[1] >= best)) best = r[1];
    }
    return best;
  };
}

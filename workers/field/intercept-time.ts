/**
 * Flat-layer intercept-time interpretation (Telford, Geldart & Sheriff 1990, Applied
 * Geophysics 2nd ed., §4.3): with layer velocities v_1 < v_2 < … and the intercept time
 * t_i,n of the head wave from the top of layer n,
 *   t_i,n = Σ_{i<n} 2 h_i cos θ_in / v_i,   sin θ_in = v_i / v_n,
 * solved layer by layer for the thicknesses:
 *   h_{n−1} = (t_i,n − Σ_{i<n−1} 2 h_i cos θ_in / v_i) · v_{n−1} / (2 cos θ_{n−1,n});
 * for two layers h_1 = t_i v_1 v_2 / (2 √(v_2² − v_1²)).
 * Standard errors are propagated to first order (J C Jᵀ) from each segment's least-squares
 * covariance: a segment's velocity and intercept come from one line fit and are correlated, so
 * their covariance is kept (as the planner does, workers/engine/uncertainty.ts); different
 * segments are independent.
 */

/** One straight segment of the time–offset plot, as fitted. */
export interface InterpretedSegment {
  /** Apparent velocity, m/s. */
  velocity: number;
  /** Intercept time, s. */
  intercept: number;
  velocityError?: number | null;
  interceptError?: number | null;
  /** Covariance of velocity and intercept from the same line fit, m (m/s · s); 0 when absent. */
  velocityInterceptCovariance?: number | null;
}

/** One layer of the interpretation. */
export interface InterpretedLayer {
  /** m/s */
  velocity: number;
  velocityError: number | null;
  /** Depth of the layer's top, m. */
  depth: number;
  depthError: number | null;
  /** m; null for the deepest layer (half-space). */
  thickness: number | null;
  thicknessError: number | null;
}

/** The layered interpretation, or why there is none. */
export type InterceptTimeResult =
  { ok: true; layers: InterpretedLayer[]; notes: string[] } | { ok: false; reason: string };

function thicknesses(v: number[], t: number[]): number[] | string {
  const h: number[] = [];
  for (let n = 1; n < v.length; n++) {
    let above = 0;
    for (let i = 0; i < n - 1; i++) above += (2 * h[i] * Math.sqrt(1 - (v[i] / v[n]) ** 2)) / v[i];
    const cos = Math.sqrt(1 - (v[n - 1] / v[n]) ** 2);
    const hn = ((t[n] - above) * v[n - 1]) / (2 * cos);
    if (!(hn > 0)) {
      return `the intercept times give a thickness of ${hn.toFixed(2)} m for layer ${n}: segment ${n + 1} is inconsistent with those above it (a blind layer, a segment assigned to the wrong refractor, or a dipping refractor)`;
    }
    h.push(hn);
  }
  return h;
}

/**
 * Interprets segments as flat layers: segment 1 is the direct wave (its velocity is v_1; its
 * intercept should be about 0), segment k ≥ 2 the head wave from the top of layer k.
 * Velocities must increase from segment to segment: a velocity inversion produces no head
 * wave and cannot be interpreted from first arrivals.
 * @throws RangeError for fewer than two segments or a non-finite or non-positive value
 */
export function interceptTimeDepths(segments: readonly InterpretedSegment[]): InterceptTimeResult {
  if (segments.length < 2)
    throw new RangeError("the intercept-time method needs at least two segments");
  segments.forEach((s, i) => {
    if (!(Number.isFinite(s.velocity) && s.velocity > 0) || !Number.isFinite(s.intercept)) {
      throw new RangeError(
        `segment ${i + 1} needs a positive velocity and a finite intercept time`,
      );
    }
  });
  const v = segments.map((s) => s.velocity);
  const t = segments.map((s) => s.intercept);
  for (let k = 1; k < v.length; k++) {
    if (!(v[k] > v[k - 1])) {
      return {
        ok: false,
        reason: `segment ${k + 1} (${Math.round(v[k])} m/s) is not faster than segment ${k} (${Math.round(v[k - 1])} m/s): the intercept-time method needs velocities that increase with depth`,
      };
    }
  }
  const h = thicknesses(v, t);
  if (typeof h === "string") return { ok: false, reason: h };

  // First-order propagation: Jacobians of thicknesses and depths over each segment's velocity
  // and intercept by central differences, then J C Jᵀ with C the segment's 2×2 covariance.
  const n = v.length;
  const varH = new Array<number>(n - 1).fill(0);
  const varDepth = new Array<number>(n).fill(0);
  let propagated = false;
  let complete = true;
  const derivative = (k: number, isVelocity: boolean): number[] | null => {
    const values = isVelocity ? v : t;
    const step = Math.max(Math.abs(values[k]) * 1e-6, 1e-9);
    const up = values.slice();
    const down = values.slice();
    up[k] += step;
    down[k] -= step;
    const hu = isVelocity ? thicknesses(up, t) : thicknesses(v, up);
    const hd = isVelocity ? thicknesses(down, t) : thicknesses(v, down);
    if (typeof hu === "string" || typeof hd === "string") return null;
    return hu.map((_, j) => (hu[j] - hd[j]) / (2 * step));
  };
  const positive = (x: number | null | undefined): number =>
    x === null || x === undefined || !(x > 0) ? 0 : x;
  segments.forEach((s, k) => {
    const sv = positive(s.velocityError);
    const st = positive(s.interceptError);
    if (sv === 0 && st === 0) return;
    const cvt = sv > 0 && st > 0 ? (s.velocityInterceptCovariance ?? 0) : 0;
    const dv = sv > 0 ? derivative(k, true) : new Array<number>(n - 1).fill(0);
    const dt = st > 0 ? derivative(k, false) : new Array<number>(n - 1).fill(0);
    if (!dv || !dt) {
      complete = false;
      return;
    }
    let depthDv = 0;
    let depthDt = 0;
    for (let j = 0; j < n - 1; j++) {
      varH[j] += dv[j] ** 2 * sv ** 2 + 2 * dv[j] * dt[j] * cvt + dt[j] ** 2 * st ** 2;
      depthDv += dv[j];
      depthDt += dt[j];
      varDepth[j + 1] +=
        depthDv ** 2 * sv ** 2 + 2 * depthDv * depthDt * cvt + depthDt ** 2 * st ** 2;
    }
    propagated = true;
  });
  const haveErrors = propagated && complete;

  const layers: InterpretedLayer[] = [];
  let depth = 0;
  for (let k = 0; k < n; k++) {
    layers.push({
      velocity: v[k],
      velocityError: segments[k].velocityError ?? null,
      depth,
      depthError: k === 0 ? 0 : haveErrors ? Math.sqrt(Math.max(0, varDepth[k])) : null,
      thickness: k < n - 1 ? h[k] : null,
      thicknessError: k < n - 1 && haveErrors ? Math.sqrt(Math.max(0, varH[k])) : null,
    });
    if (k < n - 1) depth += h[k];
  }
  const notes: string[] = [];
  const t0 = segments[0].intercept;
  const t0Error = segments[0].interceptError ?? 0;
  if (Math.abs(t0) > Math.max(0.0005, 3 * t0Error)) {
    notes.push(
      `the direct-wave segment has an intercept of ${(t0 * 1000).toFixed(1)} ms, not about 0: check the trigger delay or the segment's range`,
    );
  }
  if (!complete)
    notes.push("standard errors were left out: a perturbed segment made the layers inconsistent");
  return { ok: true, layers, notes };
}

/**
 * Local least-squares slopes of a time function along the line: the refractor velocity along
 * the line comes from the slope of the minus times (plus-minus: slope 2/v) or of the velocity
 * analysis function (generalized reciprocal method: slope 1/v), fitted over a moving window
 * of neighbouring stations (common practice). Positions m, times s.
 */

/** A slope at a station with its standard error. */
export interface LocalSlope {
  /** m */
  position: number;
  /** s/m */
  slope: number;
  /** s/m; null when the window holds only two stations */
  slopeError: number | null;
}

/** Least-squares slope and its error from `sigma` (s) per value, or null. */
export function fitSlope(
  xs: readonly number[],
  ts: readonly number[],
  sigma: number,
): { slope: number; intercept: number; slopeError: number } | null {
  const n = xs.length;
  if (n < 2) return null;
  const mx = xs.reduce((a, b) => a + b, 0) / n;
  const mt = ts.reduce((a, b) => a + b, 0) / n;
  let sxx = 0;
  let sxt = 0;
  for (let i = 0; i < n; i++) {
    sxx += (xs[i] - mx) ** 2;
    sxt += (xs[i] - mx) * (ts[i] - mt);
  }
  if (!(sxx > 0)) return null;
  const slope = sxt / sxx;
  return { slope, intercept: mt - slope * mx, slopeError: sigma / Math.sqrt(sxx) };
}

/**
 * Slope at every station from a least-squares line through the `window` stations centred on it
 * (shifted inwards at the ends). `sigma` is the error of one value, s.
 * @throws RangeError for a window below 2
 */
export function localSlopes(
  xs: readonly number[],
  ts: readonly number[],
  window: number,
  sigma: number,
): LocalSlope[] {
  if (!(Number.isInteger(window) && window >= 2)) {
    throw new RangeError("the velocity window must hold at least 2 stations");
  }
  const n = xs.length;
  const out: LocalSlope[] = [];
  const w = Math.min(window, n);
  for (let i = 0; i < n; i++) {
    let from = Math.max(0, i - Math.floor(w / 2));
    from = Math.min(from, n - w);
    const fit = fitSlope(xs.slice(from, from + w), ts.slice(from, from + w), sigma);
    if (!fit) continue;
    out.push({ position: xs[i], slope: fit.slope, slopeError: w > 2 ? fit.slopeError : null });
  }
  return out;
}

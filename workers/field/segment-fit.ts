/**
 * Straight-line fits to time–offset segments chosen by the user: t = intercept + offset/v by
 * least squares, with standard errors from the scatter about the line (common practice; e.g.
 * Kearey, Brooks & Hill 2002 ch. 5 for the reading of slope and intercept).
 */

/** A first break at an offset from its shot. */
export interface OffsetPoint {
  /** |geophone − shot|, m. */
  offset: number;
  /** First-break time, s. */
  time: number;
}

/** A fitted segment, or why there is none. */
export type SegmentFit =
  | {
      ok: true;
      /** Offset range the user chose, m. */
      range: [number, number];
      /** Picks inside the range. */
      count: number;
      /** Slowness, s/m. */
      slope: number;
      /** Intercept time at zero offset, s. */
      intercept: number;
      /** Apparent velocity 1/slope, m/s. */
      velocity: number;
      /** Standard errors (from the residual scatter, n − 2 degrees of freedom); null with 2 picks. */
      slopeError: number | null;
      interceptError: number | null;
      velocityError: number | null;
      /**
       * Covariance of slope and intercept of the one fit, s²/m (−s² x̄ / Sxx); null with 2 picks.
       */
      slopeInterceptCovariance: number | null;
      /** The same as a covariance of velocity and intercept, m (−cov / slope²); null with 2 picks. */
      velocityInterceptCovariance: number | null;
      /** RMS of the residuals about the line, s. */
      rms: number;
    }
  | { ok: false; range: [number, number]; count: number; reason: string };

/**
 * Fits a line to the points whose offset lies in `range` (ends included).
 * @throws RangeError when the range is not two finite offsets in increasing order
 */
export function fitSegment(
  points: readonly OffsetPoint[],
  range: readonly [number, number],
): SegmentFit {
  const [lo, hi] = range;
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || hi < lo) {
    throw new RangeError(
      "segment range must be two finite offsets, the first not above the second",
    );
  }
  const r: [number, number] = [lo, hi];
  const inside = points.filter(
    (p) =>
      Number.isFinite(p.offset) &&
      Number.isFinite(p.time) &&
      p.offset >= lo - 1e-9 &&
      p.offset <= hi + 1e-9,
  );
  const n = inside.length;
  if (n < 2)
    return {
      ok: false,
      range: r,
      count: n,
      reason: `the range holds ${n} pick(s); a line needs 2`,
    };
  let mx = 0;
  let mt = 0;
  for (const p of inside) {
    mx += p.offset / n;
    mt += p.time / n;
  }
  let sxx = 0;
  let sxt = 0;
  for (const p of inside) {
    sxx += (p.offset - mx) ** 2;
    sxt += (p.offset - mx) * (p.time - mt);
  }
  if (!(sxx > 0))
    return { ok: false, range: r, count: n, reason: "all picks in the range share one offset" };
  const slope = sxt / sxx;
  const intercept = mt - slope * mx;
  if (!(slope > 0)) {
    return {
      ok: false,
      range: r,
      count: n,
      reason: "time does not increase with offset in this range",
    };
  }
  let sse = 0;
  for (const p of inside) sse += (p.time - intercept - slope * p.offset) ** 2;
  const s2 = n > 2 ? sse / (n - 2) : null;
  const slopeError = s2 === null ? null : Math.sqrt(s2 / sxx);
  return {
    ok: true,
    range: r,
    count: n,
    slope,
    intercept,
    velocity: 1 / slope,
    slopeError,
    interceptError: s2 === null ? null : Math.sqrt(s2 * (1 / n + (mx * mx) / sxx)),
    velocityError: slopeError === null ? null : slopeError / (slope * slope),
    slopeInterceptCovariance: s2 === null ? null : (-s2 * mx) / sxx,
    velocityInterceptCovariance: s2 === null ? null : (s2 * mx) / sxx / (slope * slope),
    rms: Math.sqrt(sse / n),
  };
}

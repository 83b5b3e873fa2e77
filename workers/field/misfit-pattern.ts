/**
 * Misfit patterns that suggest the plan's ground model missed something, per shot and side:
 * - a run of consecutive picks systematically early or late against the model (each residual
 *   beyond 2σ of the pick error; at least `minPicks` in a row), named with its offset range;
 * - slope changes (breaks) in the observed times that the model does not have, or that the
 *   model has and the picks do not. Both show as kinks in the residuals (observed − modelled),
 *   which are straight and flat where picks and model agree. Kinks come from an optimal
 *   piecewise-straight split of the residuals (least squares, a BIC-style penalty of 3·ln n
 *   per piece, pieces of at least `minPicks`); one counts when the slope changes by more than
 *   four standard errors and by more than 15 % of the local slowness. It is an extra break
 *   when the picks' slope changes more than the model's across it, else a missing one.
 * - single picks far off the trend of their neighbours (outliers: a mis-pick or a noisy trace),
 *   named on their own and left out of the two checks above, so one bad pick never reads as
 *   a missed layer. A pick is an outlier when it lies more than 5σ (σ the larger of the pick
 *   error and 1.4826·MAD of the neighbours about their own line) from the straight line
 *   through up to two neighbours on each side (our choice; a robust local check).
 * The reading of the patterns is common practice for first-arrival checks (from memory): early
 * arrivals over a middle offset range point to a faster layer whose segment the model lacks,
 * or to thinner cover; late arrivals to slower or thicker cover or a deeper refractor.
 */
import {
  checkPicks,
  groupByShotSide,
  type FirstArrivalFn,
  type ObservedPick,
  type SpreadSide,
} from "./field-picks";

/** One warning about a misfit pattern. */
export interface MisfitWarning {
  kind: "early" | "late" | "extra-break" | "missing-break" | "outlier";
  sourcePosition: number;
  side: SpreadSide;
  /** Offset range concerned, m (a break: the interval between the picks it falls between). */
  from: number;
  to: number;
  /** Plain statement of the pattern and what it may mean. */
  message: string;
}

/** Neighbours on each side used by the outlier check. */
const OUTLIER_NEIGHBOURS = 2;
/** Distance from the neighbours' line, in robust standard deviations, that makes an outlier. */
const OUTLIER_SIGMAS = 5;

/**
 * Indexes of the points that lie far off the straight line through their neighbours (up to
 * OUTLIER_NEIGHBOURS each side, at least three in all), and each one's deviation from it.
 */
export function localOutliers(
  x: readonly number[],
  r: readonly number[],
  sigma: number,
): { index: number; deviation: number }[] {
  const found: { index: number; deviation: number }[] = [];
  for (let i = 0; i < x.length; i++) {
    const idx: number[] = [];
    for (let k = i - OUTLIER_NEIGHBOURS; k <= i + OUTLIER_NEIGHBOURS; k++) {
      if (k !== i && k >= 0 && k < x.length) idx.push(k);
    }
    if (idx.length < 3) continue;
    let mx = 0;
    let mr = 0;
    for (const k of idx) {
      mx += x[k] / idx.length;
      mr += r[k] / idx.length;
    }
    let sxx = 0;
    let sxr = 0;
    for (const k of idx) {
      sxx += (x[k] - mx) ** 2;
      sxr += (x[k] - mx) * (r[k] - mr);
    }
    const slope = sxx > 0 ? sxr / sxx : 0;
    const line = (v: number) => mr + slope * (v - mx);
    const spread = idx.map((k) => Math.abs(r[k] - line(x[k]))).sort((a, b) => a - b);
    const mad = spread[Math.floor((spread.length - 1) / 2)];
    const scale = Math.max(sigma, 1.4826 * mad);
    const deviation = r[i] - line(x[i]);
    if (Math.abs(deviation) > OUTLIER_SIGMAS * scale) found.push({ index: i, deviation });
  }
  return found;
}

/** Options of the misfit check. */
export interface MisfitOptions {
  /** Standard deviation of a pick, s (default 0.001). */
  pickError?: number;
  /** Fewest consecutive picks that make a pattern (default 3). */
  minPicks?: number;
}

/** Smallest relative change of slope that counts as a break (our choice: 15 %). */
const MIN_SLOPE_CHANGE = 0.15;

interface Piece {
  first: number;
  last: number;
  slope: number;
}

/** Optimal split of (x, t) points sorted by x into straight pieces, each of at least minLen points. */
export function straightPieces(
  x: readonly number[],
  t: readonly number[],
  sigma: number,
  minLen: number,
): Piece[] {
  const n = x.length;
  if (n < minLen) return [];
  const px = [0];
  const pt = [0];
  const pxx = [0];
  const pxt = [0];
  const ptt = [0];
  for (let i = 0; i < n; i++) {
    px.push(px[i] + x[i]);
    pt.push(pt[i] + t[i]);
    pxx.push(pxx[i] + x[i] * x[i]);
    pxt.push(pxt[i] + x[i] * t[i]);
    ptt.push(ptt[i] + t[i] * t[i]);
  }
  const fit = (i: number, j: number) => {
    const m = j - i + 1;
    const sx = px[j + 1] - px[i];
    const st = pt[j + 1] - pt[i];
    const sxx = pxx[j + 1] - pxx[i] - (sx * sx) / m;
    const sxt = pxt[j + 1] - pxt[i] - (sx * st) / m;
    const stt = ptt[j + 1] - ptt[i] - (st * st) / m;
    const slope = sxx > 0 ? sxt / sxx : 0;
    const sse = Math.max(0, stt - (sxx > 0 ? (sxt * sxt) / sxx : 0));
    return { sse, slope };
  };
  const penalty = 3 * Math.log(n);
  const best = new Array<number>(n + 1).fill(Number.POSITIVE_INFINITY);
  const from = new Array<number>(n + 1).fill(-1);
  best[0] = 0;
  for (let j = minLen; j <= n; j++) {
    for (let i = 0; i <= j - minLen; i++) {
      if (!Number.isFinite(best[i])) continue;
      const cost = best[i] + fit(i, j - 1).sse / (sigma * sigma) + penalty;
      if (cost < best[j]) {
        best[j] = cost;
        from[j] = i;
      }
    }
  }
  if (!Number.isFinite(best[n])) return [];
  const pieces: Piece[] = [];
  for (let j = n; j > 0; j = from[j]) {
    const i = from[j];
    pieces.unshift({ first: i, last: j - 1, slope: fit(i, j - 1).slope });
  }
  return pieces;
}

interface Line {
  slope: number;
  slopeError: number;
}

/** Least-squares slope of t over x on a piece's index range, with its standard error for picks of sd sigma. */
function lineOn(x: readonly number[], t: readonly number[], piece: Piece, sigma: number): Line {
  const n = piece.last - piece.first + 1;
  let mx = 0;
  let mt = 0;
  for (let i = piece.first; i <= piece.last; i++) {
    mx += x[i] / n;
    mt += t[i] / n;
  }
  let sxx = 0;
  let sxt = 0;
  for (let i = piece.first; i <= piece.last; i++) {
    sxx += (x[i] - mx) ** 2;
    sxt += (x[i] - mx) * (t[i] - mt);
  }
  return sxx > 0
    ? { slope: sxt / sxx, slopeError: sigma / Math.sqrt(sxx) }
    : { slope: 0, slopeError: Number.POSITIVE_INFINITY };
}

const ms = (s: number) => `${(s * 1000).toFixed(1)} ms`;
const m = (v: number) => `${Number(v.toFixed(1))} m`;
const speed = (slope: number) =>
  slope > 0 ? `${Math.round(1 / slope)} m/s` : "no positive velocity";

function describeRun(
  early: boolean,
  from: number,
  to: number,
  mean: number,
  atNear: boolean,
  atFar: boolean,
): string {
  const head = `${early ? "early" : "late"} by ${ms(Math.abs(mean))} on average between ${m(from)} and ${m(to)} offset`;
  if (early) {
    if (atNear && atFar)
      return `Picks are ${head} (all offsets): the top layer is faster than modelled, or the trigger is late.`;
    if (atNear)
      return `Picks are ${head}: the top layer is faster than modelled near the shot, or the trigger is late.`;
    if (atFar) {
      return `Picks are ${head}: the deepest refractor is shallower or faster than modelled, or the cover is thinner.`;
    }
    return `Picks are ${head}: a faster layer whose segment the model lacks (a layer the plan missed), or thinner cover than modelled.`;
  }
  if (atNear && !atFar)
    return `Picks are ${head}: the top layer is slower than modelled near the shot.`;
  return `Picks are ${head}: slower or thicker cover, or a deeper refractor than modelled; a velocity inversion would delay arrivals this way and cannot be seen as its own segment.`;
}

/**
 * Looks for misfit patterns between observed picks and one model's first arrivals.
 * @throws RangeError for picks with non-finite values or a non-positive pick error
 */
export function misfitWarnings(
  picks: readonly ObservedPick[],
  firstArrival: FirstArrivalFn,
  options: MisfitOptions = {},
): MisfitWarning[] {
  checkPicks(picks);
  const sigma = options.pickError ?? 0.001;
  const minPicks = Math.max(2, Math.round(options.minPicks ?? 3));
  if (!(Number.isFinite(sigma) && sigma > 0))
    throw new RangeError("pickError must be a positive number of seconds");
  const warnings: MisfitWarning[] = [];

  for (const group of groupByShotSide(picks)) {
    const modelled = group.picks
      .map((p) => ({
        offset: p.offset,
        receiverPosition: p.receiverPosition,
        time: p.time,
        model: firstArrival(p.sourcePosition, p.receiverPosition),
      }))
      .filter((r) => Number.isFinite(r.model));
    const base = { sourcePosition: group.sourcePosition, side: group.side };
    const outliers = localOutliers(
      modelled.map((r) => r.offset),
      modelled.map((r) => r.time - r.model),
      sigma,
    );
    for (const o of outliers) {
      const r = modelled[o.index];
      warnings.push({
        ...base,
        kind: "outlier",
        from: r.offset,
        to: r.offset,
        message: `The pick at geophone ${m(r.receiverPosition)} (${m(r.offset)} offset) is ${ms(Math.abs(o.deviation))} ${o.deviation > 0 ? "later" : "earlier"} than the trend of its neighbours: check it for a mis-pick or a noisy trace. It is left out of the pattern checks.`,
      });
    }
    const skip = new Set(outliers.map((o) => o.index));
    const rows = modelled.filter((_, i) => !skip.has(i));
    if (rows.length < minPicks) continue;

    // Runs of systematically early or late picks.
    for (const sign of [-1, 1]) {
      let start = -1;
      for (let k = 0; k <= rows.length; k++) {
        const hit = k < rows.length && sign * (rows[k].time - rows[k].model) > 2 * sigma;
        if (hit && start < 0) start = k;
        if (!hit && start >= 0) {
          const end = k - 1;
          if (end - start + 1 >= minPicks) {
            let mean = 0;
            for (let j = start; j <= end; j++)
              mean += (rows[j].time - rows[j].model) / (end - start + 1);
            warnings.push({
              ...base,
              kind: sign < 0 ? "early" : "late",
              from: rows[start].offset,
              to: rows[end].offset,
              message: describeRun(
                sign < 0,
                rows[start].offset,
                rows[end].offset,
                mean,
                start === 0,
                end === rows.length - 1,
              ),
            });
          }
          start = -1;
        }
      }
    }

    // Slope changes in the picks that the model lacks, or in the model that the picks lack,
    // show as kinks in the residuals (observed − modelled), which are flat where they agree.
    const x = rows.map((r) => r.offset);
    const observedTimes = rows.map((r) => r.time);
    const modelTimes = rows.map((r) => r.model);
    const residuals = rows.map((r) => r.time - r.model);
    const pieces = straightPieces(x, residuals, sigma, minPicks);
    for (let k = 1; k < pieces.length; k++) {
      const a = pieces[k - 1];
      const b = pieces[k];
      const ra = lineOn(x, residuals, a, sigma);
      const rb = lineOn(x, residuals, b, sigma);
      const oa = lineOn(x, observedTimes, a, sigma);
      const ob = lineOn(x, observedTimes, b, sigma);
      const ma = lineOn(x, modelTimes, a, sigma);
      const mb = lineOn(x, modelTimes, b, sigma);
      const kink = Math.abs(rb.slope - ra.slope);
      const scale = Math.max(
        Math.abs(oa.slope),
        Math.abs(ob.slope),
        Math.abs(ma.slope),
        Math.abs(mb.slope),
      );
      if (kink <= 4 * Math.hypot(ra.slopeError, rb.slopeError) || kink <= MIN_SLOPE_CHANGE * scale)
        continue;
      const from = x[a.last];
      const to = x[b.first];
      const observedChange = Math.abs(ob.slope - oa.slope);
      const modelChange = Math.abs(mb.slope - ma.slope);
      if (observedChange >= modelChange) {
        warnings.push({
          ...base,
          kind: "extra-break",
          from,
          to,
          message: `The picks change slope between ${m(from)} and ${m(to)} offset (apparent velocity ${speed(oa.slope)} → ${speed(ob.slope)}) where the model does not (${speed(ma.slope)} → ${speed(mb.slope)}): a layer the plan missed, or a different layer thickness.`,
        });
      } else {
        warnings.push({
          ...base,
          kind: "missing-break",
          from,
          to,
          message: `The model changes slope between ${m(from)} and ${m(to)} offset (${speed(ma.slope)} → ${speed(mb.slope)}) but the picks do not (${speed(oa.slope)} → ${speed(ob.slope)}): the modelled layer may be thinner, absent or deeper than planned.`,
        });
      }
    }
  }
  return warnings;
}

/**
 * AIC first-break picker after Maeda (1985), computed directly from the trace: for a window of
 * N samples split after sample k,
 *   AIC(k) = k·log(var(x[1..k])) + (N − k − 1)·log(var(x[k+1..N]))
 * and the onset is at the minimum (Maeda 1985, J. Seismol. Soc. Japan 38; the variance form
 * as used by Zhang, Thurber & Rowe 2003, BSSA 93(5)).
 */
import {
  nonFiniteReason,
  requirePositive,
  sampleTime,
  searchRange,
  type PickResult,
  type PickTiming,
} from "./pick-window";

/** Parameters of the AIC picker. */
export interface AicOptions extends PickTiming {
  /**
   * Smallest ratio of the variance after the minimum to the variance before it for the pick
   * to count as an onset (default 2). Guards against picking in pure noise, where the AIC
   * still has a minimum.
   */
  minVarianceRatio?: number;
}

/** Fewest samples on either side of a split: a variance from a handful of samples is noise. */
const MIN_SIDE = 5;

/**
 * Picks the first break as the minimum of Maeda's AIC inside the search window. The window
 * should hold noise before and signal after the onset and end before the signal has died
 * away (e.g. around an STA/LTA trigger or a predicted arrival): over a whole record with a
 * decaying coda the minimum can fall at the end of the coda, which the variance-ratio check
 * then refuses. With several arrivals inside, it finds the strongest change.
 */
export function pickAic(samples: Float32Array, options: AicOptions): PickResult {
  const minRatio = options.minVarianceRatio ?? 2;
  requirePositive("minVarianceRatio", minRatio);
  const range = searchRange(samples.length, options);
  if (typeof range === "string") return { time: null, reason: range };
  const bad = nonFiniteReason(samples);
  if (bad) return { time: null, reason: bad };
  const { from, to } = range;
  const n = to - from;
  if (n < 4 * MIN_SIDE) {
    return {
      time: null,
      reason: `the search window holds ${n} samples; the AIC picker needs ${4 * MIN_SIDE}`,
    };
  }
  const edge = Math.max(MIN_SIDE, Math.round(n / 20));

  // Running variances from the front (first k samples) and from the back (samples k..n-1),
  // by Welford's update, which stays accurate for large offsets.
  const front = new Float64Array(n + 1);
  const back = new Float64Array(n + 1);
  let mean = 0;
  let m2 = 0;
  for (let k = 1; k <= n; k++) {
    const x = samples[from + k - 1];
    const d = x - mean;
    mean += d / k;
    m2 += d * (x - mean);
    front[k] = m2 / k;
  }
  mean = 0;
  m2 = 0;
  for (let k = n - 1, c = 1; k >= 0; k--, c++) {
    const x = samples[from + k];
    const d = x - mean;
    mean += d / c;
    m2 += d * (x - mean);
    back[k] = m2 / c;
  }
  const total = front[n];
  if (!(total > 0)) return { time: null, reason: "the trace is flat in the search window" };
  // A floor keeps log() finite where a stretch of the trace is exactly constant (e.g. zeros).
  const floor = total * 1e-12;

  let best = Number.POSITIVE_INFINITY;
  let split = -1;
  for (let k = edge; k <= n - edge; k++) {
    const aic = k * Math.log(front[k] + floor) + (n - k - 1) * Math.log(back[k] + floor);
    if (aic < best) {
      best = aic;
      split = k;
    }
  }
  if (split === edge || split === n - edge) {
    return {
      time: null,
      reason: "no clear onset: the AIC minimum lies at the edge of the search window",
    };
  }
  const ratio = (back[split] + floor) / (front[split] + floor);
  if (ratio < minRatio) {
    return {
      time: null,
      reason: `no clear onset: the variance after the AIC minimum is ${ratio.toFixed(1)} times the variance before it (needs ${minRatio})`,
    };
  }
  const sample = from + split;
  return { time: sampleTime(sample, options), sample };
}

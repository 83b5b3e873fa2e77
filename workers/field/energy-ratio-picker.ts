/**
 * Modified energy ratio picker (Han, Wong & Bancroft 2009): the energy ratio
 *   er(i) = Σ_{j=i}^{i+L} x_j² / Σ_{j=i−L}^{i} x_j²
 * of a window after and a window before sample i, and mer(i) = (er(i)·|x_i|)³; the first
 * break is at the maximum of mer.
 */
import {
  nonFiniteReason,
  requirePositive,
  sampleTime,
  searchRange,
  type PickResult,
  type PickTiming,
} from "./pick-window";

/** Parameters of the modified energy ratio picker. */
export interface EnergyRatioOptions extends PickTiming {
  /** Length L of each of the two energy windows, s (default 0.008). */
  window?: number;
  /** Smallest energy ratio at the pick for it to count as an onset (default 5). */
  minEnergyRatio?: number;
}

/** Picks the first break at the maximum of the modified energy ratio in the search window. */
export function pickEnergyRatio(samples: Float32Array, options: EnergyRatioOptions): PickResult {
  const window = options.window ?? 0.008;
  const minRatio = options.minEnergyRatio ?? 5;
  requirePositive("window", window);
  requirePositive("minEnergyRatio", minRatio);
  const range = searchRange(samples.length, options);
  if (typeof range === "string") return { time: null, reason: range };
  const bad = nonFiniteReason(samples);
  if (bad) return { time: null, reason: bad };

  const n = samples.length;
  const l = Math.max(1, Math.round(window / options.sampleInterval));
  const from = Math.max(range.from, l);
  const to = Math.min(range.to, n - l);
  if (to <= from) {
    return { time: null, reason: "the search window leaves no room for the two energy windows" };
  }
  const prefix = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) prefix[i + 1] = prefix[i] + samples[i] * samples[i];
  const floor = (prefix[n] / n) * 1e-12;
  if (!(prefix[n] > 0)) return { time: null, reason: "the trace is flat" };

  let best = -1;
  let bestMer = -1;
  let bestEr = 0;
  for (let i = from; i < to; i++) {
    const after = prefix[i + l + 1] - prefix[i];
    const before = prefix[i + 1] - prefix[i - l];
    const er = after / (before + floor);
    const mer = (er * Math.abs(samples[i])) ** 3;
    if (mer > bestMer) {
      bestMer = mer;
      best = i;
      bestEr = er;
    }
  }
  if (bestEr < minRatio) {
    return {
      time: null,
      reason: `no clear onset: the energy ratio at the best pick is ${bestEr.toFixed(1)} (needs ${minRatio})`,
    };
  }
  return { time: sampleTime(best, options), sample: best };
}

/**
 * STA/LTA first-break picker (Allen 1978, BSSA 68(5)): the ratio of a short-term average to a
 * long-term average of a characteristic function of the trace; the first break is where the
 * ratio first reaches the threshold. The long-term window lies immediately before the
 * short-term window (the two do not overlap), so the ratio is ~1 in stationary noise.
 */
import { pickAic } from "./aic-picker";
import {
  nonFiniteReason,
  requirePositive,
  sampleTime,
  searchRange,
  type PickResult,
  type PickTiming,
} from "./pick-window";

/** Parameters of the STA/LTA picker. */
export interface StaLtaOptions extends PickTiming {
  /** Short-term window, s (default 0.004; never fewer than 8 samples). */
  staWindow?: number;
  /** Long-term window, s (default 0.04; never fewer than 5 short-term windows). */
  ltaWindow?: number;
  /** Ratio that declares the first break (default 4). */
  threshold?: number;
  /**
   * Characteristic function: "allen" (default) is Allen's x² + K·(Δx)², with K the ratio of
   * the trace's summed |x| to its summed |Δx|; "energy" is x².
   */
  characteristic?: "allen" | "energy";
  /**
   * "none" (default) returns the trigger sample, which lags the onset by up to one
   * short-term window; "aic" refines it with the AIC picker in a window from one long-term
   * window before the trigger to two short-term windows after it.
   */
  refine?: "none" | "aic";
}

/** Fewest samples in the short-term window, whatever its length in seconds. */
const MIN_STA = 8;
/** Fewest short-term windows in the long-term window. */
const LTA_PER_STA = 5;

/** Shortest long-term window, in short-term windows, accepted at the start of a record. */
const MIN_LTA = 3;

/** Allen's (1978) characteristic function, or plain energy. */
export function characteristicFunction(
  samples: Float32Array,
  kind: "allen" | "energy",
): Float64Array {
  const n = samples.length;
  const cf = new Float64Array(n);
  if (kind === "energy") {
    for (let i = 0; i < n; i++) cf[i] = samples[i] * samples[i];
    return cf;
  }
  let sumAbs = 0;
  let sumDiff = 0;
  for (let i = 0; i < n; i++) {
    sumAbs += Math.abs(samples[i]);
    if (i > 0) sumDiff += Math.abs(samples[i] - samples[i - 1]);
  }
  const k = sumDiff > 0 ? sumAbs / sumDiff : 0;
  for (let i = 0; i < n; i++) {
    const d = i > 0 ? samples[i] - samples[i - 1] : 0;
    cf[i] = samples[i] * samples[i] + k * d * d;
  }
  return cf;
}

/**
 * Picks the first break where STA/LTA first reaches the threshold inside the search window.
 * Returns null with a reason when the trace is too short for the two windows or the ratio
 * never reaches the threshold.
 */
export function pickStaLta(samples: Float32Array, options: StaLtaOptions): PickResult {
  const staWindow = options.staWindow ?? 0.004;
  const ltaWindow = options.ltaWindow ?? 0.04;
  const threshold = options.threshold ?? 4;
  requirePositive("staWindow", staWindow);
  requirePositive("ltaWindow", ltaWindow);
  requirePositive("threshold", threshold, 1);
  const range = searchRange(samples.length, options);
  if (typeof range === "string") return { time: null, reason: range };
  const bad = nonFiniteReason(samples);
  if (bad) return { time: null, reason: bad };

  const dt = options.sampleInterval;
  // Windows are scaled to the sample interval: a short-term window of fewer than MIN_STA
  // samples (4 ms at 1 ms sampling holds 4) makes the ratio jump on single noisy samples.
  const ns = Math.max(MIN_STA, Math.round(staWindow / dt));
  const nl = Math.max(LTA_PER_STA * ns, Math.round(ltaWindow / dt));
  // Near the start of a record the long-term window is shortened to the samples available,
  // but never below MIN_LTA short-term windows, so early first breaks can still be picked.
  const first = Math.max(range.from, ns + Math.min(nl, MIN_LTA * ns) - 1);
  if (first >= range.to) {
    return {
      time: null,
      reason: `the trace holds too few samples before the search window ends for a ${(staWindow * 1000).toFixed(1)} ms short-term window and the noise before it`,
    };
  }

  const cf = characteristicFunction(samples, options.characteristic ?? "allen");
  const prefix = new Float64Array(cf.length + 1);
  for (let i = 0; i < cf.length; i++) prefix[i + 1] = prefix[i] + cf[i];

  let trigger = -1;
  let peak = 0;
  for (let i = first; i < range.to; i++) {
    // STA over (i-ns, i], LTA over (i-ns-l, i-ns] with l = nl, or fewer at the record start.
    const l = Math.min(nl, i + 1 - ns);
    const sta = (prefix[i + 1] - prefix[i + 1 - ns]) / ns;
    const lta = (prefix[i + 1 - ns] - prefix[i + 1 - ns - l]) / l;
    const ratio = lta > 0 ? sta / lta : sta > 0 ? Number.POSITIVE_INFINITY : 0;
    if (ratio >= threshold) {
      trigger = i;
      break;
    }
    if (ratio > peak) peak = ratio;
  }
  if (trigger < 0) {
    return {
      time: null,
      reason: `STA/LTA never reached the threshold ${threshold} (highest ${peak.toFixed(2)})`,
    };
  }

  if (options.refine === "aic") {
    const from = Math.max(0, trigger - nl);
    const to = Math.min(samples.length - 1, trigger + 2 * ns);
    const refined = pickAic(samples, {
      sampleInterval: dt,
      delay: options.delay,
      search: [sampleTime(from, options), sampleTime(to, options)],
    });
    if (refined.time !== null) return refined;
  }
  return { time: sampleTime(trigger, options), sample: trigger };
}

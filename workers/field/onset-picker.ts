/**
 * Onset picker with windows counted in samples: the noise level is estimated from the quietest
 * stretches of the trace itself, the first break is detected where the trace first rises well
 * above it (and stays there), and the onset is traced back along that rising lobe to where it
 * leaves the noise. It needs no noise before the first break, so near traces recorded without a
 * pre-trigger are picked too.
 *
 * Amplitude-threshold detection with a noise estimate is common practice for first breaks (e.g.
 * the "energy above background" pickers reviewed by Sabbione & Velis 2010, J. Appl. Geophys.
 * 71); the sample-based windows and the trace-back are ours.
 */
import {
  nonFiniteReason,
  requirePositive,
  sampleTime,
  searchRange,
  type PickTiming,
} from "./pick-window";

/** Parameters of the onset picker. */
export interface OnsetOptions extends PickTiming {
  /** Detection threshold in noise standard deviations (default 5). */
  threshold?: number;
  /**
   * Noise standard deviation of the trace in its own units, when known (e.g. from the quiet
   * part of neighbouring traces); estimated from the trace when absent.
   */
  noise?: number;
}

/** An onset pick with the measured signal-to-noise ratio (peak / noise σ / 4), or no pick. */
export type OnsetResult =
  | { time: number; sample: number; noise: number; snr: number }
  | { time: null; reason: string; noise: number | null };

/** Samples in a noise-estimate window: at least 16, or 8 ms. */
function noiseWindow(dt: number): number {
  return Math.max(16, Math.round(0.008 / dt));
}

/**
 * Noise standard deviation of a trace from its quietest stretches: the RMS of the quietest
 * quarter of non-overlapping windows (at least 16 samples or 8 ms each), corrected for taking
 * the quietest (common practice: the quiet part of a record is its noise). Null for a trace
 * shorter than two windows.
 */
export function traceNoise(samples: Float32Array, sampleInterval: number): number | null {
  requirePositive("sampleInterval", sampleInterval);
  const w = noiseWindow(sampleInterval);
  const count = Math.floor(samples.length / w);
  if (count < 2) return null;
  const energies: number[] = [];
  for (let k = 0; k < count; k++) {
    let mean = 0;
    for (let i = k * w; i < (k + 1) * w; i++) mean += samples[i];
    mean /= w;
    let e = 0;
    for (let i = k * w; i < (k + 1) * w; i++) e += (samples[i] - mean) ** 2;
    energies.push(e / w);
  }
  energies.sort((a, b) => a - b);
  const quarter = Math.max(1, Math.floor(count / 4));
  let sum = 0;
  for (let k = 0; k < quarter; k++) sum += energies[k];
  // The quietest quarter of white-noise windows averages about 0.8 of the variance for
  // 16-sample windows (checked by simulation in the tests); undo that bias.
  return Math.sqrt(sum / quarter / 0.8);
}

/**
 * Picks the onset of the first arrival inside the search window.
 *
 * Detection: the first sample whose magnitude exceeds `threshold`·σ and after which at least two
 * of the next three samples exceed half that. Trace-back: from there, step back while the trace
 * keeps the same sign, stays above two σ and falls (a rising lobe grows monotonically from its onset); the onset is the last such sample's predecessor.
 * A DC offset is removed first (the median of the trace).
 */
export function pickOnset(samples: Float32Array, options: OnsetOptions): OnsetResult {
  const threshold = options.threshold ?? 5;
  requirePositive("threshold", threshold, 1);
  const range = searchRange(samples.length, options);
  if (typeof range === "string") return { time: null, reason: range, noise: null };
  const bad = nonFiniteReason(samples);
  if (bad) return { time: null, reason: bad, noise: null };
  const dt = options.sampleInterval;
  const sorted = Float32Array.from(samples).sort();
  const offset = sorted.length ? sorted[Math.floor(sorted.length / 2)] : 0;
  const x = (i: number) => samples[i] - offset;
  let noise = options.noise ?? null;
  if (noise === null) {
    const centred = new Float32Array(samples.length);
    for (let i = 0; i < samples.length; i++) centred[i] = x(i);
    noise = traceNoise(centred, dt);
  }
  if (noise === null) {
    return { time: null, reason: "the trace is too short to measure its noise", noise: null };
  }
  if (!(noise > 0)) return { time: null, reason: "the trace is flat", noise };
  const level = threshold * noise;
  let detected = -1;
  for (let i = range.from; i < range.to; i++) {
    if (Math.abs(x(i)) <= level) continue;
    let above = 0;
    for (let j = i + 1; j <= i + 3 && j < samples.length; j++) {
      if (Math.abs(x(j)) > level / 2) above++;
    }
    if (above >= 2) {
      detected = i;
      break;
    }
  }
  if (detected < 0) {
    return {
      time: null,
      reason: `no sample rises above ${threshold} times the noise in the search window`,
      noise,
    };
  }
  const sign = Math.sign(x(detected));
  let onset = detected;
  while (
    onset > 0 &&
    Math.sign(x(onset - 1)) === sign &&
    Math.abs(x(onset - 1)) > 2 * noise &&
    Math.abs(x(onset - 1)) < Math.abs(x(onset))
  ) {
    onset--;
  }
  // The lobe leaves the noise between the last quiet sample and the first loud one.
  if (onset > 0) onset--;
  const end = Math.min(samples.length, detected + Math.max(8, Math.round(0.01 / dt)));
  let peak = 0;
  for (let i = detected; i < end; i++) peak = Math.max(peak, Math.abs(x(i)));
  return { time: sampleTime(onset, options), sample: onset, noise, snr: peak / (4 * noise) };
}

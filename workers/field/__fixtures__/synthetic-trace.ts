/**
 * Synthetic first-break traces for the picker tests: seeded white Gaussian noise plus a causal
 * damped sine that starts at a known onset. SNR is the wavelet's peak amplitude over the noise
 * standard deviation.
 */
import { seededNormal } from "./random";

export interface SyntheticTrace {
  samples: Float32Array;
  sampleInterval: number;
  delay: number;
  onset: number;
}

export function syntheticTrace(options: {
  seed: number;
  snr: number | null;
  onset?: number;
  sampleInterval?: number;
  delay?: number;
  length?: number;
  frequency?: number;
}): SyntheticTrace {
  const dt = options.sampleInterval ?? 0.00025;
  const delay = options.delay ?? 0;
  const n = options.length ?? 1000;
  const onset = options.onset ?? 0.06;
  const f = options.frequency ?? 80;
  const decay = 2 / f;
  const noise = seededNormal(options.seed);
  // Peak of sin(2πft)·exp(-t/decay) for this f and decay, so that SNR refers to the peak.
  let peak = 0;
  for (let t = 0; t < 2 / f; t += 1e-6) {
    peak = Math.max(peak, Math.sin(2 * Math.PI * f * t) * Math.exp(-t / decay));
  }
  const amplitude = 1000;
  const sigma = options.snr === null ? amplitude : (amplitude * peak) / options.snr;
  const samples = new Float32Array(n);
  for (let i = 0; i < n; i++) {
    const t = delay + i * dt - onset;
    const signal =
      options.snr !== null && t >= 0
        ? amplitude * Math.sin(2 * Math.PI * f * t) * Math.exp(-t / decay)
        : 0;
    samples[i] = signal + sigma * noise();
  }
  return { samples, sampleInterval: dt, delay, onset };
}

/**
 * Seeded synthetic shot records with known onsets for the picker statistics: a flat two- or
 * three-layer ground (closed-form first arrivals, flat-layers.ts), one trace per geophone with a
 * causal damped sine of random polarity starting at the first arrival, amplitude falling with
 * offset, and white Gaussian noise of standard deviation peak / (4·SNR), peak being that trace's
 * own wavelet peak (the definition of the issue this serves). No pre-trigger unless `delay` < 0.
 */
import { firstArrival, type TestLayer } from "./flat-layers";
import { seededNormal, seededRandom } from "./random";

export interface OnsetRecordOptions {
  seed: number;
  snr: number;
  /** s */
  sampleInterval: number;
  /** Source position, m. */
  shot: number;
  layers?: TestLayer[];
  channels?: number;
  /** m */
  spacing?: number;
  /** s; time of the first sample (negative: pre-trigger). */
  delay?: number;
  /** Record length, s. */
  length?: number;
  /** Hz */
  frequency?: number;
}

export interface OnsetRecord {
  traces: {
    index: number;
    samples: Float32Array;
    sampleInterval: number;
    delay: number;
    channel: number;
    receiverPosition: number;
    sourcePosition: number;
  }[];
  /** True onset per trace, s. */
  onsets: number[];
}

export const DEFAULT_LAYERS: TestLayer[] = [
  { velocity: 500, thickness: 4 },
  { velocity: 1800, thickness: 8 },
  { velocity: 3500 },
];

export function onsetRecord(o: OnsetRecordOptions): OnsetRecord {
  const layers = o.layers ?? DEFAULT_LAYERS;
  const t = firstArrival(layers);
  const channels = o.channels ?? 24;
  const spacing = o.spacing ?? 2;
  const dt = o.sampleInterval;
  const delay = o.delay ?? 0;
  const n = Math.round((o.length ?? 0.25) / dt);
  const f = o.frequency ?? 60;
  const noise = seededNormal(o.seed);
  const uniform = seededRandom(o.seed * 7919 + 1);
  const shape = (s: number) =>
    s >= 0 ? Math.sin(2 * Math.PI * f * s) * Math.exp(-s * f * 0.8) : 0;
  let peakShape = 0;
  for (let s = 0; s < 2 / f; s += 1e-6) peakShape = Math.max(peakShape, Math.abs(shape(s)));
  const traces: OnsetRecord["traces"] = [];
  const onsets: number[] = [];
  for (let k = 0; k < channels; k++) {
    const r = k * spacing;
    if (r === o.shot) continue;
    const onset = t(o.shot, r);
    const gain = 1000 * Math.max(0.05, 1 / (1 + Math.abs(r - o.shot) / 10));
    const polarity = uniform() < 0.5 ? -1 : 1;
    const sigma = (gain * peakShape) / (4 * o.snr);
    const samples = new Float32Array(n);
    for (let i = 0; i < n; i++) {
      samples[i] = polarity * gain * shape(delay + i * dt - onset) + sigma * noise();
    }
    traces.push({
      index: traces.length,
      samples,
      sampleInterval: dt,
      delay,
      channel: traces.length + 1,
      receiverPosition: r,
      sourcePosition: o.shot,
    });
    onsets.push(onset);
  }
  return { traces, onsets };
}

/**
 * A synthetic SEG-2 shot record for the tests: one trace per geophone of a spread, each with
 * seeded noise and a damped sine that starts at the modelled first arrival of the given ground
 * model (engine `computeArrivals`), written by the independent test writer (seg2-writer.ts).
 */
import { computeArrivals, type GroundModel, type Spread } from "@engine";
import { seededNormal } from "./random";
import { writeSeg2, type WriterFormat } from "./seg2-writer";

export interface ShotRecordOptions {
  model: Pick<GroundModel, "layers">;
  spread: Spread;
  shotIndex?: number;
  /** s; default 0.00025 (4 kHz). */
  sampleInterval?: number;
  /** Samples per trace; default 800 (0.2 s at 4 kHz). */
  samples?: number;
  /** Peak signal over noise standard deviation; default 20. */
  snr?: number;
  seed?: number;
  format?: WriterFormat;
  byteOrder?: "little" | "big";
  /** Wavelet frequency, Hz; default 60. */
  frequency?: number;
  /** Time of the first sample, s (SEG-2 DELAY; negative = pre-trigger record); default 0. */
  delay?: number;
}

export interface ShotRecord {
  bytes: Uint8Array;
  /** Modelled first arrival per trace, s. */
  onsets: number[];
  receivers: number[];
  source: number;
}

export function syntheticShotRecord(options: ShotRecordOptions): ShotRecord {
  const shotIndex = options.shotIndex ?? 0;
  const dt = options.sampleInterval ?? 0.00025;
  const n = options.samples ?? 800;
  const snr = options.snr ?? 20;
  const f = options.frequency ?? 60;
  const format = options.format ?? 4;
  const delay = options.delay ?? 0;
  const noise = seededNormal(options.seed ?? 7);
  const arrivals = computeArrivals(options.model, options.spread, shotIndex);
  const source = arrivals.shotPosition;
  const amplitude = format === 1 ? 8000 : 1000;
  const sigma = amplitude / snr;
  const onsets: number[] = [];
  const receivers: number[] = [];
  const traces = arrivals.geophones.map((g, k) => {
    const onset = g.first.time;
    onsets.push(onset);
    receivers.push(g.position);
    // Amplitude falls off with offset (spherical spreading, roughly), never below a fifth.
    const gain = Math.max(0.2, 1 / (1 + g.offset / 20));
    const samples = new Array<number>(n);
    for (let i = 0; i < n; i++) {
      const t = delay + i * dt - onset;
      const signal =
        t >= 0 ? gain * amplitude * Math.sin(2 * Math.PI * f * t) * Math.exp(-t * f * 0.8) : 0;
      const value = signal + sigma * noise();
      samples[i] = format === 1 || format === 2 ? Math.round(value) : value;
    }
    return {
      format,
      samples,
      strings: [
        `CHANNEL_NUMBER ${k + 1}`,
        `SAMPLE_INTERVAL ${dt}`,
        `DELAY ${delay}`,
        `RECEIVER_LOCATION ${g.position}`,
        `SOURCE_LOCATION ${source}`,
      ],
    };
  });
  const bytes = writeSeg2({
    byteOrder: options.byteOrder ?? "little",
    fileStrings: ["ACQUISITION_DATE 04/MAR/2025", "INSTRUMENT invented test writer"],
    traces,
  });
  return { bytes, onsets, receivers, source };
}

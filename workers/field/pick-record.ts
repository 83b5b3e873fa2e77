/**
 * Picks every trace of a shot record with one of the pickers, keeping the geometry of each
 * trace beside its first-break time.
 */
import { pickAic, type AicOptions } from "./aic-picker";
import { pickEnergyRatio, type EnergyRatioOptions } from "./energy-ratio-picker";
import type { PickResult, PickTiming } from "./pick-window";
import { pickStaLta, type StaLtaOptions } from "./sta-lta-picker";
import { pickOnset, type OnsetOptions } from "./onset-picker";
import {
  neighbourPrediction,
  neighbourTolerance,
  pickQuality,
  type PickQuality,
} from "./pick-quality";
import type { Seg2Trace } from "./seg2-reader";

type Tuning<T> = Omit<T, keyof Omit<PickTiming, "search">>;

/** Options of the record-wide onset picker. */
export interface OnsetRecordOptions {
  /** Detection threshold in noise standard deviations (default 5). */
  threshold?: number;
  /**
   * Predicted first arrival per trace (same order as the traces), s, e.g. from the
   * best-fitting candidate model; null where there is none. Each trace is searched around it.
   */
  predicted?: readonly (number | null)[];
}

/** Which picker to run and its parameters (timing comes from each trace). */
export type PickerChoice =
  | { method: "onset"; options?: OnsetRecordOptions }
  | { method: "sta-lta"; options?: Tuning<StaLtaOptions> }
  | { method: "aic"; options?: Tuning<AicOptions> }
  | { method: "energy-ratio"; options?: Tuning<EnergyRatioOptions> };

/** The parts of a trace a picker needs. */
export type PickableTrace = Pick<
  Seg2Trace,
  | "index"
  | "samples"
  | "sampleInterval"
  | "delay"
  | "channel"
  | "receiverPosition"
  | "sourcePosition"
>;

/** One trace's first break with its geometry. */
export interface RecordPick {
  /** Position of the trace in the record, from 0. */
  traceIndex: number;
  /** CHANNEL_NUMBER, or the trace's position in the record counted from 1 when absent. */
  channel: number;
  /** Receiver position along the line, m; null when the record does not say. */
  receiverPosition: number | null;
  /** Source position along the line, m; null when the record does not say. */
  sourcePosition: number | null;
  /** First-break time, s (DELAY included); null when the picker found none. */
  time: number | null;
  /** Why there is no pick (only when `time` is null). */
  reason?: string;
  /** How far the pick can be trusted (see pick-quality.ts). */
  quality: PickQuality;
}

/**
 * Half-width of the search window around a predicted arrival, s: the larger of 10 ms, a quarter
 * of the predicted time and 20 samples (our choice; a model is seldom better than that).
 */
export function predictedWindow(predicted: number, sampleInterval: number): number {
  return Math.max(0.01, 0.25 * predicted, 20 * sampleInterval);
}

/** Runs the chosen picker on one trace. */
export function pickTrace(
  trace: PickableTrace,
  picker: PickerChoice = { method: "sta-lta" },
): PickResult {
  const timing = { sampleInterval: trace.sampleInterval, delay: trace.delay };
  switch (picker.method) {
    case "onset": {
      const r = pickOnset(trace.samples, { ...timing, threshold: picker.options?.threshold });
      return r.time === null
        ? { time: null, reason: r.reason }
        : { time: r.time, sample: r.sample };
    }
    case "sta-lta":
      return pickStaLta(trace.samples, { ...picker.options, ...timing });
    case "aic":
      return pickAic(trace.samples, { ...picker.options, ...timing });
    case "energy-ratio":
      return pickEnergyRatio(trace.samples, { ...picker.options, ...timing });
  }
}

/** One trace's pick before the neighbour pass. */
interface FirstPass {
  time: number | null;
  reason?: string;
  snr: number | null;
}

function onsetPick(
  trace: PickableTrace,
  options: OnsetOptions,
  predicted: number | null,
): FirstPass & { noise: number | null } {
  const timing = { sampleInterval: trace.sampleInterval, delay: trace.delay };
  if (predicted !== null && Number.isFinite(predicted)) {
    const w = predictedWindow(predicted, trace.sampleInterval);
    const near = pickOnset(trace.samples, {
      ...options,
      ...timing,
      search: [predicted - w, predicted + w],
    });
    if (near.time !== null) return { time: near.time, snr: near.snr, noise: near.noise };
  }
  const r = pickOnset(trace.samples, { ...options, ...timing });
  return r.time === null
    ? { time: null, reason: r.reason, snr: null, noise: r.noise }
    : { time: r.time, snr: r.snr, noise: r.noise };
}

/**
 * Picks every trace of a record; traces keep their order. Every pick gets a quality word. With
 * the onset picker there is a second pass: a pick off its neighbours' trend (or a trace without a
 * pick) is searched again around the neighbours' prediction, and kept (as "weak") when the new
 * pick agrees with them.
 */
export function pickRecord(
  record: { traces: readonly PickableTrace[] },
  picker: PickerChoice = { method: "onset" },
): RecordPick[] {
  const traces = record.traces;
  const first: FirstPass[] = traces.map((trace, i) => {
    if (picker.method === "onset") {
      const predicted = picker.options?.predicted?.[i] ?? null;
      return onsetPick(
        trace,
        { threshold: picker.options?.threshold, sampleInterval: 1 },
        predicted,
      );
    }
    const r = pickTrace(trace, picker);
    return r.time === null
      ? { time: null, reason: r.reason, snr: null }
      : { time: r.time, snr: null };
  });
  // Neighbours along the line (by receiver position when every trace has one, else record order).
  const order = traces.map((_, i) => i);
  if (traces.every((t) => t.receiverPosition !== null)) {
    order.sort(
      (a, b) => (traces[a].receiverPosition as number) - (traces[b].receiverPosition as number),
    );
  }
  const positions = order.map((i) => traces[i].receiverPosition ?? i);
  const times = order.map((i) => first[i].time);
  const quality = new Array<PickQuality>(traces.length).fill("none");
  const finalTimes = times.slice();
  order.forEach((i, k) => {
    const trace = traces[i];
    const dt = trace.sampleInterval;
    const tol = neighbourTolerance(dt);
    const predicted = neighbourPrediction(positions, times, k);
    const off = times[k] !== null && predicted !== null ? (times[k] as number) - predicted : null;
    if (
      picker.method === "onset" &&
      predicted !== null &&
      (times[k] === null || Math.abs(off as number) > tol)
    ) {
      const again = pickOnset(trace.samples, {
        sampleInterval: dt,
        delay: trace.delay,
        threshold: Math.max(1.5, (picker.options?.threshold ?? 5) - 1),
        search: [predicted - 2 * tol, predicted + 2 * tol],
      });
      if (again.time !== null && Math.abs(again.time - predicted) <= tol) {
        finalTimes[k] = again.time;
        quality[i] = "weak";
        return;
      }
    }
    quality[i] = pickQuality(times[k], first[i].snr, off, dt);
  });
  const finalByTrace = new Array<number | null>(traces.length).fill(null);
  order.forEach((i, k) => (finalByTrace[i] = finalTimes[k]));
  return traces.map((trace, i) => {
    const base = {
      traceIndex: trace.index,
      channel: trace.channel ?? trace.index + 1,
      receiverPosition: trace.receiverPosition,
      sourcePosition: trace.sourcePosition,
      quality: quality[i],
    };
    const time = finalByTrace[i];
    return time === null
      ? { ...base, time: null, reason: first[i].reason ?? "no pick", quality: "none" as const }
      : { ...base, time };
  });
}

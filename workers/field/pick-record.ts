/**
 * Picks every trace of a shot record with one of the pickers, keeping the geometry of each
 * trace beside its first-break time.
 */
import { pickAic, type AicOptions } from "./aic-picker";
import { pickEnergyRatio, type EnergyRatioOptions } from "./energy-ratio-picker";
import type { PickResult, PickTiming } from "./pick-window";
import { pickStaLta, type StaLtaOptions } from "./sta-lta-picker";
import type { Seg2Trace } from "./seg2-reader";

type Tuning<T> = Omit<T, keyof Omit<PickTiming, "search">>;

/** Which picker to run and its parameters (timing comes from each trace). */
export type PickerChoice =
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
}

/** Runs the chosen picker on one trace. */
export function pickTrace(
  trace: PickableTrace,
  picker: PickerChoice = { method: "sta-lta" },
): PickResult {
  const timing = { sampleInterval: trace.sampleInterval, delay: trace.delay };
  switch (picker.method) {
    case "sta-lta":
      return pickStaLta(trace.samples, { ...picker.options, ...timing });
    case "aic":
      return pickAic(trace.samples, { ...picker.options, ...timing });
    case "energy-ratio":
      return pickEnergyRatio(trace.samples, { ...picker.options, ...timing });
  }
}

/** Picks every trace of a record; traces keep their order. */
export function pickRecord(
  record: { traces: readonly PickableTrace[] },
  picker: PickerChoice = { method: "sta-lta" },
): RecordPick[] {
  return record.traces.map((trace) => {
    const result = pickTrace(trace, picker);
    const base = {
      traceIndex: trace.index,
      channel: trace.channel ?? trace.index + 1,
      receiverPosition: trace.receiverPosition,
      sourcePosition: trace.sourcePosition,
    };
    return result.time === null
      ? { ...base, time: null, reason: result.reason }
      : { ...base, time: result.time };
  });
}

/**
 * The field feature's door to the field worker (workers/field.worker.ts): SEG-2 reading and
 * first-break picking run off the main thread through comlink. Where no Worker exists (jsdom
 * tests) the same functions run on this thread.
 */
import * as Comlink from "comlink";
import {
  fieldApi,
  type ObservedPick,
  type PickerChoice,
  type PickableTrace,
  type PlanForInterpretation,
  type PlanInterpretation,
  type PlanInterpretationOptions,
  type RecordPick,
  type Seg2Record,
} from "../../../../workers/field/index";

export interface FieldWorker {
  /** Reads a SEG-2 file; rejects with the reader's message (byte offset and what was expected). */
  readSeg2(bytes: ArrayBuffer): Promise<Seg2Record>;
  /** Picks every trace with the chosen picker. */
  pickRecord(traces: PickableTrace[], picker: PickerChoice): Promise<RecordPick[]>;
  /** Interprets the picks under the line (the same function as the `interpret` command). */
  interpret(
    plan: PlanForInterpretation,
    picks: ObservedPick[],
    options: PlanInterpretationOptions,
  ): Promise<PlanInterpretation>;
}

type Remote = Comlink.Remote<typeof fieldApi>;

const direct: FieldWorker = {
  async readSeg2(bytes) {
    return fieldApi.readSeg2(bytes);
  },
  async pickRecord(traces, picker) {
    return fieldApi.pickRecord({ traces }, picker);
  },
  async interpret(plan, picks, options) {
    return fieldApi.interpretPlanPicks(plan, picks, options);
  },
};

let current: FieldWorker | null = null;

function create(): FieldWorker {
  if (typeof Worker === "undefined") return direct;
  let remote: Remote;
  try {
    const worker = new Worker(new URL("../../../../workers/field.worker.ts", import.meta.url), {
      type: "module",
    });
    remote = Comlink.wrap<typeof fieldApi>(worker);
  } catch {
    return direct;
  }
  // Errors thrown in the worker arrive as plain Errors carrying the reader's message.
  return {
    readSeg2: (bytes) => remote.readSeg2(Comlink.transfer(bytes, [bytes])),
    pickRecord: (traces, picker) => remote.pickRecord({ traces }, picker),
    interpret: (plan, picks, options) => remote.interpretPlanPicks(plan, picks, options),
  };
}

/** The field worker (created on first use). */
export function fieldWorker(): FieldWorker {
  current ??= create();
  return current;
}

/** Replace the worker (tests). Returns the previous one. */
export function setFieldWorker(next: FieldWorker | null): FieldWorker | null {
  const previous = current;
  current = next;
  return previous;
}

/**
 * The field feature's door to the field worker (workers/field.worker.ts): SEG-2 reading,
 * first-break picking, the comparison with the candidate models, the modelled curves and the
 * interpretation run off the main thread through comlink. Where no Worker exists (jsdom tests)
 * the same functions run on this thread, loaded with a dynamic import so that the field core
 * and the engine never sit in the Field check's own chunk.
 */
import * as Comlink from "comlink";
import type {
  CandidateComparison,
  FieldApi,
  ModelledCurve,
  NamedModel,
  SegmentReading,
  ShotSideCount,
} from "../../../../workers/field/worker-api";
import type {
  ObservedPick,
  PickerChoice,
  PickableTrace,
  PlanForInterpretation,
  PlanInterpretation,
  PlanInterpretationOptions,
  RecordPick,
  ElevationCsvResult,
  PicksCsvResult,
  Seg2Record,
  SpreadSide,
} from "../../../../workers/field/index";
import type { GroundModel } from "@engine";

export type { CandidateComparison, ModelledCurve, NamedModel };

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
  /** Fit of every candidate and the misfit warnings against the chosen one (or the best). */
  compare(
    picks: ObservedPick[],
    candidates: NamedModel[],
    selected: number | null,
    pickError: number,
  ): Promise<CandidateComparison>;
  /** Modelled first-arrival times (s, null where none) for [source, receiver] positions (m). */
  modelledTimes(model: GroundModel, pairs: [number, number][]): Promise<(number | null)[]>;
  /** Modelled first-arrival curves, `curves[model][shot]`, over positions [from, to] (m). */
  modelledCurves(
    models: GroundModel[],
    shots: number[],
    from: number,
    to: number,
    samples?: number,
  ): Promise<{ curves: ModelledCurve[][]; maxTime: number }>;
  /** Offset ranges (m) of one shot and side suggested from a model. */
  suggestSegments(
    picks: ObservedPick[],
    sourcePosition: number,
    side: SpreadSide,
    model: GroundModel,
  ): Promise<[number, number][]>;
  /** The shots and sides that hold picks, with how many. */
  shotSides(picks: ObservedPick[]): Promise<ShotSideCount[]>;
  /** Line fits of offset ranges (m) of one shot and side, and their intercept-time reading. */
  readSegments(
    picks: ObservedPick[],
    sourcePosition: number,
    side: SpreadSide,
    ranges: [number, number][],
    pickError: number,
  ): Promise<SegmentReading>;
  /** Depth (m) of the top of `layer` of each model at each position (m). */
  candidateDepths(
    models: GroundModel[],
    layer: number,
    positions: number[],
  ): Promise<(number | null)[][]>;
  /** Reads a picks CSV. */
  parsePicksCsv(text: string, options: { timeUnit?: "ms" | "s" }): Promise<PicksCsvResult>;
  /** Reads a station-elevation CSV. */
  parseElevationCsv(text: string): Promise<ElevationCsvResult>;
}

let core: Promise<FieldApi> | null = null;
/** The field core on this thread, loaded on first use (a chunk of its own). */
const loadCore = (): Promise<FieldApi> =>
  (core ??= import("../../../../workers/field/worker-api").then((m) => m.fieldApi));

const direct: FieldWorker = {
  readSeg2: async (bytes) => (await loadCore()).readSeg2(bytes),
  pickRecord: async (traces, picker) => (await loadCore()).pickRecord({ traces }, picker),
  interpret: async (plan, picks, options) =>
    (await loadCore()).interpretPlanPicks(plan, picks, options),
  compare: async (picks, candidates, selected, pickError) =>
    (await loadCore()).compareCandidates(picks, candidates, selected, pickError),
  modelledTimes: async (model, pairs) => (await loadCore()).modelledTimes(model, pairs),
  modelledCurves: async (models, shots, from, to, samples) =>
    (await loadCore()).modelledCurves(models, shots, from, to, samples),
  suggestSegments: async (picks, sourcePosition, side, model) =>
    (await loadCore()).suggestSegments(picks, sourcePosition, side, model),
  shotSides: async (picks) => (await loadCore()).shotSides(picks),
  readSegments: async (picks, sourcePosition, side, ranges, pickError) =>
    (await loadCore()).readSegments(picks, sourcePosition, side, ranges, pickError),
  candidateDepths: async (models, layer, positions) =>
    (await loadCore()).candidateDepths(models, layer, positions),
  parsePicksCsv: async (text, options) => (await loadCore()).parsePicksCsv(text, options),
  parseElevationCsv: async (text) => (await loadCore()).parseElevationCsv(text),
};

let current: FieldWorker | null = null;

function create(): FieldWorker {
  if (typeof Worker === "undefined") return direct;
  let remote: Comlink.Remote<FieldApi>;
  try {
    const worker = new Worker(new URL("../../../../workers/field.worker.ts", import.meta.url), {
      type: "module",
    });
    remote = Comlink.wrap<FieldApi>(worker);
  } catch {
    return direct;
  }
  // Errors thrown in the worker arrive as plain Errors carrying the reader's message.
  return {
    readSeg2: (bytes) => remote.readSeg2(Comlink.transfer(bytes, [bytes])),
    pickRecord: (traces, picker) => remote.pickRecord({ traces }, picker),
    interpret: (plan, picks, options) => remote.interpretPlanPicks(plan, picks, options),
    compare: (picks, candidates, selected, pickError) =>
      remote.compareCandidates(picks, candidates, selected, pickError),
    modelledTimes: (model, pairs) => remote.modelledTimes(model, pairs),
    modelledCurves: (models, shots, from, to, samples) =>
      remote.modelledCurves(models, shots, from, to, samples),
    suggestSegments: (picks, sourcePosition, side, model) =>
      remote.suggestSegments(picks, sourcePosition, side, model),
    shotSides: (picks) => remote.shotSides(picks),
    readSegments: (picks, sourcePosition, side, ranges, pickError) =>
      remote.readSegments(picks, sourcePosition, side, ranges, pickError),
    candidateDepths: (models, layer, positions) => remote.candidateDepths(models, layer, positions),
    parsePicksCsv: (text, options) => remote.parsePicksCsv(text, options),
    parseElevationCsv: (text) => remote.parseElevationCsv(text),
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

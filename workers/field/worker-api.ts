/**
 * The functions the field worker exposes (plain data in, plain data out). Kept apart from the
 * worker entry (workers/field.worker.ts) so the same object can be exercised without a worker.
 */
import { pickAic } from "./aic-picker";
import { pickEnergyRatio } from "./energy-ratio-picker";
import { pickOnset } from "./onset-picker";
import { interpretPlanPicks } from "./plan-interpretation";
import { pickRecord, pickTrace } from "./pick-record";
import { readSeg2 } from "./seg2-reader";
import { pickStaLta } from "./sta-lta-picker";

/** SEG-2 reading, first-break picking and the interpretation under the line offered by the field worker. */
export const fieldApi = {
  readSeg2,
  pickRecord,
  pickTrace,
  pickStaLta,
  pickAic,
  pickEnergyRatio,
  pickOnset,
  interpretPlanPicks,
};

/** Type of the field worker's API (wrap it with comlink's Remote<>). */
export type FieldApi = typeof fieldApi;

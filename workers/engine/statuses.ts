/**
 * The four verdicts a refractor (or the direct wave) can get for a spread, and their order.
 * Order from best to worst: resolved < under-sampled < blind < inverted (inverted is worst).
 */

/** Verdict words used in every output. */
export type Status = "resolved" | "under-sampled" | "blind" | "inverted";

/** Verdicts from best to worst; the index is the numeric status code used in sweep grids. */
export const STATUSES: readonly Status[] = ["resolved", "under-sampled", "blind", "inverted"];

/** Numeric status codes (sweep grids, internal arrays). A larger code is a worse verdict. */
export const STATUS_CODE = {
  resolved: 0,
  "under-sampled": 1,
  blind: 2,
  inverted: 3,
} as const satisfies Record<Status, number>;

/** Sweep cell code: the varied model is geometrically invalid (interfaces cross in the spread). */
export const CELL_INVALID = 255;
/** Sweep cell code: not computed (the sweep was cancelled before reaching it). */
export const CELL_NOT_COMPUTED = 254;

/** The worse of two verdicts (inverted > blind > under-sampled > resolved). */
export function worseStatus(a: Status, b: Status): Status {
  return STATUS_CODE[a] >= STATUS_CODE[b] ? a : b;
}

/** The worst verdict of a list; "resolved" for an empty list. */
export function worstStatus(statuses: Iterable<Status>): Status {
  let worst: Status = "resolved";
  for (const s of statuses) worst = worseStatus(worst, s);
  return worst;
}

/** Verdict word for a numeric code 0–3. Throws RangeError for any other code. */
export function statusFromCode(code: number): Status {
  const s = STATUSES[code];
  if (s === undefined) throw new RangeError(`no status for code ${code}`);
  return s;
}

/** Number formatting of the Field check screen (SI units; times shown in ms). */
import type { LineMethod } from "../../../../workers/field/index";

/** "12.3 ms" from seconds; "–" for null. */
export function ms(seconds: number | null | undefined, digits = 1): string {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return "–";
  return `${(seconds * 1000).toFixed(digits)} ms`;
}

/** Signed ms: "+1.2 ms" / "−0.4 ms". */
export function signedMs(seconds: number | null | undefined, digits = 1): string {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return "–";
  const v = seconds * 1000;
  const text = Math.abs(v).toFixed(digits);
  return `${v < 0 && Number(text) !== 0 ? "−" : "+"}${text} ms`;
}

/** "12.5 m" with trailing zeros trimmed. */
export function metres(v: number | null | undefined, digits = 2): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "–";
  return `${Number(v.toFixed(digits))} m`;
}

/** "1520 m/s". */
export function speed(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "–";
  return `${Math.round(v)} m/s`;
}

/** "± 12 m/s" style uncertainty, empty when unknown. */
export function plusMinus(text: string, error: number | null | undefined): string {
  return error === null || error === undefined || !Number.isFinite(error)
    ? text
    : `${text} ± ${error}`;
}

/** File size in KB or MB. */
export function fileSize(bytes: number): string {
  if (bytes < 1024 * 1024) return `${Math.max(1, Math.round(bytes / 1024))} KB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

/**
 * Names of the interpretation methods under the line, as the field core's LINE_METHODS
 * (workers/field/line-interpretation.ts) gives them; repeated here so that the Field check's
 * chunk does not pull in the interpretation code (a test keeps the two the same).
 */
export const LINE_METHODS: Record<LineMethod, string> = {
  "plus-minus": "Plus-minus (Hagedoorn 1959)",
  "delay-time": "Delay times (Barry 1967)",
  grm: "Generalized reciprocal method (Palmer 1980)",
};

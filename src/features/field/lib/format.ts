/**
 * Number formatting of the Field check screen: stored values are SI; lengths and velocities are
 * shown in the user's unit (src/lib/units.ts), times in ms in both systems.
 */
import { toDisplay, unitLabel, type UnitSystem } from "@/lib/units";
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

/**
 * Decimal places of a position, offset or depth on the Field check: 0.01 m or 0.1 ft (about
 * 3 cm either way — finer than a tape-measured station, common practice for a field layout).
 */
export function lengthDigits(units: UnitSystem): number {
  return units === "imperial" ? 1 : 2;
}

/**
 * A position, offset or depth (stored in m) in the user's unit, trailing zeros trimmed:
 * "12.5 m", "41 ft"; "–" when unknown.
 */
export function length(
  v: number | null | undefined,
  units: UnitSystem,
  digits = lengthDigits(units),
): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "–";
  return `${lengthNumber(v, units, digits)} ${unitLabel("length", units)}`;
}

/** The number alone of `length` (for axis ticks and table cells under a titled column). */
export function lengthNumber(v: number, units: UnitSystem, digits = lengthDigits(units)): number {
  const shown = Number(toDisplay("length", v, units).toFixed(digits));
  return shown === 0 ? 0 : shown; // no "-0"
}

/** A velocity (stored in m/s) in the user's unit, whole: "1520 m/s", "4987 ft/s". */
export function speed(v: number | null | undefined, units: UnitSystem): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "–";
  return `${Math.round(toDisplay("velocity", v, units))} ${unitLabel("velocity", units)}`;
}

/**
 * A message of the field core, which states lengths and velocities in SI, in the user's unit:
 * "geophone 18 m (19 m offset)" reads "geophone 59.1 ft (62.3 ft offset)" for a feet user.
 * Unchanged for a metric user.
 */
export function localise(message: string, units: UnitSystem): string {
  if (units === "metric") return message;
  return message.replace(/(-?\d+(?:\.\d+)?) (m\/s|m)\b/g, (_, value: string, unit: string) =>
    unit === "m/s" ? speed(Number(value), units) : length(Number(value), units),
  );
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

/**
 * Units at the edges. Plans are stored and computed in SI (m, m/s, s); a user may prefer to
 * see and type lengths and velocities in feet. Every conversion between what is stored and
 * what is shown goes through this module, so the rest of the client never multiplies by a
 * conversion factor itself.
 *
 * Times are shown in milliseconds in both systems (first-break picks are read in ms);
 * angles in degrees.
 */

export type UnitSystem = "metric" | "imperial";

/** The kinds of quantity the designer shows. */
export type Quantity = "length" | "velocity" | "time" | "angle" | "count" | "percent";

/** One international foot in metres (exact by definition, 1959 international yard and pound agreement). */
export const METRES_PER_FOOT = 0.3048;

/** Multiply an SI value by this to get the displayed value. */
function factor(quantity: Quantity, system: UnitSystem): number {
  switch (quantity) {
    case "length":
    case "velocity":
      return system === "imperial" ? 1 / METRES_PER_FOOT : 1;
    case "time":
      return 1000; // s → ms in both systems
    case "angle":
    case "count":
    case "percent":
      return 1;
  }
}

/** The unit symbol shown beside a quantity ("m", "ft/s", "ms", "°", "" for counts). */
export function unitLabel(quantity: Quantity, system: UnitSystem): string {
  switch (quantity) {
    case "length":
      return system === "imperial" ? "ft" : "m";
    case "velocity":
      return system === "imperial" ? "ft/s" : "m/s";
    case "time":
      return "ms";
    case "angle":
      return "°";
    case "percent":
      return "%";
    case "count":
      return "";
  }
}

/** SI value → displayed value (m → ft, m/s → ft/s, s → ms). Non-finite input is returned unchanged. */
export function toDisplay(quantity: Quantity, si: number, system: UnitSystem): number {
  if (!Number.isFinite(si)) return si;
  return si * factor(quantity, system);
}

/** Displayed value → SI value (ft → m, ft/s → m/s, ms → s). Non-finite input is returned unchanged. */
export function fromDisplay(quantity: Quantity, shown: number, system: UnitSystem): number {
  if (!Number.isFinite(shown)) return shown;
  return shown / factor(quantity, system);
}

/** Decimal places that suit a quantity on screen. */
export function defaultDigits(quantity: Quantity): number {
  switch (quantity) {
    case "length":
      return 2;
    case "velocity":
    case "count":
      return 0;
    case "time":
      return 2;
    case "angle":
    case "percent":
      return 1;
  }
}

/**
 * Decimal places a box shows for a quantity: lengths to the millimetre in metres and to the
 * hundredth of a foot in feet, velocities to 1 m/s or 1 ft/s, times to 0.001 ms, angles to
 * 0.01°, counts whole (common practice for a field layout).
 */
export function inputDigits(quantity: Quantity, system: UnitSystem): number {
  switch (quantity) {
    case "length":
      return system === "imperial" ? 2 : 3;
    case "velocity":
    case "count":
      return 0;
    case "time":
      return 3;
    case "angle":
    case "percent":
      return 2;
  }
}

/**
 * A number for an input box: converted, rounded to a sensible precision without trailing
 * zeros ("12.5", not "12.500"). Returns "" for null/undefined/non-finite so the box is empty.
 */
export function formatInput(
  quantity: Quantity,
  si: number | null | undefined,
  system: UnitSystem,
): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return "";
  const shown = toDisplay(quantity, si, system);
  // Precision fit for the unit (inputDigits): a stored value the user leaves alone is saved
  // exactly as stored (plan-form.ts keeps the SI value behind each shown text).
  const rounded = Number(shown.toFixed(inputDigits(quantity, system)));
  return String(rounded === 0 ? 0 : rounded);
}

/**
 * Parse what the user typed (in display units) into SI. Empty → undefined; anything that is
 * not a number → NaN (the schema then names the field). Only "." is a decimal mark: "1,500"
 * is refused rather than guessed (thousands separator or decimal comma?).
 */
export function parseInput(
  quantity: Quantity,
  text: string | undefined,
  system: UnitSystem,
): number | undefined {
  const trimmed = (text ?? "").trim();
  if (trimmed === "") return undefined;
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(trimmed)) return Number.NaN;
  // Twelve significant digits drop the binary noise of the conversion ("10" ft is stored as
  // 3.048 m, not 3.0480000000000005) while keeping far more precision than a survey needs.
  return Number(fromDisplay(quantity, Number(trimmed), system).toPrecision(12));
}

const numberFormats = new Map<number, Intl.NumberFormat>();

/**
 * The en-GB number format with `digits` decimals, made once: `toLocaleString` with options
 * builds a new formatter on every call, which made redrawing a chart's readouts slow.
 */
function numberFormat(digits: number): Intl.NumberFormat {
  let format = numberFormats.get(digits);
  if (!format) {
    format = new Intl.NumberFormat("en-GB", {
      minimumFractionDigits: digits,
      maximumFractionDigits: digits,
    });
    numberFormats.set(digits, format);
  }
  return format;
}

/**
 * A value with its unit for reading ("12.50 m", "1,500 m/s", "3.20 ms"). Null, undefined or
 * non-finite values show as an em dash, never as "NaN".
 */
export function formatQuantity(
  quantity: Quantity,
  si: number | null | undefined,
  system: UnitSystem,
  digits = defaultDigits(quantity),
): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return "—";
  const shown = toDisplay(quantity, si, system);
  const text = numberFormat(digits).format(shown);
  const unit = unitLabel(quantity, system);
  if (!unit) return text;
  return quantity === "angle" || quantity === "percent" ? `${text}${unit}` : `${text} ${unit}`;
}

/**
 * Rewrite the SI limits inside a validation message in the units the boxes use, keeping the SI
 * figure: "velocity must be at most 10000 m/s" → "… 10000 m/s (32808 ft/s)" for an imperial
 * user; seconds gain their ms figure for everyone ("0.1 s (100 ms)").
 */
export function localiseMessage(message: string, system: UnitSystem): string {
  // Times are typed in ms in both systems: "between 0 and 0.1 s" → "… 0.1 s (100 ms)".
  const timed = message.replace(
    /(\d+(?:\.\d+)?) s\b/g,
    (whole, value: string) => `${whole} (${Number((Number(value) * 1000).toPrecision(6))} ms)`,
  );
  if (system === "metric") return timed;
  return timed.replace(/(-?\d+(?:\.\d+)?) (m\/s|m)\b/g, (whole, value: string, unit: string) => {
    const quantity: Quantity = unit === "m/s" ? "velocity" : "length";
    const shown = toDisplay(quantity, Number(value), system);
    return `${whole} (${Number(shown.toFixed(inputDigits(quantity, system)))} ${unitLabel(quantity, system)})`;
  });
}

/**
 * A signed difference with its unit: "+1.20 m", "−0.35 m", and "0.00 m" (no sign) when it
 * rounds to zero at the shown precision.
 */
export function formatSigned(
  quantity: Quantity,
  si: number | null | undefined,
  system: UnitSystem,
  digits = defaultDigits(quantity),
): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return "—";
  const magnitude = formatQuantity(quantity, Math.abs(si), system, digits);
  const rounded = Number(Math.abs(toDisplay(quantity, si, system)).toFixed(digits));
  if (rounded === 0) return magnitude;
  return `${si > 0 ? "+" : "−"}${magnitude}`;
}

/**
 * The engine's recommendation sentence in the reader's units. The engine writes SI figures
 * rounded for a sentence ("spacing at most 5.16 m … reaching 20.7 m offset"); the designer
 * rewrites the opening figures from the recommendation's own numbers (so they agree with the
 * "Largest spacing · branch length" line below it, in metres or feet) and the remaining lengths
 * and velocities in the reader's unit, never as a mixed "5.16 m (16.93 ft)".
 */
import { formatQuantity, type UnitSystem } from "@/lib/units";

const OPENING =
  /^(Across \d+ ground models?)(.*?): use (?:any spacing|spacing at most [\d.]+ m) and shot branches reaching [\d.]+ m offset \((\d+) channels at [\d.]+ m span [\d.]+ m\)\.(.*)$/s;

/**
 * SI lengths and velocities written in a sentence ("142 m", "from 12 to 79.5 m", "over 32–35 m",
 * "2400 m/s") in the reader's unit, to as many decimals as the engine wrote (its rounding says
 * how well the figure is known): "from 39.4 to 260.8 ft" for "from 12 to 79.5 m".
 */
export function readingInUnits(text: string, units: UnitSystem): string {
  if (units === "metric") return text;
  return text.replace(
    /(-?\d+(?:\.\d+)?)(?:( to |–)(-?\d+(?:\.\d+)?))? (m\/s|m)\b/g,
    (_whole, a: string, joint: string | undefined, b: string | undefined, unit: string) => {
      const quantity = unit === "m/s" ? "velocity" : "length";
      const decimals = (v: string) => v.split(".")[1]?.length ?? 0;
      const digits = quantity === "velocity" ? 0 : Math.max(decimals(a), decimals(b ?? ""));
      const one = (v: string) => formatQuantity(quantity, Number(v), units, digits);
      if (b === undefined) return one(a);
      // the unit once, after the second figure: "39.4 to 260.8 ft"
      return `${one(a).replace(/ \S+$/, "")}${joint}${one(b)}`;
    },
  );
}

export function recommendationSentence(
  rec: { text: string; maxSpacing: number | null; spreadLength: number; channels: number },
  spacingNow: number,
  units: UnitSystem,
): string {
  const match = OPENING.exec(rec.text);
  if (!match) return readingInUnits(rec.text, units);
  const [, head, lead, , rest] = match;
  const len = (m: number) => formatQuantity("length", m, units);
  const spacing = rec.maxSpacing ?? spacingNow;
  const spacingPart =
    rec.maxSpacing === null ? "any spacing" : `spacing at most ${len(rec.maxSpacing)}`;
  return (
    `${head}${readingInUnits(lead, units)}: use ${spacingPart} and shot branches reaching ` +
    `${len(rec.spreadLength)} offset (${rec.channels} channels at ${len(spacing)} span ` +
    `${len((rec.channels - 1) * spacing)}).${readingInUnits(rest, units)}`
  );
}

/**
 * A hidden layer's statement in the reader's units, its "at least … thick" written from the
 * refractor's own minimum thickness (so it agrees with the table's Min. thickness column:
 * the engine's 2.24 m read as 7.35 ft beside 7.34 ft).
 */
export function hiddenStatementInUnits(
  statement: string,
  minimumThickness: number | null | undefined,
  units: UnitSystem,
): string {
  const exact =
    typeof minimumThickness === "number" && Number.isFinite(minimumThickness)
      ? statement.replace(
          /at least -?\d+(?:\.\d+)? m thick/,
          `at least ${formatQuantity("length", minimumThickness, units)} thick`,
        )
      : statement;
  return readingInUnits(exact, units);
}

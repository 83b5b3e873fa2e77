import { formatQuantity, type UnitSystem } from "@/lib/units";

/**
 * The engine writes its recommendation sentences in metres ("spacing at most 3.57 m"); a user
 * who reads feet gets every length in the sentence converted, with the engine's decimals (at
 * least one, since a foot is a third of a metre), so the Review screen never mixes units.
 * Velocities (m/s) are left alone.
 */
export function sentenceInUnits(text: string, units: UnitSystem): string {
  if (units === "metric") return text;
  return text.replace(/(-?\d+(?:\.(\d+))?) m\b(?!\/)/g, (_, value: string, decimals?: string) =>
    formatQuantity("length", Number(value), units, Math.max(decimals?.length ?? 0, 1)),
  );
}

/**
 * Turning the engine's recommendation into a spread the crew can lay out: a practical
 * spacing no larger than the recommended maximum, enough channels for the recommended
 * branch length at that spacing, and the shots placed by their anchors (shot-anchors.ts:
 * anchored shots follow the spread's start, end or centre; fixed shots stay where they are).
 */
import { fromDisplay, toDisplay, type UnitSystem } from "@/lib/units";
import { MAX_CHANNELS, resolveShotPositions } from "@engine";
import type { Spread } from "./engine";

/** A round spacing (in the user's units) at or below `shown`: steps of 0.1, 0.25, 0.5, 1 or 5. */
export function practicalSpacing(shown: number): number {
  if (!(shown > 0) || !Number.isFinite(shown)) return shown;
  const step = shown < 1 ? 0.1 : shown < 2 ? 0.25 : shown < 5 ? 0.5 : shown < 20 ? 1 : 5;
  const rounded = Math.floor(shown / step + 1e-9) * step;
  return rounded > 0 ? Number(rounded.toFixed(6)) : Math.floor(shown * 100) / 100;
}

export interface AppliedSpread {
  spacing: number;
  channels: number;
  shots: number[];
}

/**
 * The spread after applying a recommendation (SI). `maxSpacing` null means any spacing
 * resolves the bounded segments: the spacing stays. Channels reach `spreadLength` from
 * offset 0 at the new spacing (the engine's own rule: ⌊L/Δx⌋ + 1), but never fewer than the
 * plan already lays out (applying never shortens a spread's channel count), up to the
 * schema's maximum.
 */
export function applyRecommendation(
  spread: Spread,
  recommendation: { maxSpacing: number | null; spreadLength: number },
  units: UnitSystem,
): AppliedSpread {
  const spacing =
    recommendation.maxSpacing === null
      ? spread.spacing
      : fromDisplay(
          "length",
          practicalSpacing(toDisplay("length", recommendation.maxSpacing, units)),
          units,
        );
  const channels = Math.min(
    MAX_CHANNELS,
    Math.max(2, spread.channels, Math.floor(recommendation.spreadLength / spacing + 1e-9) + 1),
  );
  const shots = Array.from(
    resolveShotPositions(spread.shots, {
      spacing,
      channels,
      firstGeophone: spread.firstGeophone,
    }),
  );
  return { spacing, channels, shots };
}

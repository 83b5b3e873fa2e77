/**
 * Applying the engine's recommendation with a choice of what to keep: the spacing (add
 * channels), the spread length, or the channel count. Each option says in one line what it
 * costs, never coarsens a working spacing without saying so, and flags what a crew cannot lay
 * out (a spacing under 0.25 m, more channels than the team's seismograph records). Shots are
 * placed by their anchors (shot-anchors.ts): anchored shots follow, fixed shots stay.
 */
import { MAX_CHANNELS, resolveShotPositions } from "@engine";
import { formatQuantity, fromDisplay, toDisplay, type UnitSystem } from "@/lib/units";
import { practicalSpacing } from "./apply-recommendation";
import type { Spread } from "./engine";

/** What an Apply keeps as it is. */
export type ApplyChoice = "recommended" | "keep-spacing" | "keep-length" | "keep-channels";

/** Smallest spacing a crew lays out by tape on the ground, m (common practice). */
export const MIN_PRACTICAL_SPACING = 0.25;

/** The seismograph channel count assumed until the team sets one (common practice: 24 or 48). */
export const DEFAULT_SEISMOGRAPH_CHANNELS = 48;

export interface ApplyOption {
  choice: ApplyChoice;
  /** Button text, e.g. "Keep spacing (add channels)". */
  title: string;
  /** Geophone spacing, m. */
  spacing: number;
  channels: number;
  /** Shot positions on the new spread, m (plan order). */
  shots: number[];
  /** One line: what this option does to the spread and to the answer. */
  consequence: string;
  /** Practical problems (impractical spacing, more channels than the seismograph, coarser). */
  flags: string[];
  /** True when the spread would not change. */
  unchanged: boolean;
}

/**
 * The recommendation as it stands, then the three ways to apply `recommendation` to `spread` (SI). `maxSpacing` null means any
 * spacing resolves the bounded segments. `seismographChannels` is the team's channel count.
 */
export function applyChoices(
  spread: Spread,
  recommendation: { maxSpacing: number | null; spreadLength: number },
  units: UnitSystem,
  seismographChannels: number = DEFAULT_SEISMOGRAPH_CHANNELS,
): ApplyOption[] {
  const len = (m: number) => formatQuantity("length", m, units);
  const practical = (m: number) =>
    fromDisplay("length", practicalSpacing(toDisplay("length", m, units)), units);
  const needed = recommendation.spreadLength;
  const length = (spread.channels - 1) * spread.spacing;
  // The finest spacing the recommendation asks for, never coarser than the plan has now.
  const fine =
    recommendation.maxSpacing === null
      ? spread.spacing
      : Math.min(spread.spacing, practical(recommendation.maxSpacing));
  // N channels at Δx span (N − 1)·Δx; enough intervals to reach `L`.
  const channelsFor = (L: number, dx: number) =>
    Math.min(MAX_CHANNELS, Math.max(2, Math.ceil(L / dx - 1e-9) + 1));
  const tooCoarse = (dx: number) =>
    recommendation.maxSpacing !== null && dx > recommendation.maxSpacing + 1e-9;

  const build = (
    choice: ApplyChoice,
    title: string,
    spacing: number,
    channels: number,
    consequence: string,
  ): ApplyOption => {
    const flags: string[] = [];
    if (spacing < MIN_PRACTICAL_SPACING - 1e-9)
      flags.push(
        `${len(spacing)} spacing is below ${len(MIN_PRACTICAL_SPACING)}: impractical to lay out (common practice).`,
      );
    if (channels > seismographChannels)
      flags.push(
        `${channels} channels is more than the seismograph's ${seismographChannels}: lay the line as ${Math.ceil(
          (channels - 1) / (seismographChannels - 1),
        )} overlapping spreads (roll-along) or use a second recorder.`,
      );
    if (spacing > spread.spacing + 1e-9)
      flags.push(`Coarser than the plan's ${len(spread.spacing)} spacing.`);
    const shots = Array.from(
      resolveShotPositions(spread.shots, {
        spacing,
        channels,
        firstGeophone: spread.firstGeophone,
      }),
    );
    const unchanged = Math.abs(spacing - spread.spacing) < 1e-9 && channels === spread.channels;
    return { choice, title, spacing, channels, shots, consequence, flags, unchanged };
  };

  const options: ApplyOption[] = [];

  // The recommendation itself: the finer spacing and enough channels to reach the offset.
  {
    const dx = fine;
    const n = Math.max(spread.channels, channelsFor(needed, dx));
    options.push(
      build(
        "recommended",
        "Follow the recommendation",
        dx,
        n,
        `${n} channels at ${len(dx)} span ${len((n - 1) * dx)} (${len(needed)} needed)${
          n > spread.channels ? `: ${n - spread.channels} more channels than now` : ""
        }.`,
      ),
    );
  }

  // Keep spacing: add channels until the branches reach the needed offset.
  {
    const dx = spread.spacing;
    const n = Math.max(spread.channels, channelsFor(needed, dx));
    const reach = (n - 1) * dx;
    const consequence = tooCoarse(dx)
      ? `${n} channels at ${len(dx)} reach ${len(reach)}, but ${len(dx)} is coarser than the ${len(recommendation.maxSpacing!)} the thinnest layer needs: it stays under-sampled.`
      : n === spread.channels
        ? `The ${n} channels at ${len(dx)} already reach ${len(reach)} (${len(needed)} needed).`
        : `${n - spread.channels} more channels: ${n} at ${len(dx)} span ${len(reach)} (${len(needed)} needed).`;
    options.push(build("keep-spacing", "Keep spacing (add channels)", dx, n, consequence));
  }

  // Keep spread length: the recommended spacing over the same length.
  {
    const dx = fine;
    const n = Math.min(MAX_CHANNELS, Math.max(2, Math.round(length / dx) + 1));
    const reach = (n - 1) * dx;
    const consequence =
      reach + 1e-9 >= needed
        ? `${n} channels at ${len(dx)} over the same ${len(reach)}.`
        : `${n} channels at ${len(dx)} over the same ${len(reach)}: branches fall ${len(needed - reach)} short of the ${len(needed)} needed, so the deepest refractor may not be reached.`;
    options.push(build("keep-length", "Keep spread length", dx, n, consequence));
  }

  // Keep channel count: the spacing that reaches the needed offset with these channels.
  {
    const n = spread.channels;
    const reachSpacing = n > 1 ? needed / (n - 1) : spread.spacing;
    let dx = fine;
    let consequence: string;
    if (n > 1 && (n - 1) * fine + 1e-9 < needed) {
      // Reaching the length needs a coarser spacing than the recommendation: say so.
      // Rounded up to the centimetre (or hundredth of a foot) so the branches still reach.
      dx = fromDisplay(
        "length",
        Math.ceil(toDisplay("length", reachSpacing, units) * 100 - 1e-6) / 100,
        units,
      );
      consequence = tooCoarse(dx)
        ? `${n} channels reach ${len(needed)} only at ${len(dx)}, coarser than the ${len(recommendation.maxSpacing!)} needed: choose between depth of reach and resolving the thin layer.`
        : `${n} channels at ${len(dx)} span ${len((n - 1) * dx)}.`;
    } else {
      consequence = `${n} channels at ${len(dx)} span ${len((n - 1) * dx)} (${len(needed)} needed).`;
    }
    options.push(build("keep-channels", "Keep channel count", dx, n, consequence));
  }
  return options;
}

/**
 * Applying the engine's recommendation with a choice of what to keep: the spacing (add
 * channels), the spread length, or the channel count. Each option says in one line what it
 * costs, never coarsens a working spacing without saying so, and flags what a crew cannot lay
 * out (a spacing under 0.25 m, more channels than the team's seismograph records). Shots are
 * placed by their anchors (shot-anchors.ts): anchored shots follow, fixed shots stay.
 */
import {
  MAX_CHANNELS,
  MAX_ROLL_ALONG_SPREADS,
  lineStations,
  resolveShotPositions,
  rollAlongFor,
  type RollAlong,
} from "@engine";
import { formatInput, formatQuantity, fromDisplay, toDisplay, type UnitSystem } from "@/lib/units";
import { practicalSpacing, type AppliedSpread } from "./apply-recommendation";
import type { Spread } from "./engine";
import type { PlanForm } from "./plan-form";

/** What an Apply keeps as it is. */
export type ApplyChoice = "recommended" | "keep-spacing" | "keep-length" | "keep-channels";

/** Smallest spacing a crew lays out by tape on the ground, m (common practice). */
export const MIN_PRACTICAL_SPACING = 0.25;

/** The seismograph channel count assumed until the team sets one (common practice: 24 or 48). */
export const DEFAULT_SEISMOGRAPH_CHANNELS = 48;

/**
 * Geophone stations two neighbouring spreads share when a line rolls along (common practice,
 * no single source: a couple of shared stations tie one spread's first breaks to the next's).
 */
export const DEFAULT_ROLL_ALONG_OVERLAP = 2;

/** A spread to apply: `rollAlong` null lays one spread (removing any roll-along), absent leaves it. */
export interface AppliedChoice extends AppliedSpread {
  rollAlong?: RollAlong | null;
}

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
  /** The roll-along this option lays (null: one spread; a plan's roll-along is removed). */
  rollAlong: RollAlong | null;
  /**
   * The same line laid as roll-along on the seismograph, when the option needs more channels
   * than it records: `channels` per spread = the seismograph's count.
   */
  asRollAlong?: ApplyOption;
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
  // Options count the stations of the whole line: a plan that rolls along keeps its line.
  const current = spread.rollAlong;
  const stationsNow = lineStations(spread.channels, current);
  spread = { ...spread, channels: stationsNow };
  const overlap =
    current && current.overlap < seismographChannels
      ? current.overlap
      : Math.min(DEFAULT_ROLL_ALONG_OVERLAP, seismographChannels - 1);
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
    const roll = channels > seismographChannels ? rolled(channels) : undefined;
    if (channels > seismographChannels)
      flags.push(
        roll
          ? `${channels} channels is more than the seismograph's ${seismographChannels}: lay it as roll-along (${roll.spreads} spreads, below) or use a second recorder.`
          : `${channels} channels is more than the seismograph's ${seismographChannels}: use a second recorder.`,
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
    const unchanged =
      !current && Math.abs(spacing - spread.spacing) < 1e-9 && channels === spread.channels;
    const option: ApplyOption = {
      choice,
      title,
      spacing,
      channels,
      shots,
      consequence: current
        ? `${consequence} One spread: the roll-along of ${current.spreads} spreads is removed.`
        : consequence,
      flags,
      unchanged,
      rollAlong: null,
    };
    if (roll) option.asRollAlong = rollAlongOption(option, roll);
    return option;
  };

  // The line of `stations` on the seismograph: undefined when it would take too many spreads.
  const rolled = (stations: number): RollAlong | undefined => {
    const roll = rollAlongFor(stations, seismographChannels, overlap);
    return roll && roll.spreads <= MAX_ROLL_ALONG_SPREADS ? roll : undefined;
  };

  const rollAlongOption = (line: ApplyOption, roll: RollAlong): ApplyOption => {
    const channels = seismographChannels;
    const dx = line.spacing;
    const stations = lineStations(channels, roll);
    const reach = (channels - 1) * dx;
    const same =
      !!current &&
      current.spreads === roll.spreads &&
      current.overlap === roll.overlap &&
      Math.abs(dx - spread.spacing) < 1e-9 &&
      lineStations(channels, roll) === stationsNow;
    return {
      choice: line.choice,
      title: `${line.title}, as roll-along`,
      spacing: dx,
      channels,
      shots: Array.from(
        resolveShotPositions(spread.shots, {
          spacing: dx,
          channels,
          firstGeophone: spread.firstGeophone,
        }),
      ),
      consequence:
        `${roll.spreads} spreads of ${channels} channels, overlapping by ${roll.overlap}, ${stations} stations over ${len((stations - 1) * dx)}.` +
        (reach + 1e-9 < needed
          ? ` Each shot is recorded by one spread of ${len(reach)}: offsets reach ${len(reach)}, short of the ${len(needed)} needed.`
          : ""),
      flags: line.flags.filter((f) => !/more than the seismograph/.test(f)),
      unchanged: same,
      rollAlong: roll,
    };
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
      ? // The recommended spacing is a guarantee (segment length / minimum count, wherever the
        // geophones fall); a coarser one may still resolve, so say "may", not "stays".
        `${n} channels at ${len(dx)} reach ${len(reach)}, but ${len(dx)} is coarser than the ${len(recommendation.maxSpacing!)} that gives the thinnest layer its geophones wherever they fall: it may be under-sampled (the verdict above says for this layout).`
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

/**
 * The form's spread after applying `applied` (SI) in the user's units, as one value so that
 * the designer sets it in one step (one undo step): spacing, channels, the shots' positions
 * (anchored rows keep their offsets) and the roll-along (null switches it off, keeping what
 * was typed; absent leaves it).
 */
export function appliedFormSpread(
  form: PlanForm["spread"],
  applied: AppliedChoice,
  units: UnitSystem,
): PlanForm["spread"] {
  const next: PlanForm["spread"] = {
    ...form,
    spacing: formatInput("length", applied.spacing, units),
    channels: String(applied.channels),
    shots: form.shots.map((row, i) =>
      applied.shots[i] === undefined
        ? row
        : { ...row, position: formatInput("length", applied.shots[i], units) },
    ),
  };
  if (applied.rollAlong === null)
    next.rollAlong = {
      on: false,
      spreads: form.rollAlong?.spreads ?? "",
      overlap: form.rollAlong?.overlap ?? "",
    };
  else if (applied.rollAlong)
    next.rollAlong = {
      on: true,
      spreads: String(applied.rollAlong.spreads),
      overlap: String(applied.rollAlong.overlap),
    };
  return next;
}

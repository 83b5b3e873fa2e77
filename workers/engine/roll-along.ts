/**
 * Roll-along: a line longer than the seismograph records at once, laid out as several spreads
 * of the plan's `channels` geophones each, every spread moved on by `channels − overlap`
 * stations from the one before, so that `overlap` geophone stations are shared between
 * neighbours (common practice: crews roll a recorder along a line and overlap the spreads so
 * the refractor is followed continuously).
 *
 * Stations are numbered continuously along the whole line from 1: channel c (1-based) of
 * spread k (1-based) stands on station (k − 1)·(channels − overlap) + c.
 *
 * Shots per spread: an anchored shot (shot-anchors.ts) is repeated on every spread, placed by
 * its anchor on that spread; a fixed shot is recorded by one spread only, the one whose centre
 * is nearest to it (the earlier spread on a tie). A plan without `rollAlong` is one spread.
 *
 * Pure; no DOM. Used by the analysis, the designer, the station CSV and the report.
 */
import { resolveShotPosition, type AnchoredShot, type SpreadGeometry } from "./shot-anchors";

/** How a line rolls along: the number of spreads and the geophone stations two neighbours share. */
export interface RollAlong {
  /** Number of spreads along the line (≥ 2). */
  spreads: number;
  /** Geophone stations shared by consecutive spreads (0 ≤ overlap < channels). */
  overlap: number;
}

/** A spread as roll-along needs it: geometry, shots and the optional roll-along. */
export interface RollingSpread extends SpreadGeometry {
  shots: readonly (AnchoredShot & { label?: string })[];
  rollAlong?: RollAlong;
}

/** One shot recorded by one spread of the line. */
export interface RollAlongShot {
  /** Index of the shot in the plan's `spread.shots` (0-based). */
  planShot: number;
  /** The shot's label from the plan, or "S<n>" (n = planShot + 1). */
  label: string;
  /** Resolved position along the line on this spread, m. */
  position: number;
}

/** One spread of a roll-along line. */
export interface RollAlongSpread {
  /** 1-based spread number. */
  index: number;
  /** Position of this spread's first and last geophone, m. */
  firstGeophone: number;
  lastGeophone: number;
  /** Station numbers under this spread's first and last geophone (continuous along the line). */
  firstStation: number;
  lastStation: number;
  /** The geometry of this spread alone (spacing, channels, firstGeophone). */
  geometry: SpreadGeometry;
  /** Shots this spread records, in plan order. */
  shots: RollAlongShot[];
}

/** The whole line: every spread, and the line's station count and extent. */
export interface RollAlongLayout {
  spreads: RollAlongSpread[];
  /** Geophone stations on the whole line. */
  stations: number;
  /** Stations each spread moves on from the one before (channels − overlap). */
  step: number;
  /** First and last geophone position of the whole line, m. */
  firstGeophone: number;
  lastGeophone: number;
}

/** Most spreads a plan may roll along (a practical limit for one line). */
export const MAX_ROLL_ALONG_SPREADS = 40;

/** Geophone stations on a line of `spreads` spreads of `channels` sharing `overlap`. */
export function lineStations(channels: number, roll: RollAlong | undefined): number {
  if (!roll) return channels;
  return channels + (roll.spreads - 1) * (channels - roll.overlap);
}

/**
 * Spreads of the line, in order along it. Without `rollAlong`, one spread equal to the plan's.
 * @throws RangeError when overlap is not below channels or spreads is below 1
 */
export function rollAlongLayout(spread: RollingSpread): RollAlongLayout {
  const { spacing, channels, firstGeophone } = spread;
  const roll = spread.rollAlong;
  const count = roll ? roll.spreads : 1;
  const overlap = roll ? roll.overlap : 0;
  if (!(count >= 1) || !Number.isInteger(count)) throw new RangeError("spreads must be ≥ 1");
  if (!(overlap >= 0 && overlap < channels))
    throw new RangeError("overlap must be at least 0 and below the channel count");
  const step = channels - overlap;
  const geometries: SpreadGeometry[] = [];
  for (let k = 0; k < count; k++) {
    geometries.push({ spacing, channels, firstGeophone: firstGeophone + k * step * spacing });
  }
  const centres = geometries.map((g) => g.firstGeophone + ((g.channels - 1) * g.spacing) / 2);
  // A fixed shot goes to the spread whose centre is nearest (the earlier one on a tie).
  const owner = spread.shots.map((shot) => {
    if (shot.anchor) return -1;
    let best = 0;
    for (let k = 1; k < count; k++) {
      if (Math.abs(shot.position - centres[k]) < Math.abs(shot.position - centres[best]) - 1e-9)
        best = k;
    }
    return best;
  });
  const spreads: RollAlongSpread[] = geometries.map((geometry, k) => {
    const shots: RollAlongShot[] = [];
    spread.shots.forEach((shot, i) => {
      if (shot.anchor || owner[i] === k) {
        shots.push({
          planShot: i,
          label: shot.label || `S${i + 1}`,
          position: resolveShotPosition(shot, geometry),
        });
      }
    });
    return {
      index: k + 1,
      firstGeophone: geometry.firstGeophone,
      lastGeophone: geometry.firstGeophone + (channels - 1) * spacing,
      firstStation: k * step + 1,
      lastStation: k * step + channels,
      geometry,
      shots,
    };
  });
  return {
    spreads,
    stations: lineStations(channels, roll),
    step,
    firstGeophone,
    lastGeophone: spreads[spreads.length - 1].lastGeophone,
  };
}

/**
 * The roll-along a crew would use for a line of `stations` geophone stations on a recorder of
 * `recorderChannels` channels sharing `overlap` stations: the fewest spreads whose line covers
 * every station (the last spread may run past the line's end). Undefined when one spread is
 * enough.
 */
export function rollAlongFor(
  stations: number,
  recorderChannels: number,
  overlap: number,
): RollAlong | undefined {
  if (stations <= recorderChannels) return undefined;
  const step = recorderChannels - overlap;
  if (!(step >= 1)) throw new RangeError("overlap must be below the recorder's channel count");
  const spreads = 1 + Math.ceil((stations - recorderChannels) / step);
  return { spreads, overlap };
}

/**
 * One spread of the line as a plan spread of its own: spread `index` (1-based)'s geometry
 * (its first geophone) and only the shots it records, each at its position on that spread (m),
 * without `rollAlong`. Anchors and labels are kept, so parsing the result as a plan spread
 * puts every shot where the layout does. Without `rollAlong` only index 1 exists and the
 * spread is returned as it is.
 * @throws RangeError when the line has no spread `index`
 */
export function spreadOfLine<S extends RollingSpread>(
  spread: S,
  index: number,
  layout: RollAlongLayout = rollAlongLayout(spread),
): Omit<S, "rollAlong"> {
  const part = layout.spreads[index - 1];
  if (!Number.isInteger(index) || !part) {
    throw new RangeError(`the line has ${layout.spreads.length} spread(s); no spread ${index}`);
  }
  const { rollAlong: _roll, ...rest } = spread;
  return {
    ...rest,
    firstGeophone: part.firstGeophone,
    shots: part.shots.map((s) => ({ ...spread.shots[s.planShot], position: s.position })),
  };
}

/**
 * The whole line as one spread, for checks that need its extent: every station (channels =
 * the line's stations, from the first spread's first geophone) and every shot of every spread
 * at its position there, fixed (a shot repeated on several spreads appears once per spread).
 * Without `rollAlong` the spread itself is returned.
 */
export function wholeLine<S extends RollingSpread>(spread: S): S {
  if (!spread.rollAlong) return spread;
  const layout = rollAlongLayout(spread);
  const { rollAlong: _roll, ...rest } = spread;
  return {
    ...rest,
    channels: layout.stations,
    shots: layout.spreads.flatMap((part) =>
      part.shots.map((s) => {
        const { anchor: _anchor, ...shot } = spread.shots[s.planShot];
        return { ...shot, position: s.position };
      }),
    ),
  } as unknown as S;
}

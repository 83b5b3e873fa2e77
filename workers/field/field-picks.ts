/**
 * Observed first-break picks and the modelled first arrivals they are compared with. A pick
 * belongs to one shot; its offset is the distance between shot and geophone along the line,
 * and its side says whether the geophone lies at larger ("forward") or smaller ("reverse")
 * positions than the shot.
 */

/** One observed first break. */
export interface ObservedPick {
  /** Shot position along the line, m. */
  sourcePosition: number;
  /** Geophone position along the line, m. */
  receiverPosition: number;
  /** First-break time, s. */
  time: number;
}

/**
 * Modelled first-arrival time, s, for a shot and a geophone position, m (the engine provides
 * one per ground model). May return NaN or Infinity where the model has no arrival.
 */
export type FirstArrivalFn = (sourcePosition: number, receiverPosition: number) => number;

/** Geophones at larger positions than the shot are "forward", smaller "reverse". */
export type SpreadSide = "forward" | "reverse";

/** Picks of one shot on one side, sorted by offset. */
export interface ShotSide {
  sourcePosition: number;
  side: SpreadSide;
  picks: (ObservedPick & { offset: number })[];
}

/** Throws a RangeError unless every pick holds finite positions and a finite, non-negative time. */
export function checkPicks(picks: readonly ObservedPick[]): void {
  picks.forEach((p, i) => {
    if (
      !Number.isFinite(p.sourcePosition) ||
      !Number.isFinite(p.receiverPosition) ||
      !Number.isFinite(p.time) ||
      p.time < 0
    ) {
      throw new RangeError(`pick ${i + 1} needs finite positions and a finite time ≥ 0`);
    }
  });
}

/**
 * Groups picks by shot (positions equal within 1 mm) and side. A geophone at the shot itself
 * (offset 0) goes to both sides. Groups are ordered by shot position, forward before reverse.
 */
export function groupByShotSide(picks: readonly ObservedPick[]): ShotSide[] {
  const groups: ShotSide[] = [];
  const find = (s: number, side: SpreadSide) => {
    let g = groups.find((x) => x.side === side && Math.abs(x.sourcePosition - s) <= 0.001);
    if (!g) {
      g = { sourcePosition: s, side, picks: [] };
      groups.push(g);
    }
    return g;
  };
  for (const p of picks) {
    const d = p.receiverPosition - p.sourcePosition;
    const offset = Math.abs(d);
    if (d >= 0) find(p.sourcePosition, "forward").picks.push({ ...p, offset });
    if (d <= 0) find(p.sourcePosition, "reverse").picks.push({ ...p, offset });
  }
  for (const g of groups) g.picks.sort((a, b) => a.offset - b.offset);
  return groups.sort(
    (a, b) =>
      a.sourcePosition - b.sourcePosition ||
      (a.side === b.side ? 0 : a.side === "forward" ? -1 : 1),
  );
}

/** Offset–time points of one shot (position within 1 mm) on one side, sorted by offset. */
export function shotSidePoints(
  picks: readonly ObservedPick[],
  sourcePosition: number,
  side: SpreadSide,
): { offset: number; time: number }[] {
  const group = groupByShotSide(picks).find(
    (g) => g.side === side && Math.abs(g.sourcePosition - sourcePosition) <= 0.001,
  );
  return group ? group.picks.map((p) => ({ offset: p.offset, time: p.time })) : [];
}

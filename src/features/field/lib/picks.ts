/**
 * The picks being edited on the Field check screen (pure functions): keyed by shot and
 * geophone position (to the millimetre, as the server checks duplicates), merged from
 * automatic picking, adjusted by clicking, or replaced from a CSV.
 */
import type { FirstBreakPick, PickOrigin } from "@/contracts/field";
import type { Spread } from "@engine";

/** Key of a pick: shot and geophone positions to the millimetre. */
export const pickKey = (sourcePosition: number, receiverPosition: number) =>
  `${sourcePosition.toFixed(3)}|${receiverPosition.toFixed(3)}`;

const order = (a: FirstBreakPick, b: FirstBreakPick) =>
  a.sourcePosition - b.sourcePosition || a.receiverPosition - b.receiverPosition;

/** `incoming` replaces picks with the same key in `existing`; the rest stay. Sorted by shot, geophone. */
export function mergePicks(
  existing: readonly FirstBreakPick[],
  incoming: readonly FirstBreakPick[],
): FirstBreakPick[] {
  const byKey = new Map(existing.map((p) => [pickKey(p.sourcePosition, p.receiverPosition), p]));
  for (const p of incoming) byKey.set(pickKey(p.sourcePosition, p.receiverPosition), p);
  return [...byKey.values()].sort(order);
}

/** Sets (or adds) the pick of one shot and geophone, marked as adjusted by hand. */
export function adjustPick(
  picks: readonly FirstBreakPick[],
  sourcePosition: number,
  receiverPosition: number,
  time: number,
): FirstBreakPick[] {
  if (!Number.isFinite(time) || time < 0) throw new RangeError("a pick time must be ≥ 0 s");
  return mergePicks(picks, [{ sourcePosition, receiverPosition, time, origin: "adjusted" }]);
}

/** Removes the pick of one shot and geophone. */
export function removePick(
  picks: readonly FirstBreakPick[],
  sourcePosition: number,
  receiverPosition: number,
): FirstBreakPick[] {
  const key = pickKey(sourcePosition, receiverPosition);
  return picks.filter((p) => pickKey(p.sourcePosition, p.receiverPosition) !== key);
}

/** The pick of one shot and geophone, if any. */
export function findPick(
  picks: readonly FirstBreakPick[],
  sourcePosition: number,
  receiverPosition: number,
): FirstBreakPick | undefined {
  const key = pickKey(sourcePosition, receiverPosition);
  return picks.find((p) => pickKey(p.sourcePosition, p.receiverPosition) === key);
}

/** How many picks came from each origin. */
export function countByOrigin(picks: readonly FirstBreakPick[]): Record<PickOrigin, number> {
  const counts: Record<PickOrigin, number> = { auto: 0, adjusted: 0, csv: 0 };
  for (const p of picks) counts[p.origin] += 1;
  return counts;
}

/** Distinct shot positions, ascending. */
export function shotPositions(picks: readonly { sourcePosition: number }[]): number[] {
  return [...new Set(picks.map((p) => p.sourcePosition))].sort((a, b) => a - b);
}

/** True when two pick lists hold the same picks (order ignored). */
export function samePicks(a: readonly FirstBreakPick[], b: readonly FirstBreakPick[]): boolean {
  if (a.length !== b.length) return false;
  const byKey = new Map(a.map((p) => [pickKey(p.sourcePosition, p.receiverPosition), p]));
  return b.every((p) => {
    const q = byKey.get(pickKey(p.sourcePosition, p.receiverPosition));
    return q !== undefined && q.time === p.time && q.origin === p.origin;
  });
}

/** Where one trace of a record stands, and whether that came from the record or the plan. */
export interface TracePlacement {
  receiverPosition: number;
  sourcePosition: number;
  receiverFrom: "record" | "plan";
}

/**
 * Positions of the traces of a record. RECEIVER_LOCATION when the record states it, else the
 * plan's geophone of that channel (firstGeophone + (channel − 1)·spacing); the shot position
 * is the one chosen on the screen (defaulting to the record's SOURCE_LOCATION).
 */
export function placeTraces(
  traces: readonly { index: number; channel: number | null; receiverPosition: number | null }[],
  spread: Pick<Spread, "firstGeophone" | "spacing">,
  sourcePosition: number,
): TracePlacement[] {
  return traces.map((t) => {
    const channel = t.channel ?? t.index + 1;
    return t.receiverPosition !== null
      ? { receiverPosition: t.receiverPosition, sourcePosition, receiverFrom: "record" }
      : {
          receiverPosition: spread.firstGeophone + (channel - 1) * spread.spacing,
          sourcePosition,
          receiverFrom: "plan",
        };
  });
}

/** The plan shot nearest to a position (its index), or 0 when there is no position. */
export function nearestShot(
  shots: readonly { position: number }[],
  position: number | null,
): number {
  if (position === null || shots.length === 0) return 0;
  let best = 0;
  shots.forEach((s, i) => {
    if (Math.abs(s.position - position) < Math.abs(shots[best].position - position)) best = i;
  });
  return best;
}

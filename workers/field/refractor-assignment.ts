/**
 * Which refractor each first break belongs to. The user assigns picks by segment: for one shot,
 * the geophones between two positions travelled along the top of one layer (layer 1 = the
 * direct wave, layer L ≥ 2 = the head wave along the top of layer L). A suggestion comes from a
 * candidate ground model: consecutive geophones whose modelled first arrival is the same wave.
 */
import type { ObservedPick } from "./field-picks";

/** One segment of one shot's picks assigned to a layer. Positions in m, inclusive. */
export interface LayerAssignment {
  /** Shot position, m. */
  shot: number;
  /** 1 = direct wave; L ≥ 2 = head wave along the top of layer L. */
  layer: number;
  /** Geophone positions bounding the segment, m (from ≤ to). */
  from: number;
  to: number;
}

/** Positions closer than this are the same, m. */
const SAME = 0.001;

/**
 * The layer a pick is assigned to, or null. When segments overlap, the deeper layer wins
 * (a later assignment cannot be hidden by an earlier one).
 */
export function assignedLayer(
  assignments: readonly LayerAssignment[],
  pick: Pick<ObservedPick, "sourcePosition" | "receiverPosition">,
): number | null {
  let layer: number | null = null;
  for (const a of assignments) {
    if (Math.abs(a.shot - pick.sourcePosition) > SAME) continue;
    if (pick.receiverPosition < a.from - SAME || pick.receiverPosition > a.to + SAME) continue;
    if (layer === null || a.layer > layer) layer = a.layer;
  }
  return layer;
}

/**
 * Checks a list of assignments: finite positions, from ≤ to, whole layers ≥ 1.
 * @throws RangeError naming the entry (1-based) and the field
 */
export function checkAssignments(assignments: readonly LayerAssignment[]): void {
  assignments.forEach((a, i) => {
    const where = `assignment ${i + 1}`;
    if (!Number.isFinite(a.shot)) throw new RangeError(`${where}: shot must be a finite position`);
    if (!Number.isInteger(a.layer) || a.layer < 1 || a.layer > 12) {
      throw new RangeError(`${where}: layer must be a whole number from 1 to 12`);
    }
    if (!Number.isFinite(a.from) || !Number.isFinite(a.to) || a.to < a.from) {
      throw new RangeError(`${where}: from and to must be finite positions, from ≤ to`);
    }
  });
}

/**
 * Suggests assignments from a model: for each shot and side, consecutive picks whose modelled
 * first arrival (`arrivalLayer`, 1 = direct, L = head wave of layer L, null = none) is the
 * same wave form one segment. Segments of one pick are kept (the user may widen them).
 */
export function suggestAssignments(
  picks: readonly ObservedPick[],
  arrivalLayer: (shot: number, receiver: number) => number | null,
): LayerAssignment[] {
  const shots = [...new Set(picks.map((p) => p.sourcePosition))].sort((a, b) => a - b);
  const out: LayerAssignment[] = [];
  for (const shot of shots) {
    for (const side of [-1, 1]) {
      const mine = picks
        .filter((p) => Math.abs(p.sourcePosition - shot) <= SAME)
        .filter((p) => Math.sign(p.receiverPosition - shot) === side)
        .sort((a, b) => Math.abs(a.receiverPosition - shot) - Math.abs(b.receiverPosition - shot));
      let current: LayerAssignment | null = null;
      for (const p of mine) {
        const layer = arrivalLayer(shot, p.receiverPosition);
        if (layer === null) {
          current = null;
          continue;
        }
        if (current && current.layer === layer) {
          current.from = Math.min(current.from, p.receiverPosition);
          current.to = Math.max(current.to, p.receiverPosition);
        } else {
          current = { shot, layer, from: p.receiverPosition, to: p.receiverPosition };
          out.push(current);
        }
      }
    }
  }
  return out;
}

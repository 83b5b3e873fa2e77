/**
 * Spread geometry: geophone positions and the two branches of a shot.
 *
 * A shot's *forward* branch holds the geophones at larger positions than the shot, its
 * *reverse* branch those at smaller positions; a geophone exactly at the shot belongs to
 * neither. Offsets are |geophone − shot| in metres and grow with the branch index k.
 */

/** Which side of the shot a branch lies on. */
export type Side = "forward" | "reverse";

/** The numeric spread: geophones at firstGeophone + i·spacing (i = 0..channels−1), m. */
export interface Layout {
  readonly spacing: number;
  readonly channels: number;
  readonly firstGeophone: number;
  /** Shot positions, m. */
  readonly shots: ArrayLike<number>;
}

/** One branch: `count` geophones, k-th at geophone index `start + sign·k`. */
export interface Branch {
  readonly side: Side;
  /** +1 forward, −1 reverse. */
  readonly sign: 1 | -1;
  /** Shot position, m. */
  readonly shot: number;
  /** Number of geophones on the branch (0 when empty). */
  readonly count: number;
  /** Geophone index of the nearest geophone. */
  readonly start: number;
}

/** Position of geophone i, m. */
export function geophonePosition(layout: Layout, i: number): number {
  return layout.firstGeophone + i * layout.spacing;
}

/** Smallest and largest position of any geophone or shot, m. */
export function layoutExtent(layout: Layout): { from: number; to: number } {
  let from = Math.min(layout.firstGeophone, geophonePosition(layout, layout.channels - 1));
  let to = Math.max(layout.firstGeophone, geophonePosition(layout, layout.channels - 1));
  for (let s = 0; s < layout.shots.length; s++) {
    from = Math.min(from, layout.shots[s]);
    to = Math.max(to, layout.shots[s]);
  }
  return { from, to };
}

/** The branch of a shot on one side (possibly empty). */
export function branchOf(layout: Layout, shot: number, side: Side): Branch {
  const { spacing, channels } = layout;
  const rel = (shot - layout.firstGeophone) / spacing;
  if (side === "forward") {
    // first index with position > shot
    let i = Math.min(channels, Math.max(0, Math.floor(rel) + 1));
    while (i > 0 && geophonePosition(layout, i - 1) > shot) i--;
    while (i < channels && !(geophonePosition(layout, i) > shot)) i++;
    return { side, sign: 1, shot, count: channels - i, start: i };
  }
  // one past the last index with position < shot
  let j = Math.min(channels, Math.max(0, Math.ceil(rel)));
  while (j < channels && geophonePosition(layout, j) < shot) j++;
  while (j > 0 && !(geophonePosition(layout, j - 1) < shot)) j--;
  return { side, sign: -1, shot, count: j, start: j - 1 };
}

/** Geophone index of the k-th geophone of a branch. */
export function branchGeophone(branch: Branch, k: number): number {
  return branch.start + branch.sign * k;
}

/** Offset of the k-th geophone of a branch, m (the one canonical offset computation). */
export function branchOffset(layout: Layout, branch: Branch, k: number): number {
  return branch.sign * (geophonePosition(layout, branch.start + branch.sign * k) - branch.shot);
}

/** Smallest k whose offset is ≥ `offset` (branch.count when none). */
export function firstAtOrBeyond(layout: Layout, branch: Branch, offset: number): number {
  const n = branch.count;
  if (n === 0 || offset === -Infinity) return 0;
  if (offset === Infinity) return n;
  const o0 = branchOffset(layout, branch, 0);
  let k = Math.ceil((offset - o0) / layout.spacing);
  if (!(k > 0)) k = 0;
  if (k > n) k = n;
  while (k > 0 && branchOffset(layout, branch, k - 1) >= offset) k--;
  while (k < n && branchOffset(layout, branch, k) < offset) k++;
  return k;
}

/** Number of geophones of the branch with from ≤ offset < to. */
export function countBetween(layout: Layout, branch: Branch, from: number, to: number): number {
  if (!(to > from)) return 0;
  return firstAtOrBeyond(layout, branch, to) - firstAtOrBeyond(layout, branch, from);
}

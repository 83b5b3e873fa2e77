/**
 * One shot's first breaks on one refractor as a function of geophone position (a "branch"),
 * with linear interpolation between picks, short straight-line extrapolation beyond them, and
 * phantoming: where the shot does not cover a stretch (near the shot, before its crossover), a
 * branch of a farther shot in the same direction is shifted onto it. Head-wave branches from
 * shots on the same side of a stretch are parallel there (Hagedoorn 1959; Palmer 1980 §
 * "phantoming"; common practice), so the shift is their mean difference where both exist.
 * Positions in m, times in s.
 */

/** One point of a branch. */
export interface BranchPoint {
  /** Geophone position, m. */
  position: number;
  /** First-break time, s. */
  time: number;
  /** True when the time is phantomed from another shot. */
  phantom: boolean;
}

/** A branch: one shot, one refractor, points sorted by position. */
export interface Branch {
  /** Shot position, m. */
  shot: number;
  /** +1 when the waves travel towards increasing position (geophones beyond the shot). */
  direction: 1 | -1;
  points: BranchPoint[];
}

/** Builds a branch from (position, time) pairs of one shot on one side. */
export function makeBranch(
  shot: number,
  direction: 1 | -1,
  picks: readonly { position: number; time: number }[],
): Branch {
  const points = picks
    .filter((p) => Math.sign(p.position - shot) === direction)
    .map((p) => ({ position: p.position, time: p.time, phantom: false }))
    .sort((a, b) => a.position - b.position);
  return { shot, direction, points };
}

/** Least-squares line through points, or null for fewer than 2 distinct positions. */
function line(points: readonly BranchPoint[]): { slope: number; intercept: number } | null {
  const n = points.length;
  if (n < 2) return null;
  const mx = points.reduce((a, p) => a + p.position, 0) / n;
  const mt = points.reduce((a, p) => a + p.time, 0) / n;
  let sxx = 0;
  let sxt = 0;
  for (const p of points) {
    sxx += (p.position - mx) ** 2;
    sxt += (p.position - mx) * (p.time - mt);
  }
  if (!(sxx > 0)) return null;
  const slope = sxt / sxx;
  return { slope, intercept: mt - slope * mx };
}

/** A branch's time at a position and how it was found. */
export interface BranchTime {
  time: number;
  /** "pick" (a pick there), "between" (interpolated), "beyond" (extrapolated). */
  how: "pick" | "between" | "beyond";
  phantom: boolean;
}

/**
 * Time of the branch at `x`, m: the pick there, linear interpolation between the two picks
 * around it, or — up to `reach` m beyond the last pick — the straight line through the last
 * three picks at that end (a head-wave branch is straight locally). Null otherwise.
 */
export function branchTimeAt(branch: Branch, x: number, reach = 0): BranchTime | null {
  const pts = branch.points;
  if (pts.length === 0) return null;
  for (const p of pts) {
    if (Math.abs(p.position - x) <= 0.001) return { time: p.time, how: "pick", phantom: p.phantom };
  }
  const first = pts[0];
  const last = pts[pts.length - 1];
  if (x > first.position && x < last.position) {
    let i = 1;
    while (pts[i].position < x) i++;
    const a = pts[i - 1];
    const b = pts[i];
    const time = a.time + ((b.time - a.time) * (x - a.position)) / (b.position - a.position);
    return { time, how: "between", phantom: a.phantom || b.phantom };
  }
  const distance = x < first.position ? first.position - x : x - last.position;
  if (distance > reach) return null;
  const end = x < first.position ? pts.slice(0, 3) : pts.slice(-3);
  const l = line(end);
  if (!l) return null;
  return {
    time: l.intercept + l.slope * x,
    how: "beyond",
    phantom: end.some((p) => p.phantom),
  };
}

/**
 * Fills the stretches `primary` does not cover with branches of the same direction, each
 * shifted by its mean difference from the primary where both have picks (at least two common
 * geophones needed). Returns a new branch; filled points are marked phantom. Original picks
 * are never changed.
 */
export function phantomBranch(primary: Branch, others: readonly Branch[]): Branch {
  const points = primary.points.map((p) => ({ ...p }));
  const has = (x: number) => points.some((p) => Math.abs(p.position - x) <= 0.001);
  for (const other of others) {
    if (other.direction !== primary.direction || other === primary) continue;
    const diffs: number[] = [];
    for (const p of other.points) {
      const t = branchTimeAt(primary, p.position);
      if (t && t.how !== "beyond") diffs.push(t.time - p.time);
    }
    if (diffs.length < 2) continue;
    const shift = diffs.reduce((a, b) => a + b, 0) / diffs.length;
    for (const p of other.points) {
      // only on the far side of the primary shot, where its head wave can exist
      if (Math.sign(p.position - primary.shot) !== primary.direction) continue;
      if (has(p.position)) continue;
      points.push({ position: p.position, time: p.time + shift, phantom: true });
    }
  }
  points.sort((a, b) => a.position - b.position);
  return { ...primary, points };
}

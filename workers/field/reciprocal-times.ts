/**
 * Reciprocal-time check between every pair of reversed shots: the first break of shot A
 * recorded at shot B's position must equal that of shot B recorded at A's position (the ray
 * path is the same, travelled backwards). A difference beyond a few milliseconds points to a
 * mis-pick, a wrong shot position or a trigger delay (common practice).
 */
import { branchTimeAt, makeBranch } from "./branch-times";
import type { ObservedPick } from "./field-picks";

/** The reciprocal-time check of one pair of shots. Times in s, positions in m. */
export interface ReciprocalCheck {
  /** Shot positions [A, B], A < B. */
  shots: [number, number];
  /** Time of shot A at B's position, s. */
  forward: number;
  /** Time of shot B at A's position, s. */
  reverse: number;
  /** forward − reverse, s. */
  difference: number;
  /** Allowed difference, s. */
  tolerance: number;
  /** |difference| ≤ tolerance. */
  agrees: boolean;
  /** True when a time had to be extrapolated beyond the picks (the shot lies off the spread). */
  extrapolated: boolean;
}

/**
 * Tolerance of the reciprocal check, s: the larger of 2 ms and three times the error of a
 * difference of two picks (3·√2·σ_t) — "a few milliseconds" is common practice.
 */
export function reciprocalTolerance(pickError: number): number {
  return Math.max(0.002, 3 * Math.SQRT2 * pickError);
}

/**
 * Checks every pair of shots that record each other's positions (by a pick there, between
 * picks, or on the straight line through the nearest three picks up to `reach` m beyond them).
 * @param reach how far beyond its last pick a shot's times may be extended, m
 */
export function reciprocalChecks(
  picks: readonly ObservedPick[],
  pickError: number,
  reach: number,
): ReciprocalCheck[] {
  const shots = [...new Set(picks.map((p) => p.sourcePosition))].sort((a, b) => a - b);
  const tolerance = reciprocalTolerance(pickError);
  const branch = (shot: number, direction: 1 | -1) =>
    makeBranch(
      shot,
      direction,
      picks
        .filter((p) => Math.abs(p.sourcePosition - shot) <= 0.001)
        .map((p) => ({ position: p.receiverPosition, time: p.time })),
    );
  const out: ReciprocalCheck[] = [];
  for (let i = 0; i < shots.length; i++) {
    for (let j = i + 1; j < shots.length; j++) {
      const a = shots[i];
      const b = shots[j];
      const f = branchTimeAt(branch(a, 1), b, reach);
      const r = branchTimeAt(branch(b, -1), a, reach);
      if (!f || !r) continue;
      const difference = f.time - r.time;
      out.push({
        shots: [a, b],
        forward: f.time,
        reverse: r.time,
        difference,
        tolerance,
        agrees: Math.abs(difference) <= tolerance,
        extrapolated: f.how === "beyond" || r.how === "beyond",
      });
    }
  }
  return out;
}

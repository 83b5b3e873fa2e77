/**
 * Second look at a record's picks through their neighbours: a first break changes smoothly from
 * geophone to geophone (its slope is a slowness, its kinks are crossovers), so each pick is
 * compared with what its neighbours predict, and each pick gets a quality word:
 * - "clear": the onset stands well above the noise and agrees with its neighbours;
 * - "weak": a pick, but faint, or off its neighbours' trend (check it by eye);
 * - "none": no pick.
 * Common practice in refraction picking (a pick off its neighbours' trend is re-checked); the
 * thresholds are ours and named below.
 */

/** How far a pick is trusted. */
export type PickQuality = "clear" | "weak" | "none";

/** Picks a measured signal-to-noise (peak / 4σ) below this are weak (our choice). */
export const WEAK_SNR = 2;

/**
 * Tolerance between a pick and its neighbours' prediction: the larger of 2 ms and 4 samples
 * (our choice: about twice the usual pick error of hammer data, from memory).
 */
export function neighbourTolerance(sampleInterval: number): number {
  return Math.max(0.002, 4 * sampleInterval);
}

/**
 * The first-break time that the neighbours of trace `i` predict, s: the median of linear
 * interpolation between the nearest pick on each side and linear extrapolation from the two
 * nearest on either side. Positions in m, times in s (null = no pick). Null when fewer than two
 * neighbours hold picks.
 */
export function neighbourPrediction(
  positions: readonly number[],
  times: readonly (number | null)[],
  i: number,
): number | null {
  const left: number[] = [];
  const right: number[] = [];
  for (let j = i - 1; j >= 0 && left.length < 2; j--) if (times[j] !== null) left.push(j);
  for (let j = i + 1; j < times.length && right.length < 2; j++)
    if (times[j] !== null) right.push(j);
  const x = positions[i];
  const line = (a: number, b: number): number | null => {
    const xa = positions[a];
    const xb = positions[b];
    if (xa === xb) return null;
    const ta = times[a] as number;
    const tb = times[b] as number;
    return ta + ((tb - ta) * (x - xa)) / (xb - xa);
  };
  const guesses: number[] = [];
  const push = (v: number | null) => {
    if (v !== null && Number.isFinite(v)) guesses.push(v);
  };
  if (left.length && right.length) push(line(left[0], right[0]));
  if (left.length === 2) push(line(left[1], left[0]));
  if (right.length === 2) push(line(right[0], right[1]));
  if (guesses.length === 0) return null;
  guesses.sort((a, b) => a - b);
  const mid = Math.floor(guesses.length / 2);
  return guesses.length % 2 ? guesses[mid] : (guesses[mid - 1] + guesses[mid]) / 2;
}

/**
 * Quality of one pick from its measured signal-to-noise (null when the picker gives none) and
 * its distance from the neighbours' prediction (null when there is none), s.
 */
export function pickQuality(
  time: number | null,
  snr: number | null,
  offTrend: number | null,
  sampleInterval: number,
): PickQuality {
  if (time === null) return "none";
  if (snr !== null && snr < WEAK_SNR) return "weak";
  if (offTrend !== null && Math.abs(offTrend) > neighbourTolerance(sampleInterval)) return "weak";
  return "clear";
}

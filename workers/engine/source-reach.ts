/**
 * How far a seismic source is usable: a source type and the site's noise level give the
 * largest offset (m) at which a single shot's first break can still be picked, and how many
 * stacked shots a longer branch needs. The reach figures are common practice for shallow
 * refraction (from memory, single shot, 24-bit recorder, 10–14 Hz geophones); real reach
 * depends on the ground and is best found with a test shot on site.
 *
 * Stacking N shots raises the signal-to-noise ratio by √N for random noise (Yilmaz 2001,
 * Seismic Data Analysis, §1.2); with amplitude falling as 1/offset (geometrical spreading of
 * a head wave is steeper, so this is optimistic), N stacks reach √N times as far.
 */

/** Source types a crew uses for shallow refraction. */
export type SourceType = "sledgehammer" | "weight-drop" | "seismic-gun" | "buried-charge";

/** Site noise (traffic, wind, machinery). */
export type SiteNoise = "quiet" | "moderate" | "noisy";

export const SOURCE_TYPES: readonly SourceType[] = [
  "sledgehammer",
  "weight-drop",
  "seismic-gun",
  "buried-charge",
];
export const SITE_NOISE_LEVELS: readonly SiteNoise[] = ["quiet", "moderate", "noisy"];

/** Largest usable offset of one shot, m, by source and noise (common practice, from memory). */
export const SOURCE_REACH: Readonly<Record<SourceType, Readonly<Record<SiteNoise, number>>>> = {
  sledgehammer: { quiet: 100, moderate: 60, noisy: 30 },
  "weight-drop": { quiet: 250, moderate: 150, noisy: 80 },
  "seismic-gun": { quiet: 150, moderate: 100, noisy: 50 },
  "buried-charge": { quiet: 500, moderate: 350, noisy: 200 },
};

/** Most stacked shots a crew would make at one point (common practice). */
export const MAX_STACK = 32;

/** The usable offset range of one source, m: from 0 to `reach` for a single shot. */
export function sourceReach(source: SourceType, noise: SiteNoise): number {
  return SOURCE_REACH[source][noise];
}

/**
 * Stacked shots needed to reach `offset` m with a source whose single-shot reach is `reach`
 * m: 1 when the offset is within reach, else ⌈(offset / reach)²⌉ (√N gain). Null when more
 * than MAX_STACK would be needed (use a stronger source). Throws RangeError for reach ≤ 0.
 */
export function stacksToReach(offset: number, reach: number): number | null {
  if (!(reach > 0)) throw new RangeError("reach must be > 0 m");
  if (!(offset > reach)) return 1;
  const n = Math.ceil((offset / reach) ** 2 - 1e-9);
  return n > MAX_STACK ? null : n;
}

/** One shot branch that must reach past its source's single-shot reach. */
export interface ReachFlag {
  /** 0-based shot index. */
  shot: number;
  /** Largest offset the shot must record, m. */
  offset: number;
  /** Single-shot reach of its source at this noise, m. */
  reach: number;
  /** Stacked shots that would reach it, or null when no practical stack does. */
  stacks: number | null;
}

/**
 * Flags for the shots whose farthest geophone lies beyond their source's reach. `farthest` is
 * each shot's largest geophone offset (m); `sources` each shot's source type.
 */
export function reachFlags(
  farthest: ArrayLike<number>,
  sources: ArrayLike<SourceType>,
  noise: SiteNoise,
): ReachFlag[] {
  const flags: ReachFlag[] = [];
  for (let s = 0; s < farthest.length; s++) {
    const reach = sourceReach(sources[s], noise);
    if (farthest[s] > reach) {
      flags.push({
        shot: s,
        offset: farthest[s],
        reach,
        stacks: stacksToReach(farthest[s], reach),
      });
    }
  }
  return flags;
}

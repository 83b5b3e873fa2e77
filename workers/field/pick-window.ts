/**
 * What every first-break picker shares: the result type, the timing of a trace and the
 * translation of a search window in seconds to sample indices.
 */

/** A first-break pick, or the reason there is none. */
export type PickResult =
  | {
      /** First-break time, s, on the record's clock (sample time + DELAY). */
      time: number;
      /** Index of the picked sample in the trace. */
      sample: number;
    }
  | { time: null; reason: string };

/** Timing of a trace and where to look for the first break. */
export interface PickTiming {
  /** Sample interval, s (> 0). */
  sampleInterval: number;
  /** Time of the first sample relative to the shot (SEG-2 DELAY), s; default 0. */
  delay?: number;
  /** Time window to search, s, on the record's clock; default the whole trace. */
  search?: readonly [start: number, end: number];
}

/** Sample index range `[from, to)` of a search window. */
export interface SampleRange {
  from: number;
  to: number;
}

/** Throws a RangeError unless `value` is a finite number above `min` (or at least, if inclusive). */
export function requirePositive(name: string, value: number, min = 0): void {
  if (typeof value !== "number" || !Number.isFinite(value) || value <= min) {
    throw new RangeError(`${name} must be a finite number greater than ${min}`);
  }
}

/**
 * Validates the timing and turns the search window into sample indices. Returns a reason
 * string when the window holds no samples of the trace.
 */
export function searchRange(length: number, timing: PickTiming): SampleRange | string {
  requirePositive("sampleInterval", timing.sampleInterval);
  const delay = timing.delay ?? 0;
  if (!Number.isFinite(delay)) throw new RangeError("delay must be a finite number");
  if (length === 0) return "the trace has no samples";
  let from = 0;
  let to = length;
  if (timing.search) {
    const [start, end] = timing.search;
    if (!Number.isFinite(start) || !Number.isFinite(end) || end <= start) {
      throw new RangeError("search window must be two finite times, start before end");
    }
    from = Math.max(0, Math.ceil((start - delay) / timing.sampleInterval - 1e-9));
    to = Math.min(length, Math.floor((end - delay) / timing.sampleInterval + 1e-9) + 1);
    if (to <= from) return "the search window lies outside the trace";
  }
  return { from, to };
}

/** Reason string when the trace holds a NaN or infinite sample; null when all are finite. */
export function nonFiniteReason(samples: Float32Array): string | null {
  for (let i = 0; i < samples.length; i++) {
    if (!Number.isFinite(samples[i])) return `sample ${i + 1} is not a finite number`;
  }
  return null;
}

/** Record time of a sample index, s. */
export function sampleTime(index: number, timing: PickTiming): number {
  return (timing.delay ?? 0) + index * timing.sampleInterval;
}

/**
 * Where the shots go when a spread grows or shrinks (the design sweep's "follow" shot layout,
 * and the designer's "Apply" of a recommendation). One concept, kept apart from the sweep so
 * that the designer can use it without loading the sweep.
 */
import type { Layout } from "./branches";

/**
 * Shot positions (m) for a new spread of `channels` geophones at `spacing` m from the same
 * first geophone: shots before the spread keep their distance from the first geophone, shots
 * after it keep their distance from the last, and interior shots keep their fraction of the
 * spread. `base` is the current layout (positions in m).
 */
export function followShots(base: Layout, spacing: number, channels: number): Float64Array {
  const x0 = base.firstGeophone;
  const end = x0 + (base.channels - 1) * base.spacing;
  const newEnd = x0 + (channels - 1) * spacing;
  const out = new Float64Array(base.shots.length);
  for (let s = 0; s < base.shots.length; s++) {
    const x = base.shots[s];
    if (x <= x0) out[s] = x;
    else if (x >= end) out[s] = newEnd + (x - end);
    else out[s] = x0 + ((x - x0) / (end - x0)) * (newEnd - x0);
  }
  return out;
}

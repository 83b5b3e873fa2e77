/**
 * First-arrival segments: the lower envelope of the arrival lines of one branch.
 *
 * The first arrival at offset x is the earliest of the direct wave and every head wave
 * valid at x (design.md). A refractor's *segment* is where its head wave is that first
 * arrival; segments are bounded by crossover distances (or start at a critical distance).
 * Pieces are half-open offset intervals [from, to); the last one is unbounded (to = ∞).
 */
import type { LineSet } from "./lines";
import type { Layout, Branch } from "./branches";
import { countBetween } from "./branches";

/** Pieces of the first-arrival curve of one branch (reusable buffers). */
export interface Pieces {
  /** Number of pieces in use. */
  count: number;
  /** Arrival index of each piece (0 = direct wave, m = head wave along the top of layer m). */
  readonly arrival: Int16Array;
  /** Start offset of each piece, m. */
  readonly from: Float64Array;
  /** End offset of each piece, m (Infinity for the last). */
  readonly to: Float64Array;
}

/** Allocate piece buffers large enough for a model of `layerCount` layers. */
export function createPieces(layerCount: number): Pieces {
  const cap = 4 * layerCount + 8;
  return {
    count: 0,
    arrival: new Int16Array(cap),
    from: new Float64Array(cap),
    to: new Float64Array(cap),
  };
}

function push(out: Pieces, arrival: number, from: number, to: number): void {
  const last = out.count - 1;
  if (last >= 0 && out.arrival[last] === arrival) {
    out.to[last] = to;
    return;
  }
  if (last >= 0 && !(to > from)) return;
  out.arrival[out.count] = arrival;
  out.from[out.count] = from;
  out.to[out.count] = to;
  out.count++;
}

/**
 * Compute the lower envelope of the valid arrival lines for offsets ≥ 0. At an exact tie
 * the arrival with the smaller slowness (the one that is earlier beyond the tie) wins, so a
 * geophone standing exactly on a crossover distance belongs to the deeper refractor.
 */
export function firstArrivalPieces(lines: LineSet, layerCount: number, out: Pieces): Pieces {
  const { exists, intercept, slowness, start } = lines;
  out.count = 0;
  let cur = 0;
  let x = 0;
  const maxSteps = out.arrival.length - 1;
  for (let step = 0; step < maxSteps; step++) {
    const pc = slowness[cur];
    const tc = intercept[cur];
    let next = Infinity;
    for (let b = 0; b < layerCount; b++) {
      if (b === cur || exists[b] !== 1) continue;
      const pb = slowness[b];
      const tb = intercept[b];
      const cb = start[b];
      let e: number;
      if (pb < pc) {
        const cross = (tb - tc) / (pc - pb);
        e = cross > cb ? cross : cb;
      } else {
        // a slower-or-equal line can only take over where it starts below the current one
        if (!(cb > x) || !(tb + pb * cb < tc + pc * cb)) continue;
        e = cb;
      }
      if (e > x && e < next) next = e;
    }
    push(out, cur, x, next);
    if (next === Infinity) return out;
    let best = cur;
    let bestT = tc + pc * next;
    for (let b = 0; b < layerCount; b++) {
      if (exists[b] !== 1 || !(start[b] <= next) || b === cur) continue;
      const t = intercept[b] + slowness[b] * next;
      const tol = 1e-13 + 1e-12 * Math.abs(t);
      if (t < bestT - tol || (Math.abs(t - bestT) <= tol && slowness[b] < slowness[best])) {
        best = b;
        bestT = t;
      }
    }
    cur = best;
    x = next;
  }
  push(out, cur, x, Infinity);
  return out;
}

/** The offset hull {from, to} of an arrival's segment (to = Infinity when unbounded), or null. */
export function segmentHull(pieces: Pieces, arrival: number): { from: number; to: number } | null {
  let from = NaN;
  let to = NaN;
  for (let i = 0; i < pieces.count; i++) {
    if (pieces.arrival[i] !== arrival) continue;
    if (Number.isNaN(from)) from = pieces.from[i];
    to = pieces.to[i];
  }
  return Number.isNaN(from) ? null : { from, to };
}

/** Length of the longest bounded piece of an arrival's segment, m (NaN when none). */
export function longestBoundedPiece(pieces: Pieces, arrival: number): number {
  let best = NaN;
  for (let i = 0; i < pieces.count; i++) {
    if (pieces.arrival[i] !== arrival || pieces.to[i] === Infinity) continue;
    const len = pieces.to[i] - pieces.from[i];
    if (!(len <= best)) best = len;
  }
  return best;
}

/** Index of the piece containing `offset` (from ≤ offset < to), or −1. */
export function pieceAt(pieces: Pieces, offset: number): number {
  for (let i = 0; i < pieces.count; i++) {
    if (offset >= pieces.from[i] && offset < pieces.to[i]) return i;
  }
  return -1;
}

/**
 * Count the branch's geophones on each arrival's segment into `counts` (length = layer
 * count; zeroed first).
 */
export function countOnSegments(
  pieces: Pieces,
  layout: Layout,
  branch: Branch,
  counts: Int32Array,
): Int32Array {
  counts.fill(0);
  for (let i = 0; i < pieces.count; i++) {
    counts[pieces.arrival[i]] += countBetween(layout, branch, pieces.from[i], pieces.to[i]);
  }
  return counts;
}

/**
 * Places callout labels (text boxes joined to a mark by a leader line) so that no label
 * overlaps another label or an obstacle (text already on the chart), and no leader runs
 * through a label or an obstacle where another place avoids it. Pure; px, y down. Obstacles
 * may weigh less than text (a band a label may cover sooner than another label).
 *
 * Each callout tries places above its mark (a row at a time, then shifted sideways), then
 * below it; every place is scored (overlaps, then leader crossings, covering a mark still to
 * be labelled, then leader length and shift) and the cheapest one is kept, one callout after
 * the other (so crowded labels step away from each other like a staircase).
 */

export interface Box {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}

/** Something already on the chart; `weight` scales what covering it costs (default 1: text). */
export interface Obstacle extends Box {
  weight?: number;
}

export interface CalloutRequest {
  /** The mark the leader points at: its x, and its top and bottom on screen. */
  x: number;
  top: number;
  bottom: number;
  /** Size of the label box, px. */
  width: number;
  height: number;
}

export interface PlacedCallout {
  box: Box;
  /** Leader from the label's edge (x1, y1) to the mark (x2, y2). */
  leader: { x1: number; y1: number; x2: number; y2: number };
  side: "above" | "below";
}

/** Whether two boxes overlap, with `pad` px of clearance. */
export function boxesOverlap(a: Box, b: Box, pad = 0): boolean {
  return a.x0 < b.x1 + pad && b.x0 < a.x1 + pad && a.y0 < b.y1 + pad && b.y0 < a.y1 + pad;
}

/** Whether the segment (x1, y1)–(x2, y2) passes through the box (Liang–Barsky clipping). */
export function segmentCrossesBox(
  s: { x1: number; y1: number; x2: number; y2: number },
  b: Box,
): boolean {
  const dx = s.x2 - s.x1;
  const dy = s.y2 - s.y1;
  let t0 = 0;
  let t1 = 1;
  const edges: [number, number][] = [
    [-dx, s.x1 - b.x0],
    [dx, b.x1 - s.x1],
    [-dy, s.y1 - b.y0],
    [dy, b.y1 - s.y1],
  ];
  for (const [p, q] of edges) {
    if (p === 0) {
      if (q < 0) return false;
      continue;
    }
    const r = q / p;
    if (p < 0) t0 = Math.max(t0, r);
    else t1 = Math.min(t1, r);
    if (t0 > t1) return false;
  }
  return t1 - t0 > 1e-9;
}

/** Whether two segments cross (strictly; touching ends do not count). */
function segmentsCross(
  a: { x1: number; y1: number; x2: number; y2: number },
  b: { x1: number; y1: number; x2: number; y2: number },
): boolean {
  const side = (px: number, py: number, s: typeof a) =>
    Math.sign((s.x2 - s.x1) * (py - s.y1) - (s.y2 - s.y1) * (px - s.x1));
  return (
    side(a.x1, a.y1, b) * side(a.x2, a.y2, b) < 0 && side(b.x1, b.y1, a) * side(b.x2, b.y2, a) < 0
  );
}

/** A box shrunk by `by` px on every side (a leader may touch a label's edge). */
const shrink = (b: Box, by: number): Box => ({
  x0: b.x0 + by,
  x1: b.x1 - by,
  y0: b.y0 + by,
  y1: b.y1 - by,
});

const SHIFTS = [0, -0.5, 0.5, -1, 1, -1.5, 1.5]; // sideways, in label widths
const ROWS = 8;
const CLEARANCE = 1.5; // px kept clear around a label

/**
 * Places every callout in order, each avoiding the labels and leaders placed before it and
 * the `obstacles`, inside `bounds` (labels never leave it; a callout that finds no free
 * place takes the least bad one).
 */
export function placeCallouts(
  requests: readonly CalloutRequest[],
  obstacles: readonly Obstacle[],
  bounds: { left: number; right: number; top: number; bottom: number },
  options: { gap?: number; rowGap?: number } = {},
): PlacedCallout[] {
  const gap = options.gap ?? 4; // between the mark and the nearest row
  const rowGap = options.rowGap ?? 3; // more than the clearance below, so rows never clash
  const placed: PlacedCallout[] = [];
  requests.forEach((r, index) => {
    // marks still to be labelled: a label over one would leave its leader no clear way out
    const pending = requests.slice(index + 1).map((q) => q.x);
    let best: { cost: number; callout: PlacedCallout } | null = null;
    for (const side of ["above", "below"] as const)
      for (let row = 0; row < ROWS; row++)
        for (const shift of SHIFTS) {
          let x0 = r.x - r.width / 2 + shift * r.width;
          x0 = Math.min(Math.max(x0, bounds.left), bounds.right - r.width);
          const y0 =
            side === "above"
              ? r.top - gap - r.height - row * (r.height + rowGap)
              : r.bottom + gap + row * (r.height + rowGap);
          const box = { x0, x1: x0 + r.width, y0, y1: y0 + r.height };
          const lx = Math.min(Math.max(r.x, box.x0 + 2), box.x1 - 2);
          const leader =
            side === "above"
              ? { x1: lx, y1: box.y1, x2: r.x, y2: r.top }
              : { x1: lx, y1: box.y0, x2: r.x, y2: r.bottom };
          let cost = 0;
          if (box.y0 < bounds.top || box.y1 > bounds.bottom) cost += 10_000;
          for (const o of obstacles) {
            const weight = o.weight ?? 1;
            if (boxesOverlap(box, o, CLEARANCE)) cost += 1000 * weight;
            else if (segmentCrossesBox(leader, shrink(o, 1))) cost += 600 * weight;
          }
          for (const p of placed) {
            if (boxesOverlap(box, p.box, CLEARANCE)) cost += 1000;
            if (segmentCrossesBox(leader, shrink(p.box, 1))) cost += 600;
            if (segmentCrossesBox(p.leader, shrink(box, 1))) cost += 600;
            if (segmentsCross(leader, p.leader)) cost += 50;
          }
          for (const x of pending) if (x >= box.x0 && x <= box.x1) cost += 40;
          cost += Math.hypot(leader.x2 - leader.x1, leader.y2 - leader.y1);
          cost += Math.abs(shift) * 10 + (side === "below" ? 15 : 0);
          if (!best || cost < best.cost) best = { cost, callout: { box, leader, side } };
        }
    placed.push(best!.callout);
  });
  return placed;
}

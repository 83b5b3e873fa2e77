/**
 * Reversed first-break picks for the interpretation tests, from formulas written here:
 * - flat layers: the closed forms of Telford, Geldart & Sheriff (1990) §4.3 (flat-layers.ts);
 * - a planar dipping refractor: t = x sin(θ_c ± φ)/v_1 + 2 h cos θ_c / v_1 with h the depth
 *   normal to the refractor under the shot (Telford et al. 1990 §4.3.3);
 * - an undulating refractor: an independent brute-force Fermat computation — the head wave
 *   goes down to the interface at a, along it at v_2 to b, and up to the geophone; the time is
 *   the least over a and b on a 0.05 m grid (a running minimum makes it O(N) per shot).
 * Each pick carries the layer it travelled along (1 = direct wave).
 */
import { firstArrival, interceptTime, type TestLayer } from "./flat-layers";
import type { ObservedPick } from "../field-picks";
import type { LayerAssignment } from "../refractor-assignment";

export interface LabelledPick extends ObservedPick {
  layer: number;
}

export const GEOPHONES = Array.from({ length: 48 }, (_, k) => 2 * k); // 0 … 94 m

/** Assignments that reproduce the true labels, one segment per run of equal layers. */
export function trueAssignments(picks: readonly LabelledPick[]): LayerAssignment[] {
  const out: LayerAssignment[] = [];
  const shots = [...new Set(picks.map((p) => p.sourcePosition))];
  for (const shot of shots) {
    for (const side of [-1, 1]) {
      const mine = picks
        .filter((p) => p.sourcePosition === shot && Math.sign(p.receiverPosition - shot) === side)
        .sort((a, b) => Math.abs(a.receiverPosition - shot) - Math.abs(b.receiverPosition - shot));
      let cur: LayerAssignment | null = null;
      for (const p of mine) {
        if (cur && cur.layer === p.layer) {
          cur.from = Math.min(cur.from, p.receiverPosition);
          cur.to = Math.max(cur.to, p.receiverPosition);
        } else {
          cur = { shot, layer: p.layer, from: p.receiverPosition, to: p.receiverPosition };
          out.push(cur);
        }
      }
    }
  }
  return out;
}

/** Flat layers: picks with the layer whose arrival is first. */
export function flatPicks(layers: TestLayer[], shots: number[]): LabelledPick[] {
  const t = firstArrival(layers);
  const out: LabelledPick[] = [];
  for (const s of shots) {
    for (const r of GEOPHONES) {
      if (r === s) continue;
      const x = Math.abs(r - s);
      let layer = 1;
      let best = x / layers[0].velocity;
      for (let n = 1; n < layers.length; n++) {
        const tn = x / layers[n].velocity + interceptTime(layers, n);
        if (tn < best - 1e-12) {
          best = tn;
          layer = n + 1;
        }
      }
      expectClose(best, t(s, r));
      out.push({ sourcePosition: s, receiverPosition: r, time: best, layer });
    }
  }
  return out;
}

function expectClose(a: number, b: number) {
  if (Math.abs(a - b) > 1e-9)
    throw new Error(`fixture disagrees with flat-layers.ts: ${a} vs ${b}`);
}

/**
 * A planar refractor under one layer, dipping φ degrees (positive: deeper towards +x), with
 * vertical depth `depthAt0` at x = 0.
 */
export function dippingPicks(
  v1: number,
  v2: number,
  depthAt0: number,
  dipDegrees: number,
  shots: number[],
): {
  picks: LabelledPick[];
  verticalDepth: (x: number) => number;
  normalDepth: (x: number) => number;
} {
  const phi = (dipDegrees * Math.PI) / 180;
  const theta = Math.asin(v1 / v2);
  const verticalDepth = (x: number) => depthAt0 + x * Math.tan(phi);
  const normalDepth = (x: number) => verticalDepth(x) * Math.cos(phi);
  const picks: LabelledPick[] = [];
  for (const s of shots) {
    for (const r of GEOPHONES) {
      if (r === s) continue;
      const x = Math.abs(r - s);
      const down = r > s; // travelling towards +x = down-dip when φ > 0
      const head =
        (x * Math.sin(theta + (down ? phi : -phi))) / v1 +
        (2 * normalDepth(s) * Math.cos(theta)) / v1;
      const direct = x / v1;
      picks.push({
        sourcePosition: s,
        receiverPosition: r,
        time: Math.min(direct, head),
        layer: head < direct ? 2 : 1,
      });
    }
  }
  return { picks, verticalDepth, normalDepth };
}

/** Brute-force head waves under an interface z(x) (depth, m) between v1 above and v2 below. */
export function undulatingPicks(
  v1: number,
  v2: number,
  depth: (x: number) => number,
  shots: number[],
): LabelledPick[] {
  const dx = 0.05;
  const from = Math.min(...shots, 0) - 40;
  const to = Math.max(...shots, 94) + 40;
  const n = Math.round((to - from) / dx) + 1;
  const xs = Float64Array.from({ length: n }, (_, i) => from + i * dx);
  const zs = xs.map((x) => depth(x));
  const arc = new Float64Array(n); // arc length along the interface from `from`
  for (let i = 1; i < n; i++)
    arc[i] = arc[i - 1] + Math.hypot(xs[i] - xs[i - 1], zs[i] - zs[i - 1]);
  const leg = (x: number, i: number) => Math.hypot(xs[i] - x, zs[i]) / v1;
  const picks: LabelledPick[] = [];
  for (const s of shots) {
    // tau[i]: least time from the shot to interface point i travelling towards +x along it
    const fwd = new Float64Array(n);
    const back = new Float64Array(n);
    let best = Infinity;
    for (let i = 0; i < n; i++) {
      best = Math.min(best, leg(s, i) - arc[i] / v2);
      fwd[i] = best + arc[i] / v2;
    }
    best = Infinity;
    for (let i = n - 1; i >= 0; i--) {
      best = Math.min(best, leg(s, i) + arc[i] / v2);
      back[i] = best - arc[i] / v2;
    }
    for (const r of GEOPHONES) {
      if (r === s) continue;
      const tau = r > s ? fwd : back;
      let head = Infinity;
      for (let i = 0; i < n; i++) {
        if (r > s ? xs[i] > r : xs[i] < r) continue;
        if (r > s ? xs[i] < s : xs[i] > s) continue;
        head = Math.min(head, tau[i] + leg(r, i));
      }
      const direct = Math.abs(r - s) / v1;
      picks.push({
        sourcePosition: s,
        receiverPosition: r,
        time: Math.min(direct, head),
        layer: head < direct ? 2 : 1,
      });
    }
  }
  return picks;
}

import { describe, expect, it } from "vitest";
import type { SectionModel, Spread } from "./plan-schema";
import { solveSection } from "./section-arrivals";

/**
 * An independent brute-force Fermat search over the polyline geometry (written here, using
 * none of the engine's geometry code): the first arrival is the least time over paths
 * made of straight pieces, each inside one layer (Fermat's principle; in a medium of
 * constant-velocity regions a least-time path is straight inside each region and bends only
 * on boundaries). Nodes are the source, the receiver and points every `step` m along every
 * interface polyline (including vertical faces); an edge joins two nodes when the straight
 * piece between them lies in one layer (sampled), at that layer's slowness (a piece lying
 * on an interface takes the faster side: a head wave). Dijkstra gives the least time.
 */
type Pt = [number, number];

function lineAt(line: Pt[], x: number): number {
  if (x <= line[0][0]) return line[0][1];
  for (let i = 1; i < line.length; i++) {
    const [x0, z0] = line[i - 1];
    const [x1, z1] = line[i];
    if (x <= x1) return x1 === x0 ? Math.min(z0, z1) : z0 + ((z1 - z0) * (x - x0)) / (x1 - x0);
  }
  return line[line.length - 1][1];
}

/** Elevation span of each layer at x: [bottom, top] (bottom −∞ for the half-space). */
function spans(model: SectionModel, x: number): [number, number][] {
  const out: [number, number][] = [];
  let top = lineAt(model.surface, x);
  model.layers.forEach((l) => {
    const bottom = l.base ? Math.min(top, lineAt(l.base, x)) : -Infinity;
    out.push([bottom, top]);
    top = bottom;
  });
  return out;
}

/** Layers a point may belong to (on a boundary: both sides), within eps. */
function layersAt(model: SectionModel, x: number, z: number, eps = 1e-7): number[] {
  const found: number[] = [];
  spans(model, x).forEach(([b, t], k) => {
    if (z <= t + eps && z >= b - eps && t - b > -eps) found.push(k);
  });
  return found;
}

/** Points on a vertical step of a polyline at x (between the two elevations). */
function interfaceNodes(model: SectionModel, step: number): Pt[] {
  const nodes: Pt[] = [];
  for (const l of model.layers) {
    if (!l.base) continue;
    const b = l.base;
    for (let i = 1; i < b.length; i++) {
      const [x0, z0] = b[i - 1];
      const [x1, z1] = b[i];
      const len = Math.hypot(x1 - x0, z1 - z0);
      const n = Math.max(1, Math.ceil(len / step));
      for (let k = 0; k <= n; k++) nodes.push([x0 + ((x1 - x0) * k) / n, z0 + ((z1 - z0) * k) / n]);
    }
  }
  return nodes;
}

const orient = (p: Pt, q: Pt, r: Pt) =>
  (q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0]);

/** Whether segments ab and cd cross at a point inside both (touching does not count). */
function crosses(a: Pt, b: Pt, c: Pt, d: Pt): boolean {
  const eps = 1e-9;
  const o1 = orient(a, b, c);
  const o2 = orient(a, b, d);
  const o3 = orient(c, d, a);
  const o4 = orient(c, d, b);
  return (
    ((o1 > eps && o2 < -eps) || (o1 < -eps && o2 > eps)) &&
    ((o3 > eps && o4 < -eps) || (o3 < -eps && o4 > eps))
  );
}

function edgeSlowness(model: SectionModel, a: Pt, b: Pt): number {
  for (const line of [model.surface, ...model.layers.flatMap((l) => (l.base ? [l.base] : []))]) {
    for (let i = 1; i < line.length; i++) if (crosses(a, b, line[i - 1], line[i])) return Infinity;
  }
  // no boundary crossed: the piece lies in the layer(s) common to points along it (both
  // sides of a boundary it runs along: a head wave takes the faster); a piece running
  // through a vertex from one layer into another has no common layer
  let here = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11];
  for (let k = 1; k < 8; k++) {
    const f = k / 8;
    const at = layersAt(model, a[0] + f * (b[0] - a[0]), a[1] + f * (b[1] - a[1]));
    here = here.filter((l) => at.includes(l));
  }
  if (here.length === 0) return Infinity;
  return Math.min(...here.map((l) => 1 / model.layers[l].velocity));
}

function fermatTimes(model: SectionModel, source: Pt, receivers: Pt[], step: number): number[] {
  const nodes: Pt[] = [source, ...receivers, ...interfaceNodes(model, step)];
  const n = nodes.length;
  const fastest = Math.min(...model.layers.map((l) => 1 / l.velocity));
  const dist = new Float64Array(n).fill(Infinity);
  const done = new Uint8Array(n);
  dist[0] = 0;
  for (;;) {
    let u = -1;
    for (let i = 0; i < n; i++) if (!done[i] && (u < 0 || dist[i] < dist[u])) u = i;
    if (u < 0 || dist[u] === Infinity) break;
    done[u] = 1;
    for (let v = 0; v < n; v++) {
      if (done[v]) continue;
      const len = Math.hypot(nodes[v][0] - nodes[u][0], nodes[v][1] - nodes[u][1]);
      if (dist[u] + len * fastest >= dist[v]) continue; // cannot improve even at the fastest
      const s = edgeSlowness(model, nodes[u], nodes[v]);
      if (dist[u] + len * s < dist[v]) dist[v] = dist[u] + len * s;
    }
  }
  return receivers.map((_, k) => dist[1 + k]);
}

function compare(model: SectionModel, spread: Spread) {
  const solved = solveSection(model, spread);
  let worst = 0;
  solved.shots.forEach((shot) => {
    const receivers: Pt[] = Array.from(solved.geophoneX, (x, k) => [x, solved.geophoneZ[k]]);
    const brute = fermatTimes(model, [shot.x, shot.z], receivers, 0.5);
    brute.forEach((t, k) => {
      const tol = Math.max(0.005 * t, 0.0002);
      worst = Math.max(worst, Math.abs(shot.geophoneTimes[k] - t) / tol);
    });
  });
  return worst;
}

const spread: Spread = {
  spacing: 4,
  channels: 24,
  firstGeophone: 6,
  shots: [{ position: 4 }, { position: 100 }],
};

describe("the 2-D solver against a brute-force Fermat search", () => {
  it("matches across a vertical step of the refractor (a fault scarp)", () => {
    const fault: SectionModel = {
      kind: "section",
      name: "fault",
      surface: [
        [0, 100],
        [104, 100],
      ],
      layers: [
        {
          velocity: 600,
          base: [
            [0, 95],
            [50, 95],
            [50, 90],
            [104, 90],
          ],
        },
        { velocity: 2400 },
      ],
    };
    expect(compare(fault, spread)).toBeLessThanOrEqual(1);
  });

  it("matches over a layer that pinches out halfway", () => {
    const pinch: SectionModel = {
      kind: "section",
      name: "pinch-out",
      surface: [
        [0, 100],
        [104, 99],
      ],
      layers: [
        {
          velocity: 500,
          base: [
            [0, 97],
            [60, 96.5],
            [104, 96],
          ],
        },
        {
          velocity: 1300,
          base: [
            [0, 92],
            [60, 96.5],
            [104, 96],
          ],
        },
        { velocity: 2800 },
      ],
    };
    expect(compare(pinch, spread)).toBeLessThanOrEqual(1);
  });
});

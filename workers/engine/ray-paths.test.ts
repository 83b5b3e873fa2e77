import { describe, expect, it } from "vitest";
import { earthFromModel, interfaceDepth } from "./geometry";
import { firstArrivalRayPath } from "./ray-paths";

const dipping = {
  layers: [
    { velocity: 500, thickness: 4, dip: 2 },
    { velocity: 1700, thickness: 7, dip: -1 },
    { velocity: 4300 },
  ],
};

/** Travel time along a polyline: each leg in the layer whose interfaces bound it. */
function polylineTime(
  points: [number, number][],
  velocities: number[],
  refractorLayer: number,
): number {
  const legs = points.length - 1;
  const half = (legs - 1) / 2; // legs down, one along the refractor, legs up
  let t = 0;
  for (let i = 0; i < legs; i++) {
    const [x0, z0] = points[i];
    const [x1, z1] = points[i + 1];
    const len = Math.hypot(x1 - x0, z1 - z0);
    const layer = i < half ? i : i === half ? refractorLayer : legs - 1 - i;
    t += len / velocities[layer];
  }
  return t;
}

describe("firstArrivalRayPath", () => {
  it("runs along the surface for the direct wave", () => {
    const p = firstArrivalRayPath(dipping, 0, 3);
    expect(p.kind).toBe("direct");
    expect(p.points).toEqual([
      [0, 0],
      [3, 0],
    ]);
    expect(p.time).toBeCloseTo(3 / 500, 14);
  });

  it.each([
    [0, 90],
    [90, 0],
  ])("goes down, along the deepest refractor and up from %d m to %d m", (shot, geophone) => {
    const earth = earthFromModel(dipping);
    const p = firstArrivalRayPath(dipping, shot, geophone);
    expect(p.kind).toBe("head");
    if (p.kind !== "head") return;
    expect(p.layer).toBe(3);
    expect(p.points[0]).toEqual([shot, 0]);
    expect(p.points[p.points.length - 1]).toEqual([geophone, 0]);
    // vertices lie on the interfaces: 1, 2, 2, 1
    const ks = [1, 2, 2, 1];
    ks.forEach((k, i) => {
      const [x, z] = p.points[i + 1];
      expect(z).toBeCloseTo(interfaceDepth(earth, k, x), 9);
    });
    // the time along the drawn path is the reported head-wave time
    expect(polylineTime(p.points, [500, 1700, 4300], 2)).toBeCloseTo(p.time, 12);
    // Snell's law at the first interface: sin(i1)/v1 = sin(i2)/v2 measured from its normal
    const s = Math.tan((2 * Math.PI) / 180);
    const n = [-s / Math.hypot(1, s), 1 / Math.hypot(1, s)];
    const leg = (a: number[], b: number[]) => {
      const l = Math.hypot(b[0] - a[0], b[1] - a[1]);
      return [(b[0] - a[0]) / l, (b[1] - a[1]) / l];
    };
    const d0 = leg(p.points[0], p.points[1]);
    const d1 = leg(p.points[1], p.points[2]);
    const sin = (d: number[]) => Math.abs(d[0] * n[1] - d[1] * n[0]);
    expect(sin(d0) / 500).toBeCloseTo(sin(d1) / 1700, 12);
  });

  it("throws a RangeError for non-finite positions", () => {
    expect(() => firstArrivalRayPath(dipping, NaN, 3)).toThrow(RangeError);
  });
});

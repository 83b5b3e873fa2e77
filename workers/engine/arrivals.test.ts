import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { computeArrivals, sampleCurves } from "./arrivals";

const model = {
  layers: [
    { velocity: 450, thickness: 3 },
    { velocity: 1600, thickness: 8 },
    { velocity: 1100, thickness: 4 },
    { velocity: 4000 },
  ],
};
const spread = {
  spacing: 2,
  channels: 48,
  firstGeophone: 0,
  shots: [{ position: -1 }, { position: 47 }],
};

const layerArb = fc.record({
  velocity: fc.double({ min: 200, max: 6000, noNaN: true }),
  thickness: fc.double({ min: 0.5, max: 25, noNaN: true }),
  dip: fc.constantFrom(0, 0, 0, -3, -1.5, 1, 2.5),
});

function modelFrom(layers: { velocity: number; thickness: number; dip: number }[]) {
  return {
    layers: layers.map((l, i) => (i === layers.length - 1 ? { velocity: l.velocity } : l)),
  };
}

describe("computeArrivals", () => {
  // Direct wave t = x / v1; no head wave along a layer not faster than every layer above
  // (Telford, Geldart & Sheriff 1990, §4.3).
  it("gives the direct wave t = x / v1 and no head wave along the slower layer 3", () => {
    const shot = computeArrivals(model, spread, 0);
    expect(shot.geophones).toHaveLength(48);
    const g = shot.geophones[10];
    expect(g.offset).toBe(21);
    expect(g.side).toBe("forward");
    expect(g.direct).toBeCloseTo(21 / 450, 14);
    expect(g.head.find((h) => h.layer === 3)?.time).toBeNull();
    expect(shot.geophones.every((x) => x.head[1].time === null)).toBe(true);
  });

  it("marks the first arrival as the earliest valid arrival, with its kind (property)", () => {
    fc.assert(
      fc.property(
        fc.array(layerArb, { minLength: 1, maxLength: 6 }),
        fc.double({ min: 0.5, max: 6, noNaN: true }),
        fc.integer({ min: 1, max: 60 }),
        fc.double({ min: -30, max: 200, noNaN: true }),
        (layers, spacing, channels, shotPos) => {
          const m = modelFrom(layers);
          const s = { spacing, channels, firstGeophone: 0, shots: [{ position: shotPos }] };
          let shot;
          try {
            shot = computeArrivals(m, s, 0);
          } catch (e) {
            // random dips may cross interfaces within the spread: that is a clear RangeError
            expect(e).toBeInstanceOf(RangeError);
            return;
          }
          for (const g of shot.geophones) {
            const valid = [
              g.direct,
              ...g.head.map((h) => h.time).filter((t): t is number => t !== null),
            ];
            const min = Math.min(...valid);
            expect(Math.abs(g.first.time - min)).toBeLessThanOrEqual(1e-12 * Math.max(1, min));
            const first = g.first;
            const own =
              first.kind === "direct"
                ? g.direct
                : g.head.find((h) => h.layer === first.layer)?.time;
            expect(own).toBe(g.first.time);
          }
        },
      ),
      { numRuns: 200 },
    );
  });

  it("never has a reflection earlier than the first arrival in flat models (property)", () => {
    fc.assert(
      fc.property(fc.array(layerArb, { minLength: 2, maxLength: 5 }), (layers) => {
        const m = modelFrom(layers.map((l) => ({ ...l, dip: 0 })));
        const shot = computeArrivals(
          m,
          { spacing: 3, channels: 40, firstGeophone: 0, shots: [{ position: -2 }] },
          0,
          { reflections: true },
        );
        for (const g of shot.geophones) {
          expect(g.reflections).toHaveLength(layers.length - 1);
          for (const r of g.reflections) {
            if (r.time !== null) expect(r.time).toBeGreaterThanOrEqual(g.first.time * (1 - 1e-12));
          }
        }
      }),
      { numRuns: 100 },
    );
  });

  // Two flat layers: the reflection from the base of layer 1 arrives at
  // t = √(x² + 4h²) / v1 (Telford, Geldart & Sheriff 1990, §4.2).
  it("solves reflections only when asked, and nothing else changes", () => {
    const two = { layers: [{ velocity: 600, thickness: 4 }, { velocity: 2400 }] };
    const plain = computeArrivals(two, spread, 0);
    const asked = computeArrivals(two, spread, 0, { reflections: true });
    expect(plain.geophones.every((g) => g.reflections.length === 0)).toBe(true);
    for (const [k, g] of asked.geophones.entries()) {
      const t = g.reflections[0].time as number;
      expect(t).toBeCloseTo(Math.hypot(g.offset, 8) / 600, 12);
      expect({ ...g, reflections: [] }).toEqual(plain.geophones[k]);
    }
  });

  it("throws a RangeError for a shot that does not exist", () => {
    expect(() => computeArrivals(model, spread, 5)).toThrow(RangeError);
  });
});

describe("sampleCurves", () => {
  it("samples both branches with signed offsets and flags the first arrival", () => {
    const c = sampleCurves(model, 20, -40, 40, 81);
    expect(c.offsets[0]).toBe(-40);
    expect(c.positions[80]).toBe(60);
    expect(c.direct.times[0]).toBeCloseTo(40 / 450, 14);
    // at offset 0 only the direct wave exists
    expect(c.first.layer[40]).toBe(1);
    for (let s = 0; s < 81; s++) {
      const flagged = [c.direct.first[s], ...c.head.map((h) => h.first[s])];
      expect(flagged.reduce((a, b) => a + b, 0)).toBe(1);
      const layer = c.first.layer[s];
      const times = layer === 1 ? c.direct.times : c.head[layer - 2].times;
      expect(c.first.times[s]).toBe(times[s]);
    }
    // head waves are NaN before the critical distance and the inverted layer never arrives
    expect(Number.isNaN(c.head[0].times[41])).toBe(true);
    expect(c.head[1].times.every(Number.isNaN)).toBe(true);
    expect(c.reflections).toHaveLength(3);
  });

  it("can skip reflections", () => {
    expect(sampleCurves(model, 0, 0, 10, 5, { reflections: false }).reflections).toHaveLength(0);
  });

  it("throws a RangeError for a bad sample count", () => {
    expect(() => sampleCurves(model, 0, 0, 10, 0)).toThrow(RangeError);
    expect(() => sampleCurves(model, 0, 0, NaN, 10)).toThrow(RangeError);
  });
});

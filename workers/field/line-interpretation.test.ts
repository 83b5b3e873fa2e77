// Reversed-profile interpretation checked against sources outside the code under test:
// closed forms for flat layers (Telford, Geldart & Sheriff 1990 §4.3) and a planar dipping
// refractor (§4.3.3), and an undulating refractor from an independent brute-force Fermat
// computation written in the fixture (__fixtures__/reversed-picks.ts). Models are invented.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { interpretLine, interpretationJson, type LineMethod } from "./line-interpretation";
import { elevationProfile } from "./station-elevations";
import { plusMinusTimes } from "./plus-minus";
import { makeBranch } from "./branch-times";
import {
  GEOPHONES,
  dippingPicks,
  flatPicks,
  trueAssignments,
  undulatingPicks,
} from "./__fixtures__/reversed-picks";
import type { TestLayer } from "./__fixtures__/flat-layers";

const METHODS: LineMethod[] = ["plus-minus", "delay-time", "grm"];

describe("interpretLine on flat layers (closed forms, Telford et al. 1990 §4.3)", () => {
  const layers: TestLayer[] = [{ velocity: 500, thickness: 6 }, { velocity: 2200 }];
  const picks = flatPicks(layers, [-1, 95]);
  for (const method of METHODS) {
    it(`${method}: depth 6 m within 1 % under every geophone, velocity 2200 m/s within 1 %`, () => {
      const r = interpretLine({
        picks,
        assignments: trueAssignments(picks),
        method,
        pickError: 0.0005,
      });
      expect(r.refractors).toHaveLength(1);
      const ref = r.refractors[0];
      expect(ref.layer).toBe(2);
      expect(ref.depth.length).toBeGreaterThan(20);
      for (const d of ref.depth) {
        expect(Math.abs(d.depth - 6) / 6).toBeLessThan(0.01);
        expect(d.elevation).toBeCloseTo(-d.depth, 9); // flat ground at 0 m, datum 0 m
        expect(d.sigma).toBeGreaterThan(0);
      }
      for (const v of ref.velocity) expect(Math.abs(v.value - 2200) / 2200).toBeLessThan(0.01);
      expect(r.topVelocity).toBeCloseTo(500, 6);
    });
  }

  it("three flat layers: both refractors within 1 % (layer-by-layer time-depth conversion)", () => {
    const three: TestLayer[] = [
      { velocity: 450, thickness: 3 },
      { velocity: 1500, thickness: 7 },
      { velocity: 4000 },
    ];
    const p = flatPicks(three, [-1, 95]);
    const r = interpretLine({
      picks: p,
      assignments: trueAssignments(p),
      method: "plus-minus",
      pickError: 0.0005,
    });
    expect(r.refractors.map((x) => x.layer)).toEqual([2, 3]);
    for (const d of r.refractors[0].depth) expect(Math.abs(d.depth - 3) / 3).toBeLessThan(0.01);
    for (const d of r.refractors[1].depth) expect(Math.abs(d.depth - 10) / 10).toBeLessThan(0.01);
  });
});

describe("interpretLine on a planar dipping refractor (Telford et al. 1990 §4.3.3)", () => {
  for (const method of METHODS) {
    it(`${method}: vertical depth within 1 % under every geophone (dip 5°)`, () => {
      const { picks, verticalDepth } = dippingPicks(600, 2500, 5, 5, [-1, 95]);
      const r = interpretLine({
        picks,
        assignments: trueAssignments(picks),
        method,
        pickError: 0.0005,
      });
      const ref = r.refractors[0];
      expect(ref.depth.length).toBeGreaterThan(15);
      for (const d of ref.depth) {
        expect(
          Math.abs(d.depth - verticalDepth(d.position)) / verticalDepth(d.position),
        ).toBeLessThan(0.01);
      }
    });
  }
});

describe("interpretLine on an undulating refractor (brute-force Fermat times)", () => {
  const depth = (x: number) => 8 + 1.5 * Math.sin((2 * Math.PI * x) / 48);
  const picks = undulatingPicks(500, 2500, depth, [-1, 95]);
  for (const method of METHODS) {
    it(`${method}: within 5 % of the depth or 0.3 m wherever both shots sample it`, () => {
      const r = interpretLine({
        picks,
        assignments: trueAssignments(picks),
        method,
        pickError: 0.0005,
      });
      const ref = r.refractors[0];
      expect(ref.depth.length).toBeGreaterThan(15);
      // where both shots sample it: the stations with plus and minus times
      const both = new Set(ref.plusMinus.map((p) => p.position));
      for (const d of ref.depth.filter((p) => both.has(p.position))) {
        const truth = depth(d.position);
        expect(Math.abs(d.depth - truth)).toBeLessThanOrEqual(Math.max(0.05 * truth, 0.3));
      }
    });
  }
});

describe("phantoming and elevations", () => {
  it("phantoms the stretch near a shot from a farther shot on the same side", () => {
    const layers: TestLayer[] = [{ velocity: 500, thickness: 6 }, { velocity: 2200 }];
    // the farther shot at −31 m was recorded on the first 21 geophones only (0–40 m)
    const picks = flatPicks(layers, [-1, 95, -31]).filter(
      (p) => p.sourcePosition !== -31 || p.receiverPosition <= 40,
    );
    const without = interpretLine({
      picks: picks.filter((p) => p.sourcePosition === -1 || p.sourcePosition === 95),
      assignments: trueAssignments(picks),
      method: "plus-minus",
      pickError: 0.0005,
    });
    const withPhantoms = interpretLine({
      picks,
      assignments: trueAssignments(picks),
      method: "plus-minus",
      pickError: 0.0005,
    });
    const ref = withPhantoms.refractors[0];
    expect(ref.depth.length).toBeGreaterThan(without.refractors[0].depth.length);
    expect(ref.depth.some((d) => d.phantom)).toBe(true);
    for (const d of ref.depth) expect(Math.abs(d.depth - 6) / 6).toBeLessThan(0.01);
  });

  it("reduces to a datum: sloping ground over a flat refractor gives the right elevations", () => {
    // Ground rising 2 m over the line (0 → 2 m at 94 m), refractor flat at elevation −6 m.
    // Times from the flat-layer forms after moving each end's vertical leg: for a head wave the
    // extra layer-1 thickness e under a shot or geophone adds e·cos θ / v1 (common practice,
    // exact in the limit of gentle slopes).
    const v1 = 500;
    const v2 = 2200;
    const ground = (x: number) => (2 * x) / 94;
    const cos = Math.sqrt(1 - (v1 / v2) ** 2);
    const base = flatPicks([{ velocity: v1, thickness: 6 }, { velocity: v2 }], [-1, 95]);
    const picks = base.map((p) => ({
      ...p,
      time:
        p.layer === 1
          ? p.time
          : p.time + ((ground(p.sourcePosition) + ground(p.receiverPosition)) * cos) / v1,
    }));
    const profile = elevationProfile(
      GEOPHONES.map((x) => ({ position: x, elevation: ground(x) })).concat([
        { position: -1, elevation: ground(-1) },
        { position: 95, elevation: ground(95) },
      ]),
    );
    const r = interpretLine({
      picks,
      assignments: trueAssignments(base),
      method: "plus-minus",
      pickError: 0.0005,
      elevation: profile,
      datum: 0,
    });
    for (const d of r.refractors[0].depth) {
      expect(d.elevation).toBeCloseTo(-6, 1);
      expect(d.depth).toBeCloseTo(6 + ground(d.position), 1);
    }
  });
});

describe("reciprocal times and datum properties (fast-check)", () => {
  it("reciprocal times agree on noise-free data from any flat or dipping model", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 300, max: 900, noNaN: true }),
        fc.double({ min: 1.8, max: 5, noNaN: true }),
        // depth at 0 m and dip keep the refractor at least 1.3 m down over the whole line
        fc.double({ min: 8, max: 15, noNaN: true }),
        fc.double({ min: -4, max: 4, noNaN: true }),
        (v1, ratio, h, dip) => {
          const { picks } = dippingPicks(v1, v1 * ratio, h, dip, [-1, 95]);
          const r = interpretLine({
            picks,
            assignments: trueAssignments(picks),
            method: "plus-minus",
            pickError: 0.0005,
          });
          expect(r.reciprocal).toHaveLength(1);
          expect(Math.abs(r.reciprocal[0].difference)).toBeLessThan(1e-9);
          expect(r.reciprocal[0].agrees).toBe(true);
        },
      ),
      { numRuns: 40 },
    );
  });

  it("plus and minus times do not change when ground and datum move together; refractor elevations move with them", () => {
    const layers: TestLayer[] = [{ velocity: 500, thickness: 6 }, { velocity: 2200 }];
    const picks = flatPicks(layers, [-1, 95]);
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -3, max: 3, noNaN: true }), { minLength: 50, maxLength: 50 }),
        fc.double({ min: -500, max: 500, noNaN: true }),
        (bumps, shift) => {
          const points = [-1, ...GEOPHONES, 95].map((x, i) => ({
            position: x,
            elevation: bumps[i],
          }));
          const run = (s: number) =>
            interpretLine({
              picks,
              assignments: trueAssignments(picks),
              method: "plus-minus",
              pickError: 0.0005,
              elevation: elevationProfile(
                points.map((p) => ({ ...p, elevation: p.elevation + s })),
              ),
              datum: -4 + s,
            }).refractors[0];
          const a = run(0);
          const b = run(shift);
          a.plusMinus.forEach((p, i) => {
            expect(b.plusMinus[i].plus).toBeCloseTo(p.plus, 9);
            expect(b.plusMinus[i].minus).toBeCloseTo(p.minus, 9);
          });
          a.depth.forEach((d, i) => {
            expect(b.depth[i].elevation - d.elevation).toBeCloseTo(shift, 6);
            expect(b.depth[i].depth).toBeCloseTo(d.depth, 6);
          });
        },
      ),
      { numRuns: 25 },
    );
  });

  it("minus times of a plus-minus pair are forward minus reverse (Hagedoorn 1959)", () => {
    const f = makeBranch(0, 1, [
      { position: 10, time: 0.03 },
      { position: 20, time: 0.035 },
    ]);
    const r = makeBranch(30, -1, [
      { position: 10, time: 0.036 },
      { position: 20, time: 0.031 },
    ]);
    const pm = plusMinusTimes(f, r, 0.04, [10, 20]);
    expect(pm[0]).toMatchObject({
      plus: expect.closeTo(0.026, 12),
      minus: expect.closeTo(-0.006, 12),
    });
  });
});

describe("errors and the printed form", () => {
  it("refuses too few direct-wave picks and a bad pick error, naming them", () => {
    const picks = flatPicks([{ velocity: 500, thickness: 6 }, { velocity: 2200 }], [-1, 95]);
    const a = trueAssignments(picks).filter((x) => x.layer !== 1);
    expect(() =>
      interpretLine({ picks, assignments: a, method: "plus-minus", pickError: 0.0005 }),
    ).toThrow(/direct wave \(layer 1\) needs at least two picks/);
    expect(() =>
      interpretLine({
        picks,
        assignments: trueAssignments(picks),
        method: "plus-minus",
        pickError: 0,
      }),
    ).toThrow(/pickError/);
  });

  it("prints exactly the contract's names", () => {
    const picks = flatPicks([{ velocity: 500, thickness: 6 }, { velocity: 2200 }], [-1, 95]);
    const json = interpretationJson(
      interpretLine({
        picks,
        assignments: trueAssignments(picks),
        method: "grm",
        pickError: 0.0005,
      }),
    );
    expect(Object.keys(json)).toEqual(["refractors", "reciprocal"]);
    expect(Object.keys(json.refractors[0])).toEqual(["layer", "method", "velocity", "depth"]);
    expect(Object.keys(json.refractors[0].velocity[0])).toEqual(["position", "value"]);
    expect(Object.keys(json.refractors[0].depth[0])).toEqual([
      "position",
      "depth",
      "elevation",
      "sigma",
    ]);
    expect(Object.keys(json.reciprocal[0])).toEqual(["shots", "forward", "reverse", "difference"]);
  });
});

import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { earthFromModel } from "./geometry";
import { linesFor, prepareEarth } from "./head-waves";
import { createLineSet } from "./lines";
import { recoverDipLayered } from "./dip-recovery";

const deg = Math.PI / 180;

describe("recoverDipLayered (Adachi 1954; Johnson 1976)", () => {
  it("reduces to the two-layer reversed-profile formulas (Telford et al. 1990 §4.3.3)", () => {
    // v_d = v1 / sin(θc + φ), v_u = v1 / sin(θc − φ) with v1 = 700, v2 = 3100, φ = 6°
    const theta = Math.asin(700 / 3100);
    const pf = Math.sin(theta + 6 * deg) / 700;
    const pr = Math.sin(theta - 6 * deg) / 700;
    const rec = recoverDipLayered([700], [], pf, pr)!;
    expect(rec.velocity).toBeCloseTo(3100, 8);
    expect(rec.dip).toBeCloseTo(6, 10);
    expect(rec.criticalAngle).toBeCloseTo(theta / deg, 10);
  });

  it("recovers a refractor under another dipping interface where the one-interface formula fails", () => {
    // Three layers, both interfaces dipping. Apparent slownesses from the exact ray tracing of
    // dipping.ts (itself checked against the two-layer closed forms and Fermat's principle).
    const earth = earthFromModel({
      layers: [
        { velocity: 600, thickness: 5, dip: 8 },
        { velocity: 1800, thickness: 10, dip: -4 },
        { velocity: 4000 },
      ],
    });
    const prep = prepareEarth(earth);
    const f = linesFor(prep, -5, 1, createLineSet(3));
    const r = linesFor(prep, 60, -1, createLineSet(3));
    const first = recoverDipLayered([600], [], f.slowness[1], r.slowness[1])!;
    expect(first.velocity).toBeCloseTo(1800, 6);
    expect(first.dip).toBeCloseTo(8, 8);
    const deep = recoverDipLayered(
      [600, first.velocity],
      [first.dip],
      f.slowness[2],
      r.slowness[2],
    )!;
    expect(deep.velocity).toBeCloseTo(4000, 5);
    expect(deep.dip).toBeCloseTo(-4, 7);
    // the one-interface formula with the velocity just above is several degrees off here
    const naive = Math.abs(
      (Math.asin(1800 * f.slowness[2]) - Math.asin(1800 * r.slowness[2])) / 2 / deg - -4,
    );
    expect(naive).toBeGreaterThan(1);
  });

  it("round-trips random planar models of up to four layers (property)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -6, max: 6, noNaN: true }), { minLength: 3, maxLength: 3 }),
        fc.double({ min: 1.6, max: 2.5, noNaN: true }),
        (dips, ratio) => {
          const v = [500, 500 * ratio, 500 * ratio * ratio, 500 * ratio ** 3];
          const earth = earthFromModel({
            layers: [
              { velocity: v[0], thickness: 4, dip: dips[0] },
              { velocity: v[1], thickness: 8, dip: dips[1] },
              { velocity: v[2], thickness: 12, dip: dips[2] },
              { velocity: v[3] },
            ],
          });
          const prep = prepareEarth(earth);
          const f = linesFor(prep, 0, 1, createLineSet(4));
          const r = linesFor(prep, 40, -1, createLineSet(4));
          for (let m = 1; m <= 3; m++) {
            if (!(f.exists[m] && r.exists[m])) return;
            const rec = recoverDipLayered(
              v.slice(0, m),
              dips.slice(0, m - 1),
              f.slowness[m],
              r.slowness[m],
            )!;
            expect(rec.velocity / v[m]).toBeCloseTo(1, 8);
            expect(rec.dip).toBeCloseTo(dips[m - 1], 6);
          }
        },
      ),
      { numRuns: 60, seed: -350287741 },
    );
  });

  it("recovers a steep up-dip refractor whose reverse apparent slowness is zero (infinite apparent velocity)", () => {
    // Two layers (Telford et al. 1990 §4.3.3): v_u = v1 / sin(θc − φ) is infinite when φ = θc,
    // so p_r = 0 while p_f = sin(2θc) / v1.
    const theta = Math.asin(500 / 1250);
    const rec = recoverDipLayered([500], [], Math.sin(2 * theta) / 500, 0)!;
    expect(rec.velocity).toBeCloseTo(1250, 6);
    expect(rec.dip).toBeCloseTo(theta / deg, 8);
  });

  it("returns null for slownesses no head wave under these layers can have, and throws on a dip count mismatch", () => {
    expect(recoverDipLayered([1000], [], 1 / 900, 1 / 2000)).toBeNull();
    expect(() => recoverDipLayered([500, 1500], [], 1e-4, 1e-4)).toThrow(/one dip per interface/);
  });
});

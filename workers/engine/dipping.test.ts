import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { earthFromModel } from "./geometry";
import { linesFor, prepareEarth } from "./head-waves";
import { createLineSet } from "./lines";

const deg = Math.PI / 180;

describe("dipping head waves", () => {
  it("match the two-layer dipping-refractor formulas (Telford et al. 1990 §4.3.3)", () => {
    // t = x sin(θc ± φ)/v1 + 2 h cos θc / v1, h = perpendicular depth under the shot
    const v1 = 700;
    const v2 = 3100;
    const phi = 6 * deg;
    const earth = earthFromModel({
      layers: [{ velocity: v1, thickness: 9, dip: 6 }, { velocity: v2 }],
    });
    const prep = prepareEarth(earth);
    const theta = Math.asin(v1 / v2);
    for (const shot of [-20, 0, 35]) {
      const h = (9 + shot * Math.tan(phi)) * Math.cos(phi);
      const down = linesFor(prep, shot, 1, createLineSet(2)); // shooting towards +x = down-dip
      const up = linesFor(prep, shot, -1, createLineSet(2));
      expect(down.intercept[1]).toBeCloseTo((2 * h * Math.cos(theta)) / v1, 13);
      expect(up.intercept[1]).toBeCloseTo((2 * h * Math.cos(theta)) / v1, 13);
      expect(down.slowness[1]).toBeCloseTo(Math.sin(theta + phi) / v1, 15);
      expect(up.slowness[1]).toBeCloseTo(Math.sin(theta - phi) / v1, 15);
    }
  });

  it("equal the flat formulas to 1e-12 relative when every dip is 0 (property)", () => {
    const layer = fc.record({
      velocity: fc.double({ min: 150, max: 7000, noNaN: true }),
      thickness: fc.double({ min: 0.2, max: 60, noNaN: true }),
    });
    fc.assert(
      fc.property(
        fc.array(layer, { minLength: 2, maxLength: 12 }),
        fc.double({ min: -100, max: 100, noNaN: true }),
        (layers, shot) => {
          const model = {
            layers: layers.map((l, i) => (i === layers.length - 1 ? { velocity: l.velocity } : l)),
          };
          const earth = earthFromModel(model);
          const v = earth.velocity;
          // keep away from grazing critical angles, where any formula is ill-conditioned
          for (let m = 1; m < v.length; m++)
            for (let i = 0; i < m; i++) fc.pre(!(v[i] / v[m] > 0.97 && v[i] < v[m]));
          const flat = prepareEarth(earth).flat!;
          const traced = prepareEarth(earth, true);
          for (const sign of [1, -1] as const) {
            const l = linesFor(traced, shot, sign, createLineSet(v.length));
            for (let m = 1; m < v.length; m++) {
              expect(l.exists[m]).toBe(flat.exists[m]);
              if (!flat.exists[m]) continue;
              expect(Math.abs(l.intercept[m] - flat.intercept[m])).toBeLessThanOrEqual(
                1e-12 * flat.intercept[m],
              );
              expect(Math.abs(l.slowness[m] - flat.slowness[m])).toBeLessThanOrEqual(
                1e-12 * flat.slowness[m],
              );
              expect(Math.abs(l.start[m] - flat.start[m])).toBeLessThanOrEqual(
                1e-12 * flat.start[m],
              );
            }
          }
        },
      ),
      { numRuns: 300 },
    );
  });

  it("obey reciprocity: shot A → B on the forward branch equals B → A on the reverse (property)", () => {
    const layer = fc.record({
      velocity: fc.double({ min: 200, max: 6000, noNaN: true }),
      thickness: fc.double({ min: 2, max: 40, noNaN: true }),
      dip: fc.double({ min: -8, max: 8, noNaN: true }),
    });
    fc.assert(
      fc.property(
        fc.array(layer, { minLength: 2, maxLength: 6 }),
        fc.double({ min: -60, max: 0, noNaN: true }),
        fc.double({ min: 1, max: 150, noNaN: true }),
        (layers, a, span) => {
          const model = {
            layers: layers.map((l, i) => (i === layers.length - 1 ? { velocity: l.velocity } : l)),
          };
          const earth = earthFromModel(model);
          const v = earth.velocity;
          for (let m = 1; m < v.length; m++) {
            for (let i = 0; i < m; i++) fc.pre(!(v[i] / v[m] > 0.97 && v[i] < v[m]));
          }
          // interfaces must stay ordered over the shots
          for (const x of [a, a + span]) {
            let above = 0;
            for (let k = 1; k < earth.layerCount; k++) {
              const z = earth.depthAtZero[k] + x * earth.slope[k];
              fc.pre(z > above + 0.5);
              above = z;
            }
          }
          const prep = prepareEarth(earth);
          const n = earth.layerCount;
          const fwd = linesFor(prep, a, 1, createLineSet(n));
          const rev = linesFor(prep, a + span, -1, createLineSet(n));
          for (let m = 1; m < n; m++) {
            expect(fwd.exists[m]).toBe(rev.exists[m]);
            if (!fwd.exists[m]) continue;
            const tf = fwd.intercept[m] + fwd.slowness[m] * span;
            const tr = rev.intercept[m] + rev.slowness[m] * span;
            expect(Math.abs(tf - tr)).toBeLessThanOrEqual(1e-12 * tf);
            // and the reciprocal path is valid from both ends at the same time
            const ambiguous = Math.abs(span - fwd.start[m]) < 1e-9 * span;
            if (!ambiguous) expect(span >= fwd.start[m]).toBe(span >= rev.start[m]);
          }
        },
      ),
      { numRuns: 300 },
    );
  });

  it("reports no head wave when θc + φ ≥ 90° (one leg of the path would have to go horizontal)", () => {
    // Telford et al. 1990 §4.3.3: the legs of the reversed paths leave at θc − φ and θc + φ.
    const steep = earthFromModel({
      layers: [{ velocity: 1000, thickness: 10, dip: 40 }, { velocity: 1100 }],
    });
    const prep = prepareEarth(steep); // θc = 65.4°, φ = 40°
    expect(linesFor(prep, 0, 1, createLineSet(2)).exists[1]).toBe(0);
    expect(linesFor(prep, 0, -1, createLineSet(2)).exists[1]).toBe(0);
    const gentle = prepareEarth(
      earthFromModel({ layers: [{ velocity: 1000, thickness: 10, dip: 20 }, { velocity: 1100 }] }),
    ); // θc + φ = 85.4°
    expect(linesFor(gentle, 0, 1, createLineSet(2)).exists[1]).toBe(1);
    expect(linesFor(gentle, 0, -1, createLineSet(2)).exists[1]).toBe(1);
  });
});

import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { earthFromModel, interfaceDepth } from "./geometry";
import { linesFor, prepareEarth } from "./head-waves";
import { crossoverMethod, interceptTimeMethod, recoverDip } from "./interpretation";
import { createLineSet } from "./lines";
import { createPieces, firstArrivalPieces } from "./segments";

function flatLines(layers: { velocity: number; thickness?: number }[]) {
  const prep = prepareEarth(earthFromModel({ layers }));
  return prep.flat!;
}

describe("intercept-time and crossover methods", () => {
  it("recover the thickness from the two-layer crossover: h = (x_co/2)√((v2−v1)/(v2+v1)) (Kearey et al. 2002 ch. 5)", () => {
    const lines = flatLines([{ velocity: 600, thickness: 7.5 }, { velocity: 2700 }]);
    const pieces = firstArrivalPieces(lines, 2, createPieces(2));
    const xco = pieces.to[0];
    expect((xco / 2) * Math.sqrt((2700 - 600) / (2700 + 600))).toBeCloseTo(7.5, 12);
    const c = crossoverMethod(lines.slowness[0], {
      intercept: lines.intercept[1],
      slowness: lines.slowness[1],
    });
    expect(c.distance).toBeCloseTo(xco, 10);
    expect(c.thickness).toBeCloseTo(7.5, 12);
  });

  it("recovers every depth exactly when every refractor is seen (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 200, max: 900, noNaN: true }),
        fc.array(
          fc.record({
            ratio: fc.double({ min: 1.05, max: 3, noNaN: true }),
            h: fc.double({ min: 0.5, max: 40, noNaN: true }),
          }),
          { minLength: 1, maxLength: 8 },
        ),
        (v0, steps) => {
          let v = v0;
          const layers = [{ velocity: v0, thickness: steps[0].h }];
          steps.forEach((s, i) => {
            v *= s.ratio;
            layers.push(
              i === steps.length - 1
                ? ({ velocity: v } as never)
                : { velocity: v, thickness: steps[i + 1].h },
            );
          });
          const lines = flatLines(layers);
          const observed = layers.slice(1).map((_, j) => ({
            intercept: lines.intercept[j + 1],
            slowness: lines.slowness[j + 1],
          }));
          const result = interceptTimeMethod(lines.slowness[0], observed);
          let depth = 0;
          result.depths.forEach((d, j) => {
            depth += layers[j].thickness as number;
            expect(Math.abs(d - depth)).toBeLessThanOrEqual(1e-9 * depth);
          });
        },
      ),
      { numRuns: 300 },
    );
  });

  it("interprets the refractor below a missed velocity inversion too deep (common practice; design.md)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 800, max: 2500, noNaN: true }),
        fc.double({ min: 0.3, max: 0.95, noNaN: true }),
        fc.double({ min: 1.2, max: 4, noNaN: true }),
        fc.double({ min: 1, max: 20, noNaN: true }),
        fc.double({ min: 1, max: 20, noNaN: true }),
        (v0, slow, fast, h0, h1) => {
          const layers = [
            { velocity: v0, thickness: h0 },
            { velocity: v0 * slow, thickness: h1 },
            { velocity: v0 * fast },
          ];
          const lines = flatLines(layers);
          expect(lines.exists[1]).toBe(0);
          const r = interceptTimeMethod(lines.slowness[0], [
            { intercept: lines.intercept[2], slowness: lines.slowness[2] },
          ]);
          expect(r.depths[0]).toBeGreaterThan(h0 + h1);
        },
      ),
    );
  });

  it("interprets the refractor below a missed thin layer too shallow (common practice; design.md)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 200, max: 1000, noNaN: true }),
        fc.double({ min: 1.1, max: 3, noNaN: true }),
        fc.double({ min: 1.1, max: 3, noNaN: true }),
        fc.double({ min: 1, max: 20, noNaN: true }),
        fc.double({ min: 0.1, max: 20, noNaN: true }),
        (v0, r1, r2, h0, h1) => {
          const layers = [
            { velocity: v0, thickness: h0 },
            { velocity: v0 * r1, thickness: h1 },
            { velocity: v0 * r1 * r2 },
          ];
          const lines = flatLines(layers);
          const r = interceptTimeMethod(lines.slowness[0], [
            { intercept: lines.intercept[2], slowness: lines.slowness[2] },
          ]);
          expect(r.depths[0]).toBeLessThan(h0 + h1);
        },
      ),
    );
  });

  it("gives NaN, not a wrong number, for a refractor no faster than the layer above", () => {
    const r = interceptTimeMethod(1 / 1000, [{ intercept: 0.01, slowness: 1 / 900 }]);
    expect(Number.isNaN(r.depths[0])).toBe(true);
  });
});

describe("dip recovery from reversed shots (Telford et al. 1990 §4.3.3)", () => {
  it("recovers the true velocity and dip of a two-layer dipping refractor", () => {
    const earth = earthFromModel({
      layers: [{ velocity: 800, thickness: 10, dip: -5 }, { velocity: 3300 }],
    });
    const prep = prepareEarth(earth);
    const f = linesFor(prep, 0, 1, createLineSet(2));
    const r = linesFor(prep, 100, -1, createLineSet(2));
    const rec = recoverDip(800, f.slowness[1], r.slowness[1])!;
    expect(rec.velocity).toBeCloseTo(3300, 9);
    expect(rec.dip).toBeCloseTo(-5, 11);
  });

  it("recovers a dipping refractor under flat layers from the velocity just above it", () => {
    const earth = earthFromModel({
      layers: [
        { velocity: 500, thickness: 3 },
        { velocity: 1600, thickness: 8, dip: 4 },
        { velocity: 4200 },
      ],
    });
    const prep = prepareEarth(earth);
    const f = linesFor(prep, -5, 1, createLineSet(3));
    const r = linesFor(prep, 120, -1, createLineSet(3));
    expect(recoverDip(500, f.slowness[1], r.slowness[1])!.dip).toBeCloseTo(0, 11);
    const rec = recoverDip(1600, f.slowness[2], r.slowness[2])!;
    expect(rec.velocity).toBeCloseTo(4200, 8);
    expect(rec.dip).toBeCloseTo(4, 11);
    // depth below the shot from the interface geometry, for reference
    expect(interfaceDepth(earth, 2, 0)).toBe(11);
  });

  it("returns null when an apparent velocity is not faster than the layer above", () => {
    expect(recoverDip(1000, 1 / 900, 1 / 2000)).toBeNull();
  });
});

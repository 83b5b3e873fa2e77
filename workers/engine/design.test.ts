import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { earthFromModel, withThickness } from "./geometry";
import { prepareEarth } from "./head-waves";
import { createPieces, firstArrivalPieces, countOnSegments } from "./segments";
import { lastCrossover, maxSpacingFor, minimumThickness, spreadLengthFor } from "./design";
import { createJudgeScratch, worstCodes } from "./verdicts";
import { branchOf } from "./branches";

const cosC = (a: number, b: number) => Math.cos(Math.asin(a / b));

describe("minimumThickness", () => {
  const layers = [
    { velocity: 500, thickness: 5 },
    { velocity: 1500, thickness: 2 },
    { velocity: 3000 },
  ];
  const layout = { spacing: 1, channels: 96, firstGeophone: 0, shots: [-0.5, 95.5] };
  const extent = { from: -0.5, to: 95.5 };

  it("is the thickness from which the layer's refractor is resolved", () => {
    const earth = earthFromModel({ layers });
    const h = minimumThickness(prepareEarth(earth), layout, 2, 1, extent)!;
    const status = (t: number) => {
      const w = new Uint8Array(3);
      worstCodes(prepareEarth(withThickness(earth, 1, t)), layout, 2, createJudgeScratch(3), w);
      return w[1];
    };
    expect(status(h)).toBe(0);
    expect(status(h * 0.999)).not.toBe(0);
  });

  it("approaches the blind-layer limit from equating the two crossover distances (Soske 1959) as spacing shrinks", () => {
    // x(1→2) = t2 / (1/v1 − 1/v2) must equal x(2→3) = (t3 − t2) / (1/v2 − 1/v3); t3 is linear in h2.
    const [v1, v2, v3, h1] = [500, 1500, 3000, 5];
    const t2 = (2 * h1 * cosC(v1, v2)) / v1;
    const x12 = t2 / (1 / v1 - 1 / v2);
    const limit =
      ((x12 * (1 / v2 - 1 / v3) + t2 - (2 * h1 * cosC(v1, v3)) / v1) * v2) / (2 * cosC(v2, v3));
    const fine = { spacing: 0.001, channels: 60000, firstGeophone: 0, shots: [-0.0005] };
    const h = minimumThickness(prepareEarth(earthFromModel({ layers })), fine, 2, 1, {
      from: -0.0005,
      to: 60,
    })!;
    expect(h).toBeGreaterThan(limit);
    expect(h - limit).toBeLessThan(0.01);
  });

  it("is null for an inverted layer and for the half-space", () => {
    const inv = earthFromModel({
      layers: [
        { velocity: 1500, thickness: 5 },
        { velocity: 800, thickness: 2 },
        { velocity: 3000 },
      ],
    });
    expect(minimumThickness(prepareEarth(inv), layout, 2, 1, extent)).toBeNull();
    expect(minimumThickness(prepareEarth(inv), layout, 2, 2, extent)).toBeNull();
  });
});

describe("maxSpacing and spreadLength", () => {
  it("guarantee the minimum count on every bounded segment and past the last crossover, wherever the line starts (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 200, max: 800, noNaN: true }),
        fc.array(
          fc.record({
            r: fc.double({ min: 1.1, max: 3, noNaN: true }),
            h: fc.double({ min: 0.5, max: 15, noNaN: true }),
          }),
          {
            minLength: 1,
            maxLength: 5,
          },
        ),
        fc.integer({ min: 2, max: 5 }),
        fc.double({ min: 0, max: 0.999, noNaN: true }),
        (v0, steps, min, shift) => {
          let v = v0;
          const layers = [{ velocity: v0, thickness: steps[0].h }];
          steps.forEach((s, i) => {
            v *= s.r;
            layers.push(
              i === steps.length - 1
                ? ({ velocity: v } as never)
                : { velocity: v, thickness: steps[i + 1].h },
            );
          });
          const prep = prepareEarth(earthFromModel({ layers }));
          const n = layers.length;
          const pieces = firstArrivalPieces(prep.flat!, n, createPieces(n));
          const spacing = maxSpacingFor([pieces], n, min);
          const dx = spacing ?? 5;
          const { spreadLength, channels } = spreadLengthFor(lastCrossover([pieces]), dx, min);
          // an end shot, the first geophone anywhere within one spacing of it
          const layout = { spacing: dx, channels, firstGeophone: shift * dx, shots: [0] };
          const counts = countOnSegments(
            pieces,
            layout,
            branchOf(layout, 0, "forward"),
            new Int32Array(n),
          );
          for (let i = 0; i < pieces.count; i++)
            expect(counts[pieces.arrival[i]]).toBeGreaterThanOrEqual(min);
          expect(layout.firstGeophone + (channels - 1) * dx).toBeGreaterThanOrEqual(
            spreadLength - dx,
          );
        },
      ),
      { numRuns: 300 },
    );
  });
});

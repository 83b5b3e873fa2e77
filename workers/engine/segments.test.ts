import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createLineSet } from "./lines";
import { createPieces, firstArrivalPieces, pieceAt, segmentHull } from "./segments";

function linesFrom(defs: { t: number; p: number; c: number; exists?: boolean }[]) {
  const l = createLineSet(defs.length);
  defs.forEach((d, i) => {
    l.exists[i] = d.exists === false ? 0 : 1;
    l.intercept[i] = d.t;
    l.slowness[i] = d.p;
    l.start[i] = d.c;
  });
  return l;
}

describe("firstArrivalPieces", () => {
  // Crossover distance x = t_i / (1/v1 − 1/v2) (Kearey, Brooks & Hill 2002, ch. 5).
  it("switches from the direct wave to a head wave at the crossover distance", () => {
    // direct 1/500 s/m; head wave t = 0.02 + x/2000 → crossover 0.02 / (1/500 − 1/2000) = 13.33 m
    const lines = linesFrom([
      { t: 0, p: 1 / 500, c: 0 },
      { t: 0.02, p: 1 / 2000, c: 4 },
    ]);
    const pieces = firstArrivalPieces(lines, 2, createPieces(2));
    expect(pieces.count).toBe(2);
    expect(pieces.to[0]).toBeCloseTo(0.02 / (1 / 500 - 1 / 2000), 12);
    expect(segmentHull(pieces, 1)).toEqual({ from: pieces.to[0], to: Infinity });
  });

  // Critical distance x_crit = Σ 2 h_i tan θ_in (Telford, Geldart & Sheriff 1990, §4.3).
  it("starts a head wave at its critical distance when it is already earliest there", () => {
    const lines = linesFrom([
      { t: 0, p: 1 / 500, c: 0 },
      { t: 0.001, p: 1 / 2000, c: 10 },
    ]);
    const pieces = firstArrivalPieces(lines, 2, createPieces(2));
    expect(pieces.to[0]).toBe(10);
  });

  it("skips arrivals that do not exist", () => {
    const lines = linesFrom([
      { t: 0, p: 1 / 500, c: 0 },
      { t: 0.001, p: 1 / 5000, c: 1, exists: false },
    ]);
    expect(firstArrivalPieces(lines, 2, createPieces(2)).count).toBe(1);
  });

  it("gives at every offset the earliest valid arrival (property)", () => {
    const line = fc.record({
      t: fc.double({ min: 0.0001, max: 0.2, noNaN: true }),
      p: fc.double({ min: 1 / 8000, max: 1 / 200, noNaN: true }),
      c: fc.double({ min: 0, max: 300, noNaN: true }),
      exists: fc.boolean(),
    });
    fc.assert(
      fc.property(
        fc.double({ min: 1 / 3000, max: 1 / 150, noNaN: true }),
        fc.array(line, { minLength: 1, maxLength: 8 }),
        (p0, rest) => {
          const defs: { t: number; p: number; c: number; exists?: boolean }[] = [
            { t: 0, p: p0, c: 0 },
            ...rest,
          ];
          const lines = linesFrom(defs);
          const pieces = firstArrivalPieces(lines, defs.length, createPieces(defs.length));
          // pieces tile [0, ∞)
          expect(pieces.from[0]).toBe(0);
          for (let i = 1; i < pieces.count; i++) expect(pieces.from[i]).toBe(pieces.to[i - 1]);
          expect(pieces.to[pieces.count - 1]).toBe(Infinity);
          for (let x = 0.37; x < 600; x += 3.1) {
            const a = pieces.arrival[pieceAt(pieces, x)];
            const t = defs[a].t * (a === 0 ? 0 : 1) + defs[a].p * x;
            let best = Infinity;
            defs.forEach((d, i) => {
              if ((i === 0 || d.exists) && x >= d.c)
                best = Math.min(best, (i === 0 ? 0 : d.t) + d.p * x);
            });
            expect(t).toBeCloseTo(best, 12);
          }
        },
      ),
      { numRuns: 150 },
    );
  });
});

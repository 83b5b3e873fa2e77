import { describe, expect, it } from "vitest";
import { earthFromModel } from "./geometry";
import { prepareEarth } from "./head-waves";
import { createPieces, firstArrivalPieces } from "./segments";

// Closed forms written out independently of the engine (cos(asin(r)) rather than √(1−r²)).
const cosCrit = (v1: number, v2: number) => Math.cos(Math.asin(v1 / v2));
const tanCrit = (v1: number, v2: number) => Math.tan(Math.asin(v1 / v2));

describe("flat head waves", () => {
  it("matches the two-layer intercept time and critical distance (Telford et al. 1990 §4.3)", () => {
    const prep = prepareEarth(
      earthFromModel({ layers: [{ velocity: 600, thickness: 4 }, { velocity: 2400 }] }),
    );
    const l = prep.flat!;
    expect(l.intercept[1]).toBeCloseTo((2 * 4 * cosCrit(600, 2400)) / 600, 14);
    expect(l.start[1]).toBeCloseTo(2 * 4 * tanCrit(600, 2400), 12);
    expect(l.slowness[1]).toBe(1 / 2400);
  });

  it("matches the three-layer intercept time t = Σ 2 h_i cos θ_i3 / v_i (Telford et al. 1990 §4.3)", () => {
    const prep = prepareEarth(
      earthFromModel({
        layers: [
          { velocity: 450, thickness: 2.5 },
          { velocity: 1700, thickness: 6 },
          { velocity: 3900 },
        ],
      }),
    );
    const expected = (2 * 2.5 * cosCrit(450, 3900)) / 450 + (2 * 6 * cosCrit(1700, 3900)) / 1700;
    expect(prep.flat!.intercept[2]).toBeCloseTo(expected, 14);
    const xc = 2 * 2.5 * tanCrit(450, 3900) + 2 * 6 * tanCrit(1700, 3900);
    expect(prep.flat!.start[2]).toBeCloseTo(xc, 12);
  });

  it("puts the two-layer crossover at x = 2h √((v2+v1)/(v2−v1)) (Kearey, Brooks & Hill 2002 ch. 5)", () => {
    const prep = prepareEarth(
      earthFromModel({ layers: [{ velocity: 500, thickness: 6 }, { velocity: 2000 }] }),
    );
    const pieces = firstArrivalPieces(prep.flat!, 2, createPieces(2));
    expect(pieces.to[0]).toBeCloseTo(2 * 6 * Math.sqrt((2000 + 500) / (2000 - 500)), 10);
  });

  it("puts the crossover between refractors at (t_n+1 − t_n)/(1/v_n − 1/v_n+1) (design.md; Lowrie ch. 3)", () => {
    const prep = prepareEarth(
      earthFromModel({
        layers: [
          { velocity: 400, thickness: 3 },
          { velocity: 1500, thickness: 10 },
          { velocity: 4500 },
        ],
      }),
    );
    const l = prep.flat!;
    const pieces = firstArrivalPieces(l, 3, createPieces(3));
    expect(Array.from(pieces.arrival.slice(0, pieces.count))).toEqual([0, 1, 2]);
    const t2 = (2 * 3 * cosCrit(400, 1500)) / 400;
    const t3 = (2 * 3 * cosCrit(400, 4500)) / 400 + (2 * 10 * cosCrit(1500, 4500)) / 1500;
    expect(pieces.to[1]).toBeCloseTo((t3 - t2) / (1 / 1500 - 1 / 4500), 9);
  });

  it("gives no head wave along a layer not faster than every layer above (existence rule, design.md)", () => {
    const prep = prepareEarth(
      earthFromModel({
        layers: [
          { velocity: 800, thickness: 2 },
          { velocity: 1500, thickness: 3 },
          { velocity: 1200, thickness: 4 },
          { velocity: 1500, thickness: 4 },
          { velocity: 3000 },
        ],
      }),
    );
    expect(Array.from(prep.rule)).toEqual([1, 1, 0, 0, 1]);
    expect(Array.from(prep.flat!.exists)).toEqual([1, 1, 0, 0, 1]);
  });
});

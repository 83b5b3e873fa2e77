import { describe, expect, it } from "vitest";
import { earthFromModel } from "./geometry";
import { flatReflectionTime, reflectionSolver } from "./reflections";

describe("reflections", () => {
  it("follow the one-layer hyperbola t = √(x² + 4h²)/v (Telford et al. 1990 §4.2)", () => {
    const e = earthFromModel({ layers: [{ velocity: 800, thickness: 12 }, { velocity: 2000 }] });
    for (const x of [0, 3, 25, 140]) {
      expect(flatReflectionTime(e, 1, x)).toBeCloseTo(Math.sqrt(x * x + 4 * 144) / 800, 13);
    }
  });

  it("follow the dipping-reflector formula t = √(x² + 4h² + 4hx sin φ)/v (Telford et al. 1990 §4.2, image source)", () => {
    const phi = (7 * Math.PI) / 180;
    const e = earthFromModel({
      layers: [{ velocity: 900, thickness: 15, dip: 7 }, { velocity: 2500 }],
    });
    const shot = 10;
    const h = (15 + shot * Math.tan(phi)) * Math.cos(phi); // perpendicular depth under the shot
    const solve = reflectionSolver(e, 1, shot);
    for (const x of [-60, -12, 0, 8, 45, 90]) {
      // x measured positive down-dip (towards increasing position)
      const expected = Math.sqrt(x * x + 4 * h * h + 4 * h * x * Math.sin(phi)) / 900;
      expect(Math.abs(solve(shot + x) - expected)).toBeLessThan(1e-10);
    }
  });

  it("traced by shooting agree with the ray-parameter solution when every dip is 0", () => {
    const flat = earthFromModel({
      layers: [
        { velocity: 450, thickness: 3 },
        { velocity: 1600, thickness: 7 },
        { velocity: 3500 },
      ],
    });
    const forcedShooting = { ...flat, dipping: true };
    for (const m of [1, 2]) {
      const shoot = reflectionSolver(forcedShooting, m, 0);
      for (const x of [1, 10, 33, 80]) {
        expect(Math.abs(shoot(x) - flatReflectionTime(flat, m, x))).toBeLessThan(1e-11);
        expect(Math.abs(shoot(-x) - flatReflectionTime(flat, m, x))).toBeLessThan(1e-11);
      }
    }
  });

  it("exist at large offsets beneath a velocity inversion (p < 1 / max velocity above)", () => {
    const e = earthFromModel({
      layers: [
        { velocity: 1500, thickness: 3 },
        { velocity: 700, thickness: 4 },
        { velocity: 3000 },
      ],
    });
    const t = flatReflectionTime(e, 2, 500);
    expect(Number.isFinite(t)).toBe(true);
    expect(t).toBeGreaterThan(500 / 1500);
  });
});

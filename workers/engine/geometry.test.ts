import { describe, expect, it } from "vitest";
import {
  checkedEarth,
  earthFromModel,
  findInterfaceProblem,
  interfaceDepth,
  withThickness,
  withVelocity,
} from "./geometry";

const threeLayers = {
  layers: [
    { velocity: 400, thickness: 3, dip: 2 },
    { velocity: 1600, thickness: 7, dip: -3 },
    { velocity: 4200 },
  ],
};

describe("earthFromModel", () => {
  it("stacks thicknesses into interface depths at position 0", () => {
    const e = earthFromModel(threeLayers);
    expect(Array.from(e.depthAtZero)).toEqual([0, 3, 10]);
    expect(Array.from(e.velocity)).toEqual([400, 1600, 4200]);
    expect(e.dipping).toBe(true);
  });

  it("deepens an interface with positive dip towards increasing position", () => {
    const e = earthFromModel(threeLayers);
    expect(interfaceDepth(e, 1, 100)).toBeCloseTo(3 + 100 * Math.tan((2 * Math.PI) / 180), 12);
    expect(interfaceDepth(e, 2, 100)).toBeCloseTo(10 - 100 * Math.tan((3 * Math.PI) / 180), 12);
  });

  it("marks a model without dips as flat", () => {
    expect(
      earthFromModel({ layers: [{ velocity: 300, thickness: 2 }, { velocity: 900 }] }).dipping,
    ).toBe(false);
  });

  it.each([
    ["zero velocity", [{ velocity: 0, thickness: 2 }, { velocity: 900 }]],
    ["negative velocity", [{ velocity: -5, thickness: 2 }, { velocity: 900 }]],
    ["NaN velocity", [{ velocity: NaN, thickness: 2 }, { velocity: 900 }]],
    ["zero thickness", [{ velocity: 300, thickness: 0 }, { velocity: 900 }]],
    ["NaN thickness", [{ velocity: 300, thickness: NaN }, { velocity: 900 }]],
    ["missing thickness", [{ velocity: 300 }, { velocity: 900 }]],
  ])("throws a RangeError for %s", (_label, layers) => {
    expect(() => earthFromModel({ layers })).toThrow(RangeError);
  });
});

describe("withThickness and withVelocity", () => {
  it("moves every interface below the changed layer by the same amount", () => {
    const e = withThickness(earthFromModel(threeLayers), 0, 5);
    expect(Array.from(e.depthAtZero)).toEqual([0, 5, 12]);
  });

  it("does not mutate the original earth", () => {
    const base = earthFromModel(threeLayers);
    withThickness(base, 1, 20);
    withVelocity(base, 1, 999);
    expect(Array.from(base.depthAtZero)).toEqual([0, 3, 10]);
    expect(base.velocity[1]).toBe(1600);
  });

  it("refuses a thickness for the half-space", () => {
    expect(() => withThickness(earthFromModel(threeLayers), 2, 4)).toThrow(RangeError);
  });
});

describe("findInterfaceProblem", () => {
  it("accepts interfaces that stay apart over the extent", () => {
    expect(findInterfaceProblem(earthFromModel(threeLayers), -20, 40)).toBeNull();
  });

  it("finds interfaces that cross within the extent", () => {
    // 3 + x tan2° = 10 − x tan3°  →  x ≈ 80 m
    const e = earthFromModel(threeLayers);
    expect(findInterfaceProblem(e, 0, 120)).toEqual({ layer: 1, problem: "crosses" });
    expect(() => checkedEarth(threeLayers, 0, 120)).toThrow(/base of layer 2 meets or crosses/);
  });

  it("finds an interface that reaches the surface", () => {
    // 3 + x tan2° = 0  →  x ≈ −86 m
    expect(findInterfaceProblem(earthFromModel(threeLayers), -100, 0)).toEqual({
      layer: 0,
      problem: "surface",
    });
  });
});

import { describe, expect, it } from "vitest";
import { firstArrival } from "./__fixtures__/flat-layers";
import { modelFirstArrival } from "./modelled-arrivals";

describe("modelFirstArrival", () => {
  const layers = [
    { velocity: 450, thickness: 3 },
    { velocity: 1700, thickness: 6 },
    { velocity: 3800 },
  ];

  it("gives the flat-layer first arrival on both sides of the shot", () => {
    // Closed forms of Telford, Geldart & Sheriff (1990) §4.3, written independently in the fixture.
    const engine = modelFirstArrival({ layers });
    const expected = firstArrival(layers);
    for (const [source, receiver] of [
      [0, 0],
      [0, 4],
      [0, 37],
      [10, -55],
      [-2.5, 93],
    ]) {
      expect(engine(source, receiver)).toBeCloseTo(expected(source, receiver), 9);
    }
  });

  it("returns NaN, not a throw, where the model cannot be computed", () => {
    const crossing = modelFirstArrival({
      layers: [
        { velocity: 500, thickness: 2, dip: 30 },
        { velocity: 1500, thickness: 1, dip: -30 },
        { velocity: 3000 },
      ],
    });
    expect(crossing(0, 200)).toBeNaN();
  });
});

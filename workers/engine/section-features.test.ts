import { describe, expect, it } from "vitest";
import { featureName, interfaceFeatures } from "./section-features";

const line = (pts: [number, number][]) => ({
  xs: Float64Array.from(pts.map((p) => p[0])),
  ys: Float64Array.from(pts.map((p) => p[1])),
});

/** Every feature of a polyline (position m, elevation m) by name, in order along the line. */
const names = (pts: [number, number][]) => {
  const f = interfaceFeatures(line(pts));
  return f.map((_, i) => featureName(f, i));
};

describe("feature names from the shape of an interface", () => {
  it("names a flat-floored channel's shoulders, walls and floor", () => {
    expect(
      names([
        [0, 95],
        [40, 95],
        [44, 91],
        [54, 91],
        [58, 95],
        [100, 95],
      ]),
    ).toEqual([
      "level stretch",
      "channel wall (descending)",
      "channel floor",
      "channel wall (rising)",
      "level stretch",
    ]);
  });

  it("calls the rising wall a wall when the shoulder beyond it dips away (the demo's cutting line C)", () => {
    // the shoulder east of the channel falls 2 m over 54 m, so its mean elevation (93.0 m)
    // is below the wall's (93.4 m): comparing mean elevations once named this wall a crest
    expect(
      names([
        [-4, 95.6],
        [32, 94.3],
        [35, 93.0],
        [43, 92.8],
        [46, 94.0],
        [100, 92.0],
      ]),
    ).toEqual([
      "level stretch",
      "channel wall (descending)",
      "channel floor",
      "channel wall (rising)",
      "level stretch",
    ]);
  });

  it("names the walls of a V-shaped channel without a floor", () => {
    expect(
      names([
        [0, 95],
        [40, 95],
        [48, 90],
        [56, 95],
        [100, 95],
      ]),
    ).toEqual([
      "level stretch",
      "channel wall (descending)",
      "channel wall (rising)",
      "level stretch",
    ]);
  });

  it("keeps a ridge's top a crest and names its flanks", () => {
    expect(
      names([
        [0, 90],
        [40, 90],
        [44, 94],
        [54, 94],
        [58, 90],
        [100, 90],
      ]),
    ).toEqual([
      "level stretch",
      "ridge flank (rising)",
      "crest",
      "ridge flank (descending)",
      "level stretch",
    ]);
  });

  it("names a scarp between two levels a step, not a crest, wall or floor", () => {
    // 5 m down over 3 m: atan(5/3) = 59°
    expect(
      names([
        [0, 95],
        [40, 95],
        [43, 90],
        [100, 90],
      ]),
    ).toEqual(["level stretch", "step dipping 59°", "level stretch"]);
  });

  it("names a steepening slope (a rounded shoulder) by its dips, not as a crest", () => {
    // 0°, then atan(2/20) = 6°, then atan(10/20) = 27°
    expect(
      names([
        [0, 95],
        [20, 95],
        [40, 93],
        [60, 83],
      ]),
    ).toEqual(["level stretch", "slope dipping 6°", "slope dipping 27°"]);
  });

  it("names a layer base that rises to pinch out against the surface as a slope", () => {
    // the base climbs 4 m over 20 m (atan(4/20) = 11°) and then runs just under the surface
    expect(
      names([
        [0, 90],
        [30, 90],
        [50, 94],
        [100, 94],
      ]),
    ).toEqual(["level stretch", "slope dipping 11°", "level stretch"]);
  });

  it("names a lone planar interface by its dip", () => {
    // atan(6/60) = 5.7°
    expect(
      names([
        [0, 95],
        [60, 89],
      ]),
    ).toEqual(["slope dipping 6°"]);
    expect(
      names([
        [0, 95],
        [60, 95],
      ]),
    ).toEqual(["level stretch"]);
  });
});

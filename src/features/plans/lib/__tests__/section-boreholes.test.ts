import { describe, expect, it } from "vitest";
import type { SectionDraft } from "../plan-form";
import {
  boreholeMismatches,
  boreholeTop,
  mismatchNote,
  mismatchTolerance,
} from "../section-boreholes";

/** Surface falling from 102 m to 97 m over 120 m; one base, then the half-space. */
const section = (boreholes: SectionDraft["boreholes"]): SectionDraft => ({
  surface: [
    [0, 102],
    [120, 97],
  ],
  layers: [
    {
      name: "silty clay",
      velocity: 550,
      base: [
        [0, 96],
        [60, 92],
        [120, 94],
      ],
    },
    { name: "mudstone", velocity: 2600 },
  ],
  boreholes,
});

describe("borehole mismatches", () => {
  it("uses 0.5 m or 10 % of the logged depth, whichever is larger (our choice)", () => {
    expect(mismatchTolerance(3)).toBe(0.5);
    expect(mismatchTolerance(12)).toBeCloseTo(1.2, 9);
  });

  it("hangs a log from the surface unless it has its own top", () => {
    const s = section([]);
    // surface at 60 m: 102 − 5·60/120 = 99.5 m (linear between the two points)
    expect(boreholeTop(s.surface, { name: "BH1", position: 60, depths: [1] })).toBeCloseTo(99.5, 9);
    expect(boreholeTop(s.surface, { name: "BH1", position: 60, top: 100, depths: [1] })).toBe(100);
  });

  it("flags a logged base farther from the model than the tolerance, and only that one", () => {
    const s = section([
      // at 60 m: top 99.5, logged base 99.5 − 7.5 = 92.0 m; model 92.0 m → agrees
      { name: "BH1", position: 60, depths: [7.5] },
      // at 30 m: top 100.75, logged 100.75 − 6.65 = 94.1 m; model 96 − 4·30/60 = 94.0 → agrees
      { name: "BH2", position: 30, depths: [6.65] },
      // at 90 m: own top 98.2, logged 98.2 − 4 = 94.2 m; model 92 + 2·30/60 = 93.0 → 1.2 m > 0.5 m
      { name: "BH3", position: 90, top: 98.2, depths: [4, 9] },
      // an absent layer is not compared
      { name: "BH4", position: 100, depths: [null, 12] },
    ]);
    const found = boreholeMismatches(s);
    expect(found).toHaveLength(1);
    expect(found[0].borehole).toBe("BH3");
    expect(found[0].layer).toBe(0);
    expect(found[0].logged).toBeCloseTo(94.2, 9);
    expect(found[0].model).toBeCloseTo(93.0, 9);
    expect(mismatchNote(found[0], s, "metric")).toBe(
      "BH3: top of mudstone logged at 94.2 m, model has 93.0 m (1.2 m apart, more than 0.5 m)",
    );
  });

  it("allows 10 % of a deep log: 1.2 m apart at 14 m depth is within 1.4 m", () => {
    // at 60 m: top 99.5, logged 99.5 − 14 = 85.5; a base at 86.7 is 1.2 m above it
    const s = section([{ name: "BH5", position: 60, depths: [14] }]);
    s.layers[0].base = [
      [0, 86.7],
      [120, 86.7],
    ];
    expect(boreholeMismatches(s)).toEqual([]);
    s.layers[0].base = [
      [0, 87],
      [120, 87],
    ];
    expect(boreholeMismatches(s).map((m) => m.borehole)).toEqual(["BH5"]);
  });

  it("returns nothing without boreholes", () => {
    expect(boreholeMismatches(section(undefined))).toEqual([]);
  });
});

import { describe, expect, it } from "vitest";
import type { SectionModelAnalysis } from "@engine";
import { sectionOverlayData } from "../section-compare";

describe("sectionOverlayData", () => {
  it("joins one shot's modelled geophone times through the shot point, ordered by offset", () => {
    const analysis = {
      arrivals: [
        {
          shot: 0,
          position: 10,
          elevation: 100,
          geophones: [
            { position: 0, elevation: 100, time: 0.02, via: 1 },
            { position: 20, elevation: 100, time: 0.018, via: 2 },
            { position: 10, elevation: 100, time: null, via: 1 },
          ],
        },
      ],
    } as unknown as SectionModelAnalysis;
    const { curves, arrivals } = sectionOverlayData(analysis, 0);
    expect(Array.from(curves.offsets)).toEqual([-10, 0, 10]);
    expect(Array.from(curves.first.times)).toEqual([0.02, 0, 0.018]);
    expect(Array.from(curves.first.layer)).toEqual([1, 1, 2]);
    // the geophone at the shot has no time and is left out of the dots
    expect(arrivals.geophones.map((g) => g.position)).toEqual([0, 20]);
    expect(arrivals.shotPosition).toBe(10);
  });
});

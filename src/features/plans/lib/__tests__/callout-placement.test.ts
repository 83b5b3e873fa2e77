import { describe, expect, it } from "vitest";
import {
  boxesOverlap,
  placeCallouts,
  segmentCrossesBox,
  type Box,
  type PlacedCallout,
} from "../callout-placement";

const bounds = { left: 0, right: 600, top: 0, bottom: 400 };
const inset = (b: Box): Box => ({ x0: b.x0 + 1, x1: b.x1 - 1, y0: b.y0 + 1, y1: b.y1 - 1 });

/** No two labels overlap and no leader runs through another callout's label. */
function expectClear(placed: PlacedCallout[]) {
  for (let i = 0; i < placed.length; i++)
    for (let j = 0; j < placed.length; j++) {
      if (i === j) continue;
      expect(boxesOverlap(placed[i].box, placed[j].box)).toBe(false);
      expect(segmentCrossesBox(placed[i].leader, inset(placed[j].box))).toBe(false);
    }
}

describe("segments and boxes", () => {
  const box = { x0: 10, x1: 20, y0: 10, y1: 20 };
  it("finds a segment through a box, and none beside or ending short of it", () => {
    expect(segmentCrossesBox({ x1: 15, y1: 0, x2: 15, y2: 30 }, box)).toBe(true);
    expect(segmentCrossesBox({ x1: 0, y1: 0, x2: 30, y2: 30 }, box)).toBe(true);
    expect(segmentCrossesBox({ x1: 25, y1: 0, x2: 25, y2: 30 }, box)).toBe(false);
    expect(segmentCrossesBox({ x1: 15, y1: 0, x2: 15, y2: 8 }, box)).toBe(false);
  });
});

describe("callout placement", () => {
  it("puts a lone label centred just above its mark", () => {
    const [c] = placeCallouts(
      [{ x: 300, top: 200, bottom: 210, width: 100, height: 12 }],
      [],
      bounds,
    );
    expect(c.side).toBe("above");
    expect(c.box.x0).toBe(250);
    expect(c.box.y1).toBe(196); // the default 4 px gap above the mark
    expect(c.leader).toEqual({ x1: 300, y1: 196, x2: 300, y2: 200 });
  });

  it("keeps three wide labels on marks 15 px apart off each other and off each other's leaders", () => {
    // like a narrow channel's two walls and floor: labels 160 px wide on marks 15 px apart
    const placed = placeCallouts(
      [285, 300, 315].map((x) => ({ x, top: 250, bottom: 262, width: 160, height: 12 })),
      [],
      bounds,
    );
    expectClear(placed);
  });

  it("moves a label off text already on the chart right above its mark", () => {
    const name = { x0: 200, x1: 400, y0: 220, y1: 234 }; // a layer's name over the mark
    const placed = placeCallouts(
      [
        { x: 290, top: 250, bottom: 262, width: 150, height: 12 },
        { x: 310, top: 255, bottom: 267, width: 150, height: 12 },
      ],
      [name],
      bounds,
    );
    for (const c of placed) {
      expect(boxesOverlap(c.box, name)).toBe(false);
      expect(segmentCrossesBox(c.leader, inset(name))).toBe(false);
    }
    expectClear(placed);
  });

  it("stacks labels below their marks, row on row, when there is no room above", () => {
    // a narrow chart: marks near the top, three wide labels on marks 15 px apart
    const narrow = { left: 0, right: 360, top: 240, bottom: 400 };
    const placed = placeCallouts(
      [163, 178, 193].map((x) => ({ x, top: 250, bottom: 298, width: 170, height: 12 })),
      [],
      narrow,
    );
    expect(placed.every((c) => c.side === "below")).toBe(true);
    expectClear(placed);
  });

  it("keeps labels inside the bounds", () => {
    const [c] = placeCallouts(
      [{ x: 590, top: 20, bottom: 30, width: 120, height: 12 }],
      [],
      bounds,
    );
    expect(c.box.x1).toBeLessThanOrEqual(600);
    expect(c.box.y0).toBeGreaterThanOrEqual(0);
  });
});

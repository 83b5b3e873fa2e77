import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  branchOf,
  branchOffset,
  countBetween,
  firstAtOrBeyond,
  geophonePosition,
  layoutExtent,
} from "./branches";

const layout = { spacing: 2, channels: 12, firstGeophone: 0, shots: [-1, 11, 22] };

describe("branchOf", () => {
  it("puts every geophone of an off-end shot on its forward branch", () => {
    const b = branchOf(layout, -1, "forward");
    expect(b.count).toBe(12);
    expect(branchOffset(layout, b, 0)).toBe(1);
    expect(branchOffset(layout, b, 11)).toBe(23);
    expect(branchOf(layout, -1, "reverse").count).toBe(0);
  });

  it("splits the geophones around an interior shot", () => {
    const f = branchOf(layout, 11, "forward");
    const r = branchOf(layout, 11, "reverse");
    expect(f.count).toBe(6);
    expect(r.count).toBe(6);
    expect(branchOffset(layout, r, 0)).toBe(1);
    expect(branchOffset(layout, r, 5)).toBe(11);
  });

  it("leaves a geophone standing at the shot on neither branch", () => {
    expect(branchOf(layout, 22, "reverse").count).toBe(11);
    expect(branchOf(layout, 22, "forward").count).toBe(0);
  });

  it("computes the extent of geophones and shots", () => {
    expect(layoutExtent(layout)).toEqual({ from: -1, to: 22 });
  });
});

describe("countBetween", () => {
  it("counts exactly the geophones with from ≤ offset < to (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        fc.integer({ min: 1, max: 60 }),
        fc.double({ min: -50, max: 50, noNaN: true }),
        fc.double({ min: -80, max: 80, noNaN: true }),
        fc.boolean(),
        fc.double({ min: 0, max: 200, noNaN: true }),
        fc.double({ min: 0, max: 200, noNaN: true }),
        (spacing, channels, firstGeophone, shot, forward, a, b) => {
          const l = { spacing, channels, firstGeophone, shots: [shot] };
          const br = branchOf(l, shot, forward ? "forward" : "reverse");
          let brute = 0;
          let onBranch = 0;
          for (let i = 0; i < channels; i++) {
            const x = geophonePosition(l, i);
            const off = forward ? x - shot : shot - x;
            if (off > 0) {
              onBranch++;
              if (off >= Math.min(a, b) && off < Math.max(a, b)) brute++;
            }
          }
          expect(br.count).toBe(onBranch);
          expect(countBetween(l, br, Math.min(a, b), Math.max(a, b))).toBe(brute);
        },
      ),
      { numRuns: 300 },
    );
  });

  it("finds the first geophone at or beyond an offset", () => {
    const b = branchOf(layout, -1, "forward");
    expect(firstAtOrBeyond(layout, b, 5)).toBe(2);
    expect(firstAtOrBeyond(layout, b, 5.0001)).toBe(3);
    expect(firstAtOrBeyond(layout, b, 1000)).toBe(12);
  });
});

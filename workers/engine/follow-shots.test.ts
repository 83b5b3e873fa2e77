import { describe, expect, it } from "vitest";
import { followShots } from "./follow-shots";

// The rule is our own (docs/plan-format.md, sweep "follow" layout); the expected positions are
// worked by hand from it, independently of the code.
describe("followShots", () => {
  const layout = { spacing: 2, channels: 24, firstGeophone: 0, shots: [-5, 0, 23, 46, 50] };

  it("keeps off-end distances and interior fractions when the spacing doubles", () => {
    // old spread 0–46 m, new 0–92 m: −5 stays, 0 stays, 23 (half way) → 46, 46 (end) → 92,
    // 50 (4 m beyond the end) → 96.
    expect(Array.from(followShots(layout, 4, 24))).toEqual([-5, 0, 46, 92, 96]);
  });

  it("moves the far-end shots with the last geophone when channels are added", () => {
    // 48 channels at 2 m end at 94 m: the end shot goes to 94 and the off-end one to 98.
    const moved = followShots(layout, 2, 48);
    expect(moved[3]).toBeCloseTo(94, 12);
    expect(moved[4]).toBeCloseTo(98, 12);
  });

  it("leaves every shot where it was when the spread does not change", () => {
    expect(Array.from(followShots(layout, 2, 24))).toEqual(layout.shots);
  });
});

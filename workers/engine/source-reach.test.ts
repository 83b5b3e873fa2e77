import { describe, expect, it } from "vitest";
import {
  reachFlags,
  sourceReach,
  stacksToReach,
  SOURCE_REACH,
  SITE_NOISE_LEVELS,
} from "./source-reach";

describe("sourceReach", () => {
  it("reaches less on a noisier site, for every source (common practice)", () => {
    for (const levels of Object.values(SOURCE_REACH)) {
      const [quiet, moderate, noisy] = SITE_NOISE_LEVELS.map((n) => levels[n]);
      expect(quiet).toBeGreaterThan(moderate);
      expect(moderate).toBeGreaterThan(noisy);
    }
  });

  it("ranks a buried charge above a weight drop above a sledgehammer (common practice)", () => {
    expect(sourceReach("buried-charge", "moderate")).toBeGreaterThan(
      sourceReach("weight-drop", "moderate"),
    );
    expect(sourceReach("weight-drop", "moderate")).toBeGreaterThan(
      sourceReach("sledgehammer", "moderate"),
    );
  });
});

describe("stacksToReach", () => {
  it("needs N stacks for √N times the reach (random noise, Yilmaz 2001 §1.2)", () => {
    // Twice the reach: SNR must rise 2×, so 4 stacks (by hand); 3× → 9.
    expect(stacksToReach(120, 60)).toBe(4);
    expect(stacksToReach(180, 60)).toBe(9);
    expect(stacksToReach(61, 60)).toBe(2);
    expect(stacksToReach(60, 60)).toBe(1);
    // Brute force: the smallest N with √N · reach ≥ offset.
    for (const offset of [70, 95, 130, 200, 333]) {
      let n = 1;
      while (Math.sqrt(n) * 60 < offset) n++;
      expect(stacksToReach(offset, 60)).toBe(n > 32 ? null : n);
    }
  });

  it("gives null past a practical stack and throws for a bad reach", () => {
    expect(stacksToReach(1000, 60)).toBeNull();
    expect(() => stacksToReach(10, 0)).toThrow(RangeError);
  });
});

describe("reachFlags", () => {
  it("flags only the shots whose farthest geophone is beyond their source's reach", () => {
    const flags = reachFlags(
      [70, 140, 140],
      ["sledgehammer", "sledgehammer", "weight-drop"],
      "moderate",
    );
    expect(flags).toEqual([
      { shot: 0, offset: 70, reach: 60, stacks: 2 },
      { shot: 1, offset: 140, reach: 60, stacks: 6 },
    ]);
  });
});

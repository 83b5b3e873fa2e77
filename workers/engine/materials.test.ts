import { describe, expect, it } from "vitest";
import { findMaterial, matchMaterial, MATERIALS, MATERIALS_SOURCE } from "./materials";

describe("materials table", () => {
  it("holds the near-surface ranges listed in design.md (Kearey, Brooks & Hill 2002 Table 3.1, from memory)", () => {
    const ranges: [string, number, number][] = [
      ["dry-sand", 200, 1000],
      ["saturated-sand", 1500, 2000],
      ["clay", 1000, 2500],
      ["saturated-till", 1500, 2500],
      ["sandstone", 2000, 6000],
      ["limestone", 2000, 6000],
      ["granite", 5500, 6000],
      ["water", 1450, 1500],
    ];
    for (const [key, min, max] of ranges) expect(findMaterial(key)).toMatchObject({ min, max });
    expect(MATERIALS_SOURCE).toMatch(/Table 3\.1.*from memory/);
  });

  it("has unique keys and a typical value inside each range", () => {
    expect(new Set(MATERIALS.map((m) => m.key)).size).toBe(MATERIALS.length);
    for (const m of MATERIALS) {
      expect(m.min).toBeLessThanOrEqual(m.typical);
      expect(m.typical).toBeLessThanOrEqual(m.max);
      expect(m.label.length).toBeGreaterThan(0);
    }
  });

  it.each([
    ["Firm brown silty CLAY", "clay"],
    ["Medium dense SAND, wet (saturated sand)", "saturated-sand"],
    ["Loose dry sand with roots", "dry-sand"],
    ["Stiff grey boulder clay (till)", "saturated-till"],
    ["Weathered GRANITE", "granite"],
  ])("matches the borehole-log description %j to %s", (text, key) => {
    expect(matchMaterial(text)?.key).toBe(key);
  });

  it("matches nothing for an unknown description", () => {
    expect(matchMaterial("made ground: brick rubble")).toBeUndefined();
  });
});

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
    // Weathered rock is far slower than fresh granite (common practice), so "weathered" wins.
    ["Weathered GRANITE", "weathered-rock"],
    ["Fresh GRANITE", "granite"],
    ["Soft grey CLAY", "clay"],
    ["Dense sandy GRAVEL", "gravel"],
    ["MADE GROUND: brick rubble", "fill"],
    ["Dark brown TOPSOIL", "topsoil"],
    ["Dry glacial till", "dry-till"],
  ])("matches the borehole-log description %j to %s", (text, key) => {
    expect(matchMaterial(text)?.key).toBe(key);
  });

  it("matches nothing for an unknown description", () => {
    expect(matchMaterial("fibrous peat")).toBeUndefined();
  });

  it("gives every material a real range (Ice no longer 3,400–3,400) and a named source", () => {
    for (const m of MATERIALS) expect(m.max).toBeGreaterThan(m.min);
    // Ice: about 3.4–3.8 km/s (common practice, from memory).
    expect(findMaterial("ice")).toMatchObject({ min: 3400, max: 3800 });
    // Burger, Sheehan & Jones (2006) Table 3.1, from memory: weathered surface material
    // 240–610 m/s, gravel or dry sand 460–915 m/s.
    expect(findMaterial("topsoil")).toMatchObject({ min: 240, max: 610 });
    expect(findMaterial("gravel")).toMatchObject({ min: 460, max: 915 });
    for (const key of ["fill", "weathered-rock", "dry-till"]) {
      expect(findMaterial(key)?.source).toMatch(/common practice, from memory/);
    }
    expect(MATERIALS_SOURCE).toMatch(/Burger, Sheehan & Jones \(2006\)/);
  });
});

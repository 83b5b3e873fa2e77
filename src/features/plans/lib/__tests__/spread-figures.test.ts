import { describe, expect, it } from "vitest";
import { patternShots, spreadFigures } from "../spread-figures";

const spread = { spacing: 5, channels: 24, firstGeophone: 0 };

describe("spread figures", () => {
  it("gives the spread length and each shot's nearest and farthest offsets", () => {
    const f = spreadFigures(spread, [-2.5, 57.5, 140]);
    expect(f.length).toBe(115);
    expect(f.last).toBe(115);
    expect(f.shots[0]).toMatchObject({
      where: "before",
      outside: 2.5,
      nearestOffset: 2.5,
      farthestOffset: 117.5,
    });
    expect(f.shots[1]).toMatchObject({
      where: "inside",
      outside: 0,
      nearestOffset: 2.5,
      farthestOffset: 57.5,
    });
    expect(f.shots[2]).toMatchObject({
      where: "beyond",
      outside: 25,
      nearestOffset: 25,
      farthestOffset: 140,
    });
  });

  it("places quick-add shots off the geophones: ends, off-ends, centre, quarter points", () => {
    const geophones = new Set(Array.from({ length: 24 }, (_, i) => i * 5));
    const all = (["ends", "off-end", "centre", "interior"] as const).flatMap((p) =>
      patternShots(spread, p),
    );
    for (const s of all) expect(geophones.has(s.position)).toBe(false);
    expect(patternShots(spread, "ends").map((s) => s.position)).toEqual([-2.5, 117.5]);
    expect(patternShots(spread, "centre").map((s) => s.position)).toEqual([57.5]);
    const off = patternShots(spread, "off-end").map((s) => s.position);
    expect(off[0]).toBeLessThan(0);
    expect(off[1]).toBeGreaterThan(115);
    const quarter = patternShots(spread, "interior").map((s) => s.position);
    expect(quarter[0]).toBeGreaterThan(20);
    expect(quarter[1]).toBeLessThan(95);
  });
});

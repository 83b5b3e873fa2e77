// Roll-along layout (roll-along.ts) and the plan format's `spread.rollAlong` field. Every
// expected number below is worked by hand from the geometry (common practice): spread k of a
// line of N-channel spreads sharing `overlap` stations starts (k − 1)·(N − overlap)·Δx after the
// first, and N geophones at Δx span (N − 1)·Δx.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { planSchema, describePlanIssues } from "./plan-schema";
import {
  lineStations,
  rollAlongFor,
  rollAlongLayout,
  spreadOfLine,
  wholeLine,
  type RollingSpread,
} from "./roll-along";
import { parsePlan } from "./validate";

// 12 geophones at 2 m from 10 m, 3 spreads sharing 4 stations: step 8 stations = 16 m.
// Spread 1: 10…32 m, spread 2: 26…48 m, spread 3: 42…64 m; centres 21, 37, 53 m.
const line: RollingSpread = {
  spacing: 2,
  channels: 12,
  firstGeophone: 10,
  rollAlong: { spreads: 3, overlap: 4 },
  shots: [
    { position: 9, label: "start", anchor: { to: "start", offset: -1 } },
    { position: 33, anchor: { to: "end", offset: 1 } },
    { position: 21, label: "mid", anchor: { to: "centre", offset: 0 } },
    { position: 30, label: "fixed 30" }, // 9 m from centre 1, 7 m from centre 2 → spread 2
    { position: 29 }, // 8 m from centres 1 and 2: a tie goes to the earlier spread
    { position: 100, label: "far" }, // nearest centre 53 m → spread 3
  ],
};

describe("rollAlongLayout", () => {
  const layout = rollAlongLayout(line);

  it("numbers stations continuously: 12 + 2 × 8 = 28 stations, 1–12, 9–20, 17–28", () => {
    expect(layout.stations).toBe(28);
    expect(layout.step).toBe(8);
    expect(layout.spreads.map((s) => [s.index, s.firstStation, s.lastStation])).toEqual([
      [1, 1, 12],
      [2, 9, 20],
      [3, 17, 28],
    ]);
  });

  it("moves each spread on by (channels − overlap) × spacing = 16 m", () => {
    expect(layout.spreads.map((s) => [s.firstGeophone, s.lastGeophone])).toEqual([
      [10, 32],
      [26, 48],
      [42, 64],
    ]);
    expect(layout.spreads.map((s) => s.geometry)).toEqual([
      { spacing: 2, channels: 12, firstGeophone: 10 },
      { spacing: 2, channels: 12, firstGeophone: 26 },
      { spacing: 2, channels: 12, firstGeophone: 42 },
    ]);
    expect([layout.firstGeophone, layout.lastGeophone]).toEqual([10, 64]);
  });

  it("repeats anchored shots on every spread, placed by their anchor on that spread", () => {
    const anchored = (k: number) =>
      layout.spreads[k].shots.filter((s) => s.planShot < 3).map((s) => [s.label, s.position]);
    expect(anchored(0)).toEqual([
      ["start", 9],
      ["S2", 33],
      ["mid", 21],
    ]);
    expect(anchored(1)).toEqual([
      ["start", 25],
      ["S2", 49],
      ["mid", 37],
    ]);
    expect(anchored(2)).toEqual([
      ["start", 41],
      ["S2", 65],
      ["mid", 53],
    ]);
  });

  it("gives each fixed shot to the spread with the nearest centre, the earlier one on a tie", () => {
    const fixed = layout.spreads.map((s) =>
      s.shots.filter((x) => x.planShot >= 3).map((x) => [x.planShot, x.label, x.position]),
    );
    expect(fixed).toEqual([[[4, "S5", 29]], [[3, "fixed 30", 30]], [[5, "far", 100]]]);
  });

  it("lists each spread's shots in plan order", () => {
    expect(layout.spreads[0].shots.map((s) => s.planShot)).toEqual([0, 1, 2, 4]);
    expect(layout.spreads[1].shots.map((s) => s.planShot)).toEqual([0, 1, 2, 3]);
    expect(layout.spreads[2].shots.map((s) => s.planShot)).toEqual([0, 1, 2, 5]);
  });

  it("is one spread equal to the plan's without rollAlong", () => {
    const single = rollAlongLayout({ ...line, rollAlong: undefined });
    expect(single.stations).toBe(12);
    expect(single.spreads).toHaveLength(1);
    expect(single.spreads[0].shots.map((s) => s.position)).toEqual([9, 33, 21, 30, 29, 100]);
  });

  it("shares no station with overlap 0: spreads of 12 at 2 m start 24 m apart", () => {
    const l = rollAlongLayout({ ...line, rollAlong: { spreads: 2, overlap: 0 } });
    expect(l.stations).toBe(24);
    expect(l.spreads[1].firstGeophone).toBe(34);
    expect(l.spreads[1].firstStation).toBe(13);
  });

  it("throws when the overlap is not below the channel count", () => {
    expect(() => rollAlongLayout({ ...line, rollAlong: { spreads: 2, overlap: 12 } })).toThrow(
      RangeError,
    );
    expect(() => rollAlongLayout({ ...line, rollAlong: { spreads: 2, overlap: -1 } })).toThrow(
      RangeError,
    );
  });

  it("throws when spreads is below 1 or not whole", () => {
    expect(() => rollAlongLayout({ ...line, rollAlong: { spreads: 0, overlap: 0 } })).toThrow(
      /spreads/,
    );
    expect(() => rollAlongLayout({ ...line, rollAlong: { spreads: 2.5, overlap: 0 } })).toThrow(
      /spreads/,
    );
  });

  it("keeps station numbers continuous for any line (property)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 96 }),
        fc.integer({ min: 1, max: 40 }),
        fc.nat(),
        (channels, spreads, o) => {
          const overlap = o % channels;
          const l = rollAlongLayout({
            spacing: 1,
            channels,
            firstGeophone: 0,
            shots: [{ position: 0, anchor: { to: "start", offset: 0 } }],
            rollAlong: { spreads, overlap },
          });
          expect(l.spreads[0].firstStation).toBe(1);
          expect(l.spreads[spreads - 1].lastStation).toBe(l.stations);
          for (let k = 1; k < spreads; k++) {
            // neighbours share exactly `overlap` stations
            expect(l.spreads[k - 1].lastStation - l.spreads[k].firstStation + 1).toBe(overlap);
            expect(l.spreads[k].firstGeophone).toBe(l.spreads[k].firstStation - 1);
          }
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe("spreadOfLine and wholeLine", () => {
  it("gives spread 2 alone: its first geophone and only its shots, without rollAlong", () => {
    const two = spreadOfLine(line, 2);
    expect(two.firstGeophone).toBe(26);
    expect(two.channels).toBe(12);
    expect("rollAlong" in two).toBe(false);
    expect(two.shots.map((s) => [s.label, s.position])).toEqual([
      ["start", 25],
      [undefined, 49],
      ["mid", 37],
      ["fixed 30", 30],
    ]);
    // Parsed as a plan spread of its own, the anchors put the shots at the same places.
    const parsed = planSchema.shape.spread.parse(two);
    expect(parsed.shots.map((s) => s.position)).toEqual([25, 49, 37, 30]);
  });

  it("throws for a spread the line does not have", () => {
    expect(() => spreadOfLine(line, 4)).toThrow(/no spread 4/);
    expect(() => spreadOfLine(line, 0)).toThrow(RangeError);
  });

  it("spans the whole line: 28 stations from 10 m and every shot of every spread", () => {
    const whole = wholeLine(line);
    expect(whole.channels).toBe(28);
    expect(whole.firstGeophone).toBe(10);
    expect(whole.shots).toHaveLength(4 + 4 + 4);
    expect(Math.max(...whole.shots.map((s) => s.position))).toBe(100);
    expect(whole.shots.every((s) => s.anchor === undefined)).toBe(true);
    expect(wholeLine({ ...line, rollAlong: undefined }).channels).toBe(12);
  });
});

describe("lineStations and rollAlongFor", () => {
  it("counts N + (spreads − 1)·(N − overlap) stations", () => {
    expect(lineStations(24, { spreads: 4, overlap: 12 })).toBe(24 + 3 * 12);
    expect(lineStations(24, undefined)).toBe(24);
  });

  it("needs 7 spreads of 24 sharing 12 for 96 stations: 24 + 6 × 12 = 96", () => {
    expect(rollAlongFor(96, 24, 12)).toEqual({ spreads: 7, overlap: 12 });
  });

  it("needs 5 spreads of 24 without overlap for 100 stations (4 × 24 = 96 is short)", () => {
    expect(rollAlongFor(100, 24, 0)).toEqual({ spreads: 5, overlap: 0 });
  });

  it("is undefined when one spread records the whole line", () => {
    expect(rollAlongFor(24, 24, 0)).toBeUndefined();
    expect(rollAlongFor(12, 48, 6)).toBeUndefined();
  });

  it("throws when the overlap is not below the recorder's channels", () => {
    expect(() => rollAlongFor(100, 24, 24)).toThrow(RangeError);
  });

  it("gives the fewest spreads that cover the line (property)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2000 }),
        fc.integer({ min: 1, max: 200 }),
        fc.nat(),
        (stations, recorder, o) => {
          const overlap = o % recorder;
          const roll = rollAlongFor(stations, recorder, overlap);
          if (!roll) {
            expect(stations).toBeLessThanOrEqual(recorder);
            return;
          }
          expect(lineStations(recorder, roll)).toBeGreaterThanOrEqual(stations);
          const fewer = { spreads: roll.spreads - 1, overlap };
          expect(lineStations(recorder, fewer)).toBeLessThan(stations);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("plan format: spread.rollAlong", () => {
  const plan = (rollAlong: unknown) => ({
    models: [{ name: "two layers", layers: [{ velocity: 500, thickness: 5 }, { velocity: 2500 }] }],
    spread: {
      spacing: 2,
      channels: 12,
      firstGeophone: 0,
      shots: [{ position: -1, anchor: { to: "start", offset: -1 } }],
      rollAlong,
    },
  });
  const issues = (rollAlong: unknown) => {
    const r = parsePlan(plan(rollAlong));
    return r.ok ? [] : r.issues;
  };

  it("accepts 2 spreads sharing 11 of 12 channels", () => {
    const r = parsePlan(plan({ spreads: 2, overlap: 11 }));
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.plan.spread.rollAlong).toEqual({ spreads: 2, overlap: 11 });
  });

  it("names spread.rollAlong.overlap when the overlap is not below the channels", () => {
    expect(issues({ spreads: 2, overlap: 12 })).toEqual([
      "spread.rollAlong.overlap: roll-along overlap must be below the 12 channels of a spread",
    ]);
  });

  it("refuses fewer than 2 spreads and more than 40", () => {
    expect(issues({ spreads: 1, overlap: 0 })).toEqual([
      "spread.rollAlong.spreads: roll-along needs at least 2 spreads",
    ]);
    expect(issues({ spreads: 41, overlap: 0 })).toEqual([
      "spread.rollAlong.spreads: roll-along has at most 40 spreads",
    ]);
  });

  it("refuses non-integer spreads and overlap, and a negative overlap", () => {
    expect(issues({ spreads: 2.5, overlap: 0 })).toEqual([
      "spread.rollAlong.spreads: roll-along spreads must be a whole number",
    ]);
    expect(issues({ spreads: 3, overlap: 1.5 })).toEqual([
      "spread.rollAlong.overlap: roll-along overlap must be a whole number of geophones",
    ]);
    expect(issues({ spreads: 3, overlap: -1 })).toEqual([
      "spread.rollAlong.overlap: roll-along overlap must be at least 0",
    ]);
  });

  it("refuses a missing field, a text and an unknown field, naming each", () => {
    expect(issues({ spreads: 3 })[0]).toMatch(/^spread\.rollAlong\.overlap: /);
    expect(issues({ spreads: "3", overlap: 0 })).toEqual([
      "spread.rollAlong.spreads: roll-along spreads must be a number",
    ]);
    const r = planSchema.safeParse(plan({ spreads: 3, overlap: 0, step: 2 }));
    expect(r.success).toBe(false);
    if (!r.success)
      expect(describePlanIssues(r.error)).toEqual(["spread.rollAlong.step: unknown field"]);
  });

  it("checks the ground over the whole line, not only the first spread", () => {
    // The base of layer 1 rises 1 in tan(2°) from 5 m at 0 m and meets the surface at
    // 5 / tan 2° ≈ 143 m: inside the line of 4 spreads (0…190 m), beyond spread 1 (0…22 m).
    const rising = {
      ...plan({ spreads: 4, overlap: 0 }),
      models: [
        { name: "rising", layers: [{ velocity: 500, thickness: 5, dip: -2 }, { velocity: 2500 }] },
      ],
    };
    const alone = parsePlan({ ...rising, spread: { ...rising.spread, rollAlong: undefined } });
    expect(alone.ok).toBe(true);
    const r = parsePlan({
      ...rising,
      spread: { ...rising.spread, channels: 24, rollAlong: { spreads: 4, overlap: 0 } },
    });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]).toMatch(/^models\[0\]\.layers\[0\]\.dip: .*to 190 m/);
  });
});

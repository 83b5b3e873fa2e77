import { describe, expect, it } from "vitest";
import { planSchema } from "./plan-schema";
import {
  anchorAt,
  anchorPoint,
  defaultAnchor,
  resolveShotPosition,
  resolveShotPositions,
} from "./shot-anchors";

// Geometry by hand (common practice): N geophones at Δx from x0 end at x0 + (N − 1)·Δx.
const g24 = { spacing: 3, channels: 24, firstGeophone: 0 }; // last geophone 69 m
const g48 = { spacing: 3, channels: 48, firstGeophone: 0 }; // last geophone 141 m

describe("anchorPoint", () => {
  it("puts start at the first geophone, end at the last and centre midway", () => {
    expect(anchorPoint("start", g24)).toBe(0);
    expect(anchorPoint("end", g24)).toBe(69);
    expect(anchorPoint("centre", g24)).toBe(34.5);
    expect(anchorPoint("end", { spacing: 8, channels: 12, firstGeophone: 10 })).toBe(98);
  });
});

describe("resolveShotPositions", () => {
  it("moves an end shot beyond the last geophone when 24 channels become 48 (issue 14)", () => {
    const shots = [
      { position: -1.5, anchor: { to: "start" as const, offset: -1.5 } },
      { position: 70.5, anchor: { to: "end" as const, offset: 1.5 } },
    ];
    expect(Array.from(resolveShotPositions(shots, g48))).toEqual([-1.5, 142.5]);
  });

  it("keeps a centre shot at the centre for 8 m × 12 channels", () => {
    const shot = { position: 34.5, anchor: { to: "centre" as const, offset: 0 } };
    // 12 geophones at 8 m span 88 m; the centre is 44 m from the first geophone.
    expect(resolveShotPosition(shot, { spacing: 8, channels: 12, firstGeophone: 0 })).toBe(44);
  });

  it("leaves a fixed shot where it is whatever the spread does", () => {
    expect(Array.from(resolveShotPositions([{ position: 26.4 }], g48))).toEqual([26.4]);
  });

  it("does not change its input", () => {
    const shots = [{ position: 70.5, anchor: { to: "end" as const, offset: 1.5 } }];
    resolveShotPositions(shots, g48);
    expect(shots[0].position).toBe(70.5);
  });
});

describe("defaultAnchor", () => {
  it("anchors end, off-end and centre shots and leaves interior shots fixed", () => {
    expect(defaultAnchor(-1.5, g24)).toEqual({ to: "start", offset: -1.5 });
    expect(defaultAnchor(0, g24)).toEqual({ to: "start", offset: 0 });
    expect(defaultAnchor(69, g24)).toEqual({ to: "end", offset: 0 });
    expect(defaultAnchor(80, g24)).toEqual({ to: "end", offset: 11 });
    expect(defaultAnchor(34.5, g24)).toEqual({ to: "centre", offset: 0 });
    expect(defaultAnchor(20, g24)).toBeUndefined();
  });

  it("round-trips: the anchor it gives resolves back to the same position", () => {
    for (const x of [-12.25, -1, 0, 34.5, 69, 70.5, 100]) {
      const a = anchorAt(x, "end", g24);
      expect(resolveShotPosition({ position: 0, anchor: a }, g24)).toBeCloseTo(x, 9);
    }
  });
});

describe("plan schema with anchors", () => {
  const model = { name: "m", layers: [{ velocity: 500, thickness: 5 }, { velocity: 2000 }] };

  it("reads an old plan without anchors and keeps its positions", () => {
    const plan = planSchema.parse({
      models: [model],
      spread: { spacing: 3, channels: 48, firstGeophone: 0, shots: [{ position: 70.5 }] },
    });
    expect(plan.spread.shots[0].position).toBe(70.5);
    expect(plan.spread.shots[0].anchor).toBeUndefined();
  });

  it("recomputes an anchored shot's stored position from the spread", () => {
    const plan = planSchema.parse({
      models: [model],
      spread: {
        spacing: 3,
        channels: 48,
        firstGeophone: 0,
        shots: [{ position: 70.5, anchor: { to: "end", offset: 1.5 } }],
      },
    });
    expect(plan.spread.shots[0].position).toBe(142.5);
  });

  it("names the field of a bad anchor", () => {
    const r = planSchema.safeParse({
      models: [model],
      spread: {
        spacing: 3,
        channels: 4,
        firstGeophone: 0,
        shots: [{ position: 0, anchor: { to: "middle", offset: 0 } }],
      },
    });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0].path).toEqual(["spread", "shots", 0, "anchor", "to"]);
  });
});

import { describe, expect, it } from "vitest";
import { analyzePlan } from "@engine";
import { applyRecommendation, practicalSpacing } from "../apply-recommendation";
import { threeLayerPlan } from "../../__tests__/fixtures";

describe("applying a recommendation", () => {
  it("rounds a spacing down to a practical value, never up", () => {
    for (const v of [0.37, 1.33, 1.99, 2.01, 3.49, 4.99, 7.7, 19.9, 23.4, 130]) {
      const p = practicalSpacing(v);
      expect(p).toBeLessThanOrEqual(v);
      expect(p).toBeGreaterThan(v * 0.7);
    }
    expect(practicalSpacing(3.49)).toBe(3);
    expect(practicalSpacing(1.33)).toBe(1.25);
    expect(practicalSpacing(0.1)).toBe(0.1);
  });

  it("keeps the spacing within the engine's largest spacing and the channels reaching its length", () => {
    const plan = threeLayerPlan();
    plan.models[0].layers[1].thickness = 3; // thinner: a shorter segment, a finer spacing
    const rec = analyzePlan(plan).recommendation;
    expect(rec.maxSpacing).not.toBeNull();
    const applied = applyRecommendation(plan.spread, rec, "metric");
    expect(applied.spacing).toBeLessThanOrEqual(rec.maxSpacing!);
    expect((applied.channels - 1) * applied.spacing).toBeGreaterThanOrEqual(
      rec.spreadLength - applied.spacing,
    );
    expect(applied.channels).toBeGreaterThanOrEqual(plan.spread.channels);
  });

  it("moves anchored end shots with the spread ends and leaves fixed shots (shot-anchors.ts)", () => {
    const plan = threeLayerPlan();
    plan.spread.shots = [
      { position: -2.5, anchor: { to: "start", offset: -2.5 } },
      { position: 117.5, anchor: { to: "end", offset: 2.5 } },
      { position: 50 },
    ];
    const applied = applyRecommendation(
      plan.spread,
      { maxSpacing: 2.2, spreadLength: 40 },
      "metric",
    );
    const last = plan.spread.firstGeophone + (applied.channels - 1) * applied.spacing;
    expect(applied.spacing).toBe(2);
    expect(applied.shots[0]).toBeCloseTo(-2.5, 9);
    expect(applied.shots[1]).toBeCloseTo(last + 2.5, 9);
    expect(applied.shots[2]).toBe(50);
  });

  it("rounds in feet for an imperial user", () => {
    const plan = threeLayerPlan();
    const applied = applyRecommendation(
      plan.spread,
      { maxSpacing: 3, spreadLength: 50 },
      "imperial",
    );
    // 3 m = 9.84 ft → 9 ft = 2.7432 m
    expect(applied.spacing).toBeCloseTo(9 * 0.3048, 12);
  });
});

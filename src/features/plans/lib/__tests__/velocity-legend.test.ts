import { describe, expect, it } from "vitest";
import { layeredModel } from "../engine";
import { buildSection } from "../section-chart";
import { velocityLegendTicks } from "../velocity-legend";
import { threeLayerPlan } from "../../__tests__/fixtures";

const FT = 0.3048; // m per international foot (exact by definition)

describe("velocity colour bar ticks", () => {
  it("labels both ends of the bar with the slowest and fastest velocities drawn", () => {
    const ticks = velocityLegendTicks(500, 3300, "metric");
    expect(ticks[0]).toEqual({ at: 0, label: "500" });
    expect(ticks[ticks.length - 1]).toEqual({ at: 1, label: "3300" });
  });

  it("places round values between the ends on the bar's log scale, kept apart", () => {
    const ticks = velocityLegendTicks(500, 3300, "metric");
    const inner = ticks.slice(1, -1);
    expect(inner.map((t) => t.label)).toContain("1000");
    const thousand = inner.find((t) => t.label === "1000")!;
    // log scale: 1000 sits log(1000/500) / log(3300/500) along the bar
    expect(thousand.at).toBeCloseTo(Math.log(2) / Math.log(6.6), 9);
    for (let i = 1; i < ticks.length; i++)
      expect(ticks[i].at - ticks[i - 1].at).toBeGreaterThanOrEqual(0.16);
  });

  it("writes the ends in ft/s for imperial units", () => {
    const ticks = velocityLegendTicks(500, 3300, "imperial");
    expect(ticks[0].label).toBe(String(Math.round(500 / FT)));
    expect(ticks[ticks.length - 1].label).toBe(String(Math.round(3300 / FT)));
  });

  it("gives one middle tick when every layer has the same velocity", () => {
    expect(velocityLegendTicks(1800, 1800, "metric")).toEqual([{ at: 0.5, label: "1800" }]);
  });

  it("throws for a velocity that is not positive", () => {
    expect(() => velocityLegendTicks(0, 3300, "metric")).toThrow(RangeError);
  });
});

describe("the Section's colour bar", () => {
  it("spans the half-space: its last tick is the half-space's 3300 m/s", () => {
    const plan = threeLayerPlan();
    plan.models[0].layers = [
      { name: "sandy colluvium", velocity: 500, thickness: 2 },
      { name: "weathered sandstone", velocity: 2100, thickness: 4 },
      { name: "sandstone", velocity: 3300 },
    ];
    const s = buildSection({
      model: layeredModel(plan.models[0]),
      spread: plan.spread,
      shotIndex: 0,
      ray: null,
      geophone: null,
      width: 700,
      units: "metric",
      exaggeration: "auto",
    });
    const last = s.legend.ticks[s.legend.ticks.length - 1];
    expect(Number(last.label)).toBeGreaterThanOrEqual(3300);
    expect(last.at).toBe(1);
    expect(s.legend.ticks[0]).toEqual({ at: 0, label: "500" });
    expect(s.legend.unit).toBe("m/s");
  });
});

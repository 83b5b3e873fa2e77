import { describe, expect, it } from "vitest";
import { layeredModel } from "../engine";
import { buildSection } from "../section-chart";
import { velocityLegendTicks } from "../velocity-legend";
import { threeLayerPlan } from "../../__tests__/fixtures";

describe("velocity colour bar ticks", () => {
  it("labels both ends of the bar with the slowest and fastest velocities drawn", () => {
    const ticks = velocityLegendTicks(500, 3300, "metric");
    expect(ticks[0]).toEqual({ at: 0, label: "500" });
    expect(ticks[ticks.length - 1]).toEqual({ at: 1, label: "3,300" });
  });

  it("places round values between the ends on the bar's log scale, kept apart", () => {
    const ticks = velocityLegendTicks(500, 3300, "metric");
    const inner = ticks.slice(1, -1);
    expect(inner.map((t) => t.label)).toContain("1,000");
    const thousand = inner.find((t) => t.label === "1,000")!;
    // log scale: 1000 sits log(1000/500) / log(3300/500) along the bar
    expect(thousand.at).toBeCloseTo(Math.log(2) / Math.log(6.6), 9);
    for (let i = 1; i < ticks.length; i++)
      expect(ticks[i].at - ticks[i - 1].at).toBeGreaterThanOrEqual(0.16);
  });

  it("writes the ends in ft/s for imperial units", () => {
    const ticks = velocityLegendTicks(500, 3300, "imperial");
    // 500 / 0.3048 = 1640.4 and 3300 / 0.3048 = 10826.8 ft/s (by hand), grouped as the
    // layers' labels write them (issue 14 QA: the bar read "10827" beside "10,827 ft/s").
    expect(ticks[0].label).toBe("1,640");
    expect(ticks[ticks.length - 1].label).toBe("10,827");
  });

  it("gives one middle tick when every layer has the same velocity", () => {
    expect(velocityLegendTicks(1800, 1800, "metric")).toEqual([{ at: 0.5, label: "1,800" }]);
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
    expect(Number(last.label.replace(/,/g, ""))).toBeGreaterThanOrEqual(3300);
    expect(last.at).toBe(1);
    expect(s.legend.ticks[0]).toEqual({ at: 0, label: "500" });
    expect(s.legend.unit).toBe("m/s");
  });
});

import { describe, expect, it } from "vitest";
import { analyzePlan, computeArrivals, sampleCurves } from "@engine";
import { buildOverlay, compareRows, modelScenarios, type Scenario } from "../compare";
import { blindLayerPlan, threeLayerPlan } from "../../__tests__/fixtures";
import type { Plan } from "../engine";

function run(scenarios: Scenario[]) {
  return scenarios.map((s) => {
    const model = s.plan.models[0];
    return {
      analysis: analyzePlan(s.plan),
      curves: sampleCurves(model, s.plan.spread.shots[0].position, 2.5, 117.5, 200),
      arrivals: computeArrivals(model, s.plan.spread, 0),
    };
  });
}

const twoModels = (): Plan => {
  const plan = threeLayerPlan();
  return { ...plan, models: [plan.models[0], blindLayerPlan().models[0]] };
};

describe("Side by side", () => {
  it("marks the cells that differ from the first scenario, and only those", () => {
    const plan = twoModels();
    const scenarios = modelScenarios(plan, [0, 1]);
    const rows = compareRows(scenarios, run(scenarios), "metric");
    const byKey = Object.fromEntries(rows.map((r) => [r.key, r]));
    expect(byKey.worst.cells.map((c) => c.status)).toEqual(["resolved", "blind"]);
    expect(byKey.worst.cells.map((c) => c.differs)).toEqual([false, true]);
    expect(byKey["layer-2"].cells[1].differs).toBe(true);
    expect(byKey.spread.cells.map((c) => c.differs)).toEqual([false, false]);
  });

  it("marks nothing when two scenarios are the same ground", () => {
    const plan = threeLayerPlan();
    const same = { ...plan, models: [plan.models[0], { ...plan.models[0], name: "copy" }] };
    const scenarios = modelScenarios(same, [0, 1]);
    const rows = compareRows(scenarios, run(scenarios), "metric");
    expect(rows.flatMap((r) => r.cells).some((c) => c.differs)).toBe(false);
  });

  it("overlays one first-arrival line per scenario on shared axes", () => {
    const scenarios = modelScenarios(twoModels(), [0, 1]);
    const overlay = buildOverlay(scenarios, run(scenarios), 600, 300, "metric");
    expect(overlay.lines).toHaveLength(2);
    expect(new Set(overlay.lines.map((l) => l.colour)).size).toBe(2);
    for (const l of overlay.lines) {
      expect(l.path).toMatch(/^M/);
      expect(l.path).not.toContain("NaN");
      expect(l.dots).toHaveLength(24);
    }
  });

  it("keeps the offset ticks at least 50 px apart on a phone-width chart (issue 14 QA)", () => {
    const scenarios = modelScenarios(twoModels(), [0, 1]);
    const overlay = buildOverlay(scenarios, run(scenarios), 316, 280, "imperial");
    const px = overlay.xTicks.map((t) => t.px);
    expect(px.length).toBeGreaterThanOrEqual(3);
    for (let i = 1; i < px.length; i++) expect(px[i] - px[i - 1]).toBeGreaterThanOrEqual(50);
  });
});

import { describe, expect, it } from "vitest";
import { analyzePlan, computeArrivals, sampleCurves } from "@engine";
import { buildArrivalsChart } from "../arrivals-chart";
import { layeredModel } from "../engine";
import { buildSection } from "../section-chart";
import { wholeDomain } from "../../components/designer/arrivals-panel";
import { threeLayerPlan } from "../../__tests__/fixtures";

// Issue 14 QA at 390 px (a chart about 316 px wide): the Arrivals x ticks ran together
// ("100120140160…"), and the Section's colour-bar labels and scale note overlapped.
const PHONE = 316;
const gaps = (px: number[]) => px.slice(1).map((p, i) => p - px[i]);

function section(width: number, units: "metric" | "imperial" = "imperial") {
  const plan = threeLayerPlan();
  return buildSection({
    model: layeredModel(plan.models[0]),
    spread: plan.spread,
    shotIndex: 0,
    ray: null,
    geophone: null,
    width,
    units,
    exaggeration: "auto",
  });
}

describe("charts at phone width", () => {
  it("keeps the Arrivals offset ticks at least 50 px apart on a phone", () => {
    const plan = threeLayerPlan();
    const analysis = analyzePlan(plan);
    const [from, to] = wholeDomain(plan, 0);
    const chart = buildArrivalsChart({
      curves: sampleCurves(plan.models[0], plan.spread.shots[0].position, from, to, 200),
      arrivals: computeArrivals(plan.models[0], plan.spread, 0),
      analysis: analysis.models[0],
      layerNames: [],
      width: PHONE,
      height: 320,
      domain: [from, to],
      showReflections: false,
      minGeophones: 2,
      units: "imperial",
    });
    expect(chart.xTicks.length).toBeGreaterThanOrEqual(3);
    for (const g of gaps(chart.xTicks.map((t) => t.px))) expect(g).toBeGreaterThanOrEqual(50);
  });

  it("keeps the Section's ticks and colour-bar labels apart and shortens its notes on a phone", () => {
    const s = section(PHONE);
    for (const g of gaps(s.xTicks.map((t) => t.px))) expect(g).toBeGreaterThanOrEqual(50);
    // Bar labels such as "10,827" are about 40 px wide at 9 px: 44 px between their places.
    for (const g of gaps(s.legend.ticks.map((t) => t.at * s.legend.width)))
      expect(g).toBeGreaterThanOrEqual(44);
    expect(s.legend.label).toBe("ft/s");
    expect(s.scaleNote).toMatch(/^(vertical ×\d+|true scale)$/);
  });

  it("keeps the desktop wording on a wide chart", () => {
    const s = section(720, "metric");
    expect(s.legend.label).toBe("velocity (m/s)");
    expect(s.scaleNote).toMatch(
      /^(vertical exaggeration ×\d+|true scale \(no vertical exaggeration\))$/,
    );
  });
});

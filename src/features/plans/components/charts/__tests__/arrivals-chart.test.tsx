import { describe, expect, it } from "vitest";
import { render, screen, within } from "@testing-library/react";
import { analyzePlan, computeArrivals, sampleCurves } from "@engine";
import type { Plan } from "../../../lib/engine";
import { buildArrivalsChart } from "../../../lib/arrivals-chart";
import { wholeDomain } from "../../designer/arrivals-panel";
import { ArrivalsChart } from "../arrivals-chart";
import { blindLayerPlan, inversionPlan, threeLayerPlan } from "../../../__tests__/fixtures";

/** Everything the chart needs for one shot, straight from the engine. */
function engineData(plan: Plan, shot = 0) {
  const analysis = analyzePlan(plan);
  const model = plan.models[0];
  const [from, to] = wholeDomain(plan, shot);
  const curves = sampleCurves(model, plan.spread.shots[shot].position, from, to, 400);
  const arrivals = computeArrivals(model, plan.spread, shot);
  return { analysis, data: { curves, arrivals } };
}

function renderChart(plan: Plan, shot = 0) {
  const { analysis, data } = engineData(plan, shot);
  render(
    <ArrivalsChart
      data={data}
      analysis={analysis.models[0]}
      layerNames={plan.models[0].layers.map((l) => l.name)}
      minGeophones={plan.criteria.minGeophones}
      units="metric"
      width={720}
      showReflections={false}
      title="Arrivals under test"
    />,
  );
  return analysis;
}

describe("ArrivalsChart", () => {
  it("writes its helper sentence in the text face, not monospace (issue 14 nit)", () => {
    renderChart(threeLayerPlan());
    const readout = screen.getByTestId("arrivals-readout");
    expect(readout).toHaveTextContent("Point at the chart to read a geophone's first break.");
    expect(readout.className).not.toContain("font-mono");
  });

  it("flags a blind refractor in brick red with the reason", () => {
    const analysis = renderChart(blindLayerPlan());
    // Precondition from the engine: the thin lens is blind (design.md: a thin layer's head
    // wave that is never first).
    expect(analysis.models[0].refractors[0].status).toBe("blind");
    const flags = screen.getByRole("list", { name: "Flagged arrivals on this shot" });
    const flag = within(flags).getByText(/Layer 2 \(silty lens\)/);
    expect(flag).toHaveTextContent("blind");
    expect(flag).toHaveTextContent("never the first arrival");
    // Issue 14 nit: the verdict word is said once, not "blind: … — a blind layer".
    expect(flag.textContent?.match(/blind/g)).toHaveLength(1);
    expect(flag.closest("li")?.className).toContain("text-brick");
  });

  it("flags a velocity inversion with the faster layer above named", () => {
    const analysis = renderChart(inversionPlan());
    expect(analysis.models[0].refractors[0].status).toBe("inverted");
    const flag = screen.getByText(/Layer 2 \(loose sand\)/);
    expect(flag).toHaveTextContent("no head wave");
    expect(flag).toHaveTextContent("layer 1 (1,500 m/s)");
  });

  it("labels each segment with the engine's geophone count for that shot and side", () => {
    for (const shot of [0, 1]) {
      const plan = threeLayerPlan();
      const { analysis, data } = engineData(plan, shot);
      const chart = buildArrivalsChart({
        curves: data.curves,
        arrivals: data.arrivals,
        analysis: analysis.models[0],
        layerNames: [],
        width: 720,
        height: 360,
        showReflections: false,
        minGeophones: 2,
        units: "metric",
      });
      const model = analysis.models[0];
      const expected = [model.direct, ...model.refractors].flatMap((arrival) =>
        arrival.branches
          .filter((b) => b.shot === shot && b.segment !== null && b.geophones > 0)
          .map((b) => ({
            layer: "layer" in arrival ? arrival.layer : 1,
            side: b.side,
            count: b.geophones,
          })),
      );
      expect(expected.length).toBeGreaterThan(0);
      expect(
        chart.segmentLabels.map((l) => ({ layer: l.layer, side: l.side, count: l.count })),
      ).toEqual(expected);
      for (const label of chart.segmentLabels) {
        expect(label.text).toContain(`${label.count} geophone`);
        expect(Number.isFinite(label.x) && Number.isFinite(label.y)).toBe(true);
        // About 120 px of text stays inside the plot on the side its anchor leaves it.
        if (label.anchor === "end") expect(label.x - 120).toBeGreaterThanOrEqual(chart.margin.left);
        else expect(label.x + 120).toBeLessThanOrEqual(chart.width - chart.margin.right);
      }
    }
  });

  it("draws one mark per geophone at the first-break time the engine computed", () => {
    const plan = threeLayerPlan();
    const { analysis, data } = engineData(plan);
    const chart = buildArrivalsChart({
      curves: data.curves,
      arrivals: data.arrivals,
      analysis: analysis.models[0],
      layerNames: [],
      width: 720,
      height: 360,
      showReflections: false,
      minGeophones: 2,
      units: "metric",
    });
    expect(chart.geophones).toHaveLength(plan.spread.channels);
    chart.geophones.forEach((g, i) => {
      expect(g.time).toBe(data.arrivals.geophones[i].first.time);
      expect(g.y).toBeCloseTo(chart.y(data.arrivals.geophones[i].first.time), 9);
    });
    expect(chart.firstPath).toMatch(/^M/);
    expect(chart.flags).toEqual([]);
  });

  it("shows no NaN anywhere in the drawing", () => {
    renderChart(blindLayerPlan());
    const svg = screen.getByRole("img", { name: "Arrivals under test" });
    expect(svg.outerHTML).not.toContain("NaN");
  });
});

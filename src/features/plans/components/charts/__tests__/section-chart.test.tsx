import { describe, expect, it } from "vitest";
import { render, screen } from "@testing-library/react";
import { layeredModel } from "../../../lib/engine";
import { SectionChart } from "../section-chart";
import { threeLayerPlan } from "../../../__tests__/fixtures";

function renderChart(units: "metric" | "imperial") {
  const plan = threeLayerPlan();
  plan.models[0].layers = [
    { name: "sandy colluvium", velocity: 500, thickness: 2 },
    { name: "weathered sandstone", velocity: 2100, thickness: 4 },
    { name: "sandstone", velocity: 3300 },
  ];
  render(
    <SectionChart
      title="Section under test"
      input={{
        model: layeredModel(plan.models[0]),
        spread: plan.spread,
        shotIndex: 0,
        ray: null,
        geophone: null,
        width: 720,
        units,
        exaggeration: "auto",
      }}
    />,
  );
  const legend = screen.getByLabelText("Velocity legend");
  return [...legend.querySelectorAll("text")].map((t) => t.textContent);
}

describe("SectionChart velocity legend", () => {
  it("writes the half-space's 3300 m/s at the fast end of the bar", () => {
    const texts = renderChart("metric");
    expect(texts).toContain("velocity (m/s)");
    expect(texts).toContain("500");
    expect(texts).toContain("3,300");
  });

  it("writes the bar's ends in ft/s for imperial units", () => {
    const texts = renderChart("imperial");
    expect(texts).toContain("velocity (ft/s)");
    // 500 and 3300 m/s over 0.3048 m/ft (exact by definition)
    expect(texts).toContain("1,640");
    expect(texts).toContain("10,827");
  });
});

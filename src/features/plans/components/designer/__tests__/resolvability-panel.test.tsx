import { render, screen, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { analyzePlan } from "@engine";
import { ResolvabilityPanel } from "../resolvability-panel";
import { blindLayerPlan } from "../../../__tests__/fixtures";

function renderPanel(units: "metric" | "imperial") {
  const plan = blindLayerPlan();
  const analysis = analyzePlan(plan);
  render(
    <ResolvabilityPanel
      plan={plan}
      analysis={analysis}
      model={analysis.models[0]}
      modelIndex={0}
      units={units}
      readOnly
      current
      onApply={() => {}}
    />,
  );
}

describe("ResolvabilityPanel", () => {
  it("gives the hidden-layer statement and the recommendation in feet for an imperial user", () => {
    renderPanel("imperial");
    const hidden = screen.getByRole("list", { name: "Layers no spread can reveal" });
    // 1200 m/s = 3937 ft/s (1 ft = 0.3048 m exactly)
    expect(within(hidden).getByText(/1200 m\/s \(3937 ft\/s\)/)).toBeInTheDocument();
    const rec = screen.getByRole("region", { name: "Recommendation" });
    expect(rec.textContent).toMatch(/spacing at most [\d.]+ m \([\d.]+ ft\)/);
    expect(rec.textContent).toMatch(/reaching [\d.]+ m \([\d.]+ ft\) offset/);
  });

  it("keeps the engine's metric wording for a metric user", () => {
    renderPanel("metric");
    const rec = screen.getByRole("region", { name: "Recommendation" });
    expect(rec.textContent).toMatch(/spacing at most [\d.]+ m and/);
    expect(rec.textContent).not.toMatch(/ft/);
  });
});

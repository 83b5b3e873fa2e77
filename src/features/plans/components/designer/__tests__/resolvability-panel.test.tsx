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
  it("gives the hidden-layer statement and the recommendation in feet only for an imperial user", () => {
    renderPanel("imperial");
    const hidden = screen.getByRole("list", { name: "Layers no spread can reveal" });
    // 1200 m/s = 3937 ft/s (1 ft = 0.3048 m exactly); issue 14: no mixed "m (ft)".
    expect(within(hidden).getByText(/3,937 ft\/s/)).toBeInTheDocument();
    expect(hidden.textContent).not.toMatch(/\d m\/s|\d m\b/);
    const rec = screen.getByRole("region", { name: "Recommendation" });
    const sentence = rec.querySelector("p")!.textContent!;
    expect(sentence).toMatch(
      /spacing at most [\d.]+ ft and shot branches reaching [\d.,]+ ft offset/,
    );
    expect(sentence).not.toMatch(/\d m\b/);
  });

  it("keeps the engine's metric wording for a metric user", () => {
    renderPanel("metric");
    const rec = screen.getByRole("region", { name: "Recommendation" });
    expect(rec.textContent).toMatch(/spacing at most [\d.]+ m and/);
    expect(rec.textContent).not.toMatch(/ft/);
  });
});

import { describe, expect, it } from "vitest";
import { runSweep } from "@engine";
import { planAtCell, sweepSpec } from "../sweep-plan";
import { buildHeatmap } from "../sweep-heatmap";
import { threeLayerPlan } from "../../__tests__/fixtures";

describe("design sweep helpers", () => {
  const plan = threeLayerPlan();
  const spec = sweepSpec({
    modelIndex: 0,
    axis: "spacing",
    axisRange: [1, 8],
    axisSteps: 8,
    layer: 2,
    kind: "thickness",
    range: [1, 8],
    steps: 8,
  });
  const result = runSweep(plan, spec);

  it("turns a cell into a plan whose layer and spacing take the cell's values", () => {
    const cell = planAtCell(plan, 0, result, 3, 5);
    expect(cell.models[0].layers[1].thickness).toBe(result.parameter.values[3]);
    expect(cell.spread.spacing).toBe(result.axis.values[5]);
    expect(cell.models[0].layers[0]).toEqual(plan.models[0].layers[0]);
    expect(cell.spread.shots[0].position).toBeCloseTo(-2.5, 9);
  });

  it("colours each heatmap cell by the engine's verdict and places the plan's marker", () => {
    const map = buildHeatmap(result, 600, "metric", { axis: 5, parameter: 6 });
    expect(map.cells).toHaveLength(64);
    const states = map.cells.map((c) => c.state);
    expect(
      states.every((s) => ["resolved", "under-sampled", "blind", "inverted"].includes(s)),
    ).toBe(true);
    map.cells.forEach((c) => {
      expect(c.readout).not.toContain("NaN");
      expect(c.readout).toContain(c.state);
    });
    expect(map.marker).not.toBeNull();
    const outside = buildHeatmap(result, 600, "metric", { axis: 50, parameter: 6 });
    expect(outside.marker).toBeNull();
  });

  it("titles both axes with their unit, as the x axis already was (issue 14 QA: 'Layer 2 thickness' had none)", () => {
    expect(buildHeatmap(result, 600, "imperial").yLabel).toBe("Layer 2 thickness (ft)");
    expect(buildHeatmap(result, 600, "metric").xLabel).toBe("Geophone spacing (m)");
  });
});

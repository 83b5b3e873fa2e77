import { describe, expect, it } from "vitest";
import {
  exactValues,
  formToPlanInput,
  parsePlanForm,
  planFormSchema,
  planToForm,
} from "../plan-form";
import { threeLayerPlan } from "../../__tests__/fixtures";

describe("plan form ↔ plan document", () => {
  it("round-trips a stored plan through the form exactly in both unit systems", () => {
    for (const units of ["metric", "imperial"] as const) {
      const plan = threeLayerPlan();
      plan.models[0].layers[0].thickness = 2.123456789; // more digits than a box shows
      const back = parsePlanForm(
        planToForm(plan, units),
        units,
        plan.name,
        exactValues(plan, units),
      );
      expect(back).toEqual(plan);
    }
  });

  it("without the stored values, a shown velocity is within half a ft/s (the box's precision)", () => {
    const plan = threeLayerPlan();
    const back = parsePlanForm(planToForm(plan, "imperial"), "imperial", plan.name)!;
    back.models[0].layers.forEach((layer, i) => {
      const stored = plan.models[0].layers[i].velocity;
      // 1 ft = 0.3048 m exactly; the box shows whole ft/s, so the error is at most 0.5 ft/s.
      expect(Math.abs(layer.velocity - stored)).toBeLessThanOrEqual(0.5 * 0.3048 + 1e-9);
    });
  });

  it("types feet and stores metres", () => {
    const form = planToForm(threeLayerPlan(), "imperial");
    form.models[0].layers[0].thickness = "10";
    form.spread.spacing = "10";
    const plan = parsePlanForm(form, "imperial", "x")!;
    expect(plan.models[0].layers[0].thickness).toBeCloseTo(3.048, 12);
    expect(plan.spread.spacing).toBeCloseTo(3.048, 12);
  });

  it("drops the half-space's thickness and dip and leaves empty optional boxes out", () => {
    const form = planToForm(threeLayerPlan(), "metric");
    form.models[0].layers[2].thickness = "99";
    form.models[0].layers[2].dip = "5";
    const input = formToPlanInput(form, "metric", "x") as {
      models: Array<{ layers: Array<Record<string, unknown>> }>;
    };
    expect(input.models[0].layers[2]).toEqual({ name: "mudstone", velocity: 3000 });
    expect(input.models[0].layers[0]).not.toHaveProperty("dip");
    expect(input.models[0].layers[0]).not.toHaveProperty("velocityRange");
  });

  it("names the field of every bad value, on the path the user typed into", () => {
    const form = planToForm(threeLayerPlan(), "metric");
    form.models[0].layers[1].velocity = "fast";
    form.spread.channels = "12.5";
    form.models[0].layers[0].velocityRange = ["900", ""];
    const result = planFormSchema("metric", "x").safeParse(form);
    expect(result.success).toBe(false);
    const issues = result.error!.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
    expect(issues).toContain("models.0.layers.1.velocity: velocity must be a number");
    expect(issues).toContain("spread.channels: channels must be a whole number");
    expect(issues).toContain(
      "models.0.layers.0.velocityRange.1: velocity range upper bound must be a number",
    );
  });
});

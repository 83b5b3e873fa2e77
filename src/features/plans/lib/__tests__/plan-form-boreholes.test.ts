import { describe, expect, it } from "vitest";
import { parsePlan, type Plan } from "@engine";
import example from "../../../../../docs/examples/section-buried-channel.json";
import { parsePlanForm, planToForm } from "../plan-form";

const plan = (boreholes?: unknown): Plan => {
  const p = structuredClone(example) as Record<string, unknown> & { models: object[] };
  const model = { ...(p.models[0] as Record<string, unknown>) };
  delete model.boreholes;
  if (boreholes !== undefined) model.boreholes = boreholes;
  const r = parsePlan({ ...p, models: [model] });
  if (!r.ok) throw new Error(r.issues.join("\n"));
  return r.plan;
};

describe("plan form with stored boreholes", () => {
  it("round-trips boreholes (own top, absent layer) through the form in both unit systems", () => {
    const boreholes = [
      { name: "BH1", position: 20, depths: [3.2, 6.5] },
      { name: "BH2", position: 64.5, top: 99.1, depths: [null, 7.25] },
    ];
    for (const units of ["metric", "imperial"] as const) {
      const back = parsePlanForm(planToForm(plan(boreholes), units), units, "again");
      const model = back?.models[0];
      expect(model?.kind === "section" ? model.boreholes : null).toEqual(boreholes);
    }
  });

  it("leaves a plan without boreholes without the field", () => {
    const back = parsePlanForm(planToForm(plan(), "metric"), "metric", "again");
    expect(back).not.toBeNull();
    expect(back!.models[0]).not.toHaveProperty("boreholes");
    expect(JSON.stringify(back!.models[0])).toBe(JSON.stringify(plan().models[0]));
  });

  it("drops an emptied borehole list instead of saving []", () => {
    const form = planToForm(plan([{ name: "BH1", position: 20, depths: [3] }]), "metric");
    form.models[0].section!.boreholes = [];
    expect(parsePlanForm(form, "metric", "x")!.models[0]).not.toHaveProperty("boreholes");
  });
});

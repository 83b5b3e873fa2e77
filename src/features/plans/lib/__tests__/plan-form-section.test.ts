import { describe, expect, it } from "vitest";
import type { Plan } from "@engine";
import { parsePlanForm, planToForm } from "../plan-form";

const plan = (): Plan =>
  ({
    format: "spreadsight-plan/2",
    name: "Whinmoor lane, line 2",
    models: [
      {
        kind: "section",
        name: "Slope",
        surface: [
          [-5, 102],
          [125, 97],
        ],
        layers: [
          {
            name: "clay",
            velocity: 550,
            base: [
              [-5, 97],
              [125, 93],
            ],
          },
          { name: "mudstone", velocity: 2600 },
        ],
      },
    ],
    spread: {
      spacing: 5,
      channels: 24,
      firstGeophone: 0,
      shots: [{ position: -2.5, depth: 1.2 }, { position: 117.5 }],
    },
    criteria: { minGeophones: 2, pickError: 0.0005, depthTolerance: 1 },
  }) as Plan;

describe("plan form with a section model", () => {
  it("round-trips a section and a buried shot through the form (format 2)", () => {
    const back = parsePlanForm(planToForm(plan(), "metric"), "metric", plan().name);
    expect(back).not.toBeNull();
    expect(back!.format).toBe("spreadsight-plan/2");
    expect(back!.models[0]).toEqual(plan().models[0]);
    expect(back!.spread.shots[0].depth).toBe(1.2);
  });

  it("shows a shot depth in feet and stores metres (1 ft = 0.3048 m exactly)", () => {
    const form = planToForm(plan(), "imperial");
    form.spread.shots[1].depth = "10";
    const back = parsePlanForm(form, "imperial", "x");
    expect(back!.spread.shots[1].depth).toBeCloseTo(3.048, 9);
  });

  it("refuses a base above the surface, so nothing invalid is analysed or saved", () => {
    const form = planToForm(plan(), "metric");
    form.models[0].section!.layers[0].base![1] = [125, 99];
    expect(parsePlanForm(form, "metric", "x")).toBeNull();
  });
});

import { describe, expect, it } from "vitest";
import { describeFieldPath, describePlanProblem } from "../plan-problems";

describe("plan problems counted as the screen counts", () => {
  it("numbers models, layers and shots from 1 while the API key stays zero-based", () => {
    expect(describeFieldPath("models.0.layers.0.velocity")).toEqual({
      place: "Model 1, layer 1",
      leaf: "velocity",
    });
    expect(describePlanProblem("models.0.layers.0.velocity", "velocity must be > 0")).toBe(
      "Model 1, layer 1: velocity must be > 0",
    );
    expect(describePlanProblem("models.2.layers.1.thickness", "must be a number")).toBe(
      "Model 3, layer 2: thickness: must be a number",
    );
    expect(describePlanProblem("spread.shots.1.position", "shot position must be a number")).toBe(
      "Spread, shot 2: shot position must be a number",
    );
  });

  it("names objects without numbers and spaces out camel-case keys", () => {
    expect(describePlanProblem("spread.spacing", "spacing must be a number")).toBe(
      "Spread: spacing must be a number",
    );
    expect(describePlanProblem("criteria.pickError", "must be ≥ 0")).toBe(
      "Criteria: pick error: must be ≥ 0",
    );
    expect(describePlanProblem("name", "name is required")).toBe("name is required");
    expect(describePlanProblem("root", "send a plan document (a JSON object)")).toBe(
      "send a plan document (a JSON object)",
    );
  });

  it("never prints a zero-based index", () => {
    for (const path of ["models.0", "models.0.layers.0", "spread.shots.0.label", "models.0.name"]) {
      expect(describePlanProblem(path, "is wrong")).not.toMatch(/\b0\b/);
    }
  });
});

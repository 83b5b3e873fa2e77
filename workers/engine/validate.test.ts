import { describe, expect, it } from "vitest";
import { parsePlan } from "./validate";

const good = () => ({
  name: "Test line",
  models: [
    {
      name: "two layers",
      layers: [{ velocity: 500, thickness: 4 }, { velocity: 2500 }] as Record<string, unknown>[],
    },
  ],
  spread: { spacing: 2, channels: 24, firstGeophone: 0, shots: [{ position: -1 }] } as Record<
    string,
    unknown
  >,
});

function issuesOf(input: unknown): string[] {
  const r = parsePlan(input);
  expect(r.ok).toBe(false);
  return r.ok ? [] : r.issues;
}

describe("parsePlan", () => {
  it("accepts a good plan and applies the defaults", () => {
    const r = parsePlan(good());
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.plan.criteria).toEqual({ minGeophones: 2, pickError: 0.0005, depthTolerance: 1 });
    expect(r.plan.format).toBe("spreadsight-plan/2");
  });

  it.each([
    ["zero velocity", 0, "models[0].layers[0].velocity: velocity must be > 0"],
    ["negative velocity", -300, "models[0].layers[0].velocity: velocity must be > 0"],
    ["NaN velocity", NaN, "models[0].layers[0].velocity: velocity must be a number"],
    ["infinite velocity", Infinity, "models[0].layers[0].velocity"],
    ["text velocity", "fast", "models[0].layers[0].velocity: velocity must be a number"],
  ])("names the field for a %s", (_label, velocity, message) => {
    const p = good();
    p.models[0].layers[0].velocity = velocity;
    expect(issuesOf(p).some((i) => i.startsWith(message))).toBe(true);
  });

  it.each([
    ["zero", 0, "thickness must be > 0"],
    ["negative", -2, "thickness must be > 0"],
    ["NaN", NaN, "thickness must be a number"],
  ])("names a %s thickness", (_label, thickness, message) => {
    const p = good();
    p.models[0].layers[0].thickness = thickness;
    expect(issuesOf(p)).toContain(`models[0].layers[0].thickness: ${message}`);
  });

  it("asks for the thickness of every layer above the half-space", () => {
    const p = good();
    delete p.models[0].layers[0].thickness;
    expect(issuesOf(p)[0]).toMatch(
      /^models\[0\]\.layers\[0\]\.thickness: layer 1 needs a thickness/,
    );
  });

  it("refuses more than 12 layers", () => {
    const p = good();
    p.models[0].layers = Array.from({ length: 13 }, (_, i) =>
      i === 12 ? { velocity: 5000 } : { velocity: 300 + 100 * i, thickness: 1 },
    );
    expect(issuesOf(p)).toContain("models[0].layers: a model has at most 12 layers");
  });

  it.each([
    ["channels", 0, "spread.channels: channels must be at least 1"],
    ["channels", 2.5, "spread.channels: channels must be a whole number"],
    ["spacing", 0, "spread.spacing: spacing must be > 0"],
    ["spacing", -1, "spread.spacing: spacing must be > 0"],
  ])("refuses %s = %s", (field, value, message) => {
    const p = good();
    p.spread[field] = value;
    expect(issuesOf(p)).toContain(message);
  });

  it("names every unknown field", () => {
    const p = { ...good(), colour: "teal" };
    p.models[0].layers[0].porosity = 0.3;
    const issues = issuesOf(p);
    expect(issues).toContain("colour: unknown field");
    expect(issues).toContain("models[0].layers[0].porosity: unknown field");
  });

  it("reports every problem at once, one line each", () => {
    const p = good();
    p.models[0].layers[0].velocity = -1;
    p.spread.spacing = 0;
    expect(issuesOf(p)).toHaveLength(2);
  });

  it("refuses interfaces that cross within the spread and shots", () => {
    const p = good();
    p.models[0].layers = [
      { velocity: 400, thickness: 2, dip: 10 },
      { velocity: 1500, thickness: 3, dip: -10 },
      { velocity: 3000 },
    ];
    expect(issuesOf(p)[0]).toMatch(
      /^models\[0\]\.layers\[1\]\.dip: the base of layer 2 meets or crosses the base of layer 1/,
    );
  });

  it("refuses an interface that reaches the surface within the spread", () => {
    const p = good();
    p.models[0].layers = [{ velocity: 400, thickness: 2, dip: -10 }, { velocity: 3000 }];
    expect(issuesOf(p)[0]).toMatch(/layers\[0\]\.dip: the base of layer 1 reaches the surface/);
  });

  it("never throws on junk", () => {
    for (const junk of [null, undefined, 3, "plan", [], { models: "x" }, { spread: null }]) {
      expect(parsePlan(junk).ok).toBe(false);
    }
  });
});

import { describe, expect, it } from "vitest";
import { layeredModel } from "../engine";
import { buildSection } from "../section-chart";
import { threeLayerPlan } from "../../__tests__/fixtures";

const pathPoints = (d: string) =>
  [...d.matchAll(/[ML]([-\d.]+),([-\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])]);

describe("the Section", () => {
  it("draws a flat model with level interfaces and one polygon per layer", () => {
    const plan = threeLayerPlan();
    const s = buildSection({
      model: layeredModel(plan.models[0]),
      spread: plan.spread,
      shotIndex: 0,
      ray: null,
      geophone: null,
      width: 700,
      units: "metric",
      exaggeration: 1,
    });
    expect(s.layers).toHaveLength(3);
    expect(s.interfaces).toHaveLength(2);
    for (const i of s.interfaces) {
      const [a, b] = pathPoints(i.path);
      expect(a[1]).toBeCloseTo(b[1], 9);
    }
    // true scale: one metre across equals one metre down
    const pxPerMetreX = s.x(1) - s.x(0);
    const pxPerMetreY = s.y(1) - s.y(0);
    expect(pxPerMetreY).toBeCloseTo(pxPerMetreX, 6);
    expect(s.geophones).toHaveLength(24);
  });

  it("draws a dipping interface deepening towards +position by tan(dip)", () => {
    const plan = threeLayerPlan();
    plan.models[0].layers[1].dip = 5;
    const s = buildSection({
      model: layeredModel(plan.models[0]),
      spread: plan.spread,
      shotIndex: 0,
      ray: null,
      geophone: null,
      width: 700,
      units: "metric",
      exaggeration: 2,
    });
    const [a, b] = pathPoints(s.interfaces[1].path);
    const depthA = s.y.invert(a[1]);
    const depthB = s.y.invert(b[1]);
    const run = s.x.invert(b[0]) - s.x.invert(a[0]);
    expect((depthB - depthA) / run).toBeCloseTo(Math.tan((5 * Math.PI) / 180), 6);
    expect(s.exaggeration).toBe(2);
  });

  it("shades faster layers darker", () => {
    const plan = threeLayerPlan();
    const s = buildSection({
      model: layeredModel(plan.models[0]),
      spread: plan.spread,
      shotIndex: 0,
      ray: null,
      geophone: null,
      width: 700,
      units: "metric",
      exaggeration: "auto",
    });
    const lightness = (c: string) => {
      const [r, g, b] = (c.match(/\d+/g) ?? []).map(Number);
      return r + g + b;
    };
    expect(lightness(s.layers[0].fill)).toBeGreaterThan(lightness(s.layers[1].fill));
    expect(lightness(s.layers[1].fill)).toBeGreaterThan(lightness(s.layers[2].fill));
  });
});

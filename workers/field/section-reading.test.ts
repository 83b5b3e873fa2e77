import { describe, expect, it } from "vitest";
import { analyzeSection, parsePlan, type Plan, type SectionModel } from "@engine";
import { readSectionOfPlan, sectionReading, trueTopAt } from "./section-reading";

const V1 = 500;
const V2 = 2000;
const GROUND = 100;

function planWith(base: [number, number][]): Plan {
  const r = parsePlan({
    format: "spreadsight-plan/2",
    name: "reading",
    models: [
      {
        kind: "section",
        name: "m",
        surface: [
          [-25, GROUND],
          [95, GROUND],
        ],
        layers: [{ velocity: V1, base }, { velocity: V2 }],
      },
    ],
    spread: {
      spacing: 3,
      channels: 24,
      firstGeophone: 0,
      shots: [{ position: -20 }, { position: 0 }, { position: 69 }, { position: 89 }],
    },
  });
  if (!r.ok) throw new Error(r.issues.join("\n"));
  return r.plan;
}

describe("sectionReading", () => {
  it("reads a flat two-layer section at the closed-form depth h", () => {
    // Plus-minus method (Hagedoorn 1959; Telford, Geldart & Sheriff 1990 §4.3): for a flat
    // refractor at depth h, t⁺ − T = 2 h cos θc / v1, so the depth read back is h itself.
    const h = 5;
    const plan = planWith([
      [-25, GROUND - h],
      [95, GROUND - h],
    ]);
    const reading = readSectionOfPlan(plan, 0);
    const pm = reading.readings[0];
    expect(pm.method).toBe("plus-minus");
    const iface = pm.interfaces.find((i) => i.layer === 2);
    expect(iface).toBeDefined();
    expect(iface!.points.length).toBeGreaterThan(5);
    for (const p of iface!.points) {
      expect(Math.abs(p.depth - h)).toBeLessThanOrEqual(Math.max(0.01 * h, 0.3));
      expect(p.trueDepth).toBeCloseTo(h, 9);
    }
    expect(Math.abs(iface!.velocity - V2) / V2).toBeLessThan(0.02);
  });

  it("reads a planar dipping refractor within 1 %", () => {
    // Plus-minus on a planar dipping refractor (Hagedoorn 1959) gives the depth normal to the
    // refractor, h·cos(dip) of the vertical depth h: 0.4 % short at 5° (textbook geometry).
    const tan = Math.tan((5 * Math.PI) / 180);
    const base: [number, number][] = [
      [-25, GROUND - 4 + 25 * tan],
      [95, GROUND - 4 - 95 * tan],
    ];
    const reading = readSectionOfPlan(planWith(base), 0);
    const iface = reading.readings[0].interfaces.find((i) => i.layer === 2)!;
    expect(iface.points.length).toBeGreaterThan(5);
    for (const p of iface.points) {
      const vertical = 4 + p.position * tan; // independent: the model's own line
      expect(p.trueDepth).toBeCloseTo(vertical, 9);
      expect(Math.abs(p.depth - vertical) / vertical).toBeLessThan(0.01);
    }
  });

  it("reports the worst error of an undulating rockhead where the interface bends", () => {
    const bends = [20, 35, 50];
    const base: [number, number][] = [
      [-25, GROUND - 5],
      [20, GROUND - 5],
      [35, GROUND - 11],
      [50, GROUND - 5],
      [95, GROUND - 5],
    ];
    const plan = planWith(base);
    const model = plan.models[0] as SectionModel;
    const analysis = analyzeSection(model, 0, plan.spread, plan.criteria);
    const reading = sectionReading(plan, 0, analysis, { grm: true });
    expect(reading.readings.map((r) => r.method)).toEqual(["plus-minus", "grm"]);
    const worst = reading.readings[0].worst;
    expect(worst).not.toBeNull();
    expect(Number.isFinite(worst!.error)).toBe(true);
    // The worst point is one of the reported points with the largest |error|.
    const points = reading.readings[0].interfaces.flatMap((i) => i.points);
    const largest = Math.max(...points.map((p) => Math.abs(p.error)));
    expect(Math.abs(worst!.error)).toBe(largest);
    // Plus-minus smooths a bend over the critical-ray footprint (common practice): the worst
    // error lies within a few geophone spacings of a bend, not on the flat flanks.
    const fromBend = Math.min(...bends.map((b) => Math.abs(worst!.position - b)));
    expect(fromBend).toBeLessThanOrEqual(6);
    // true elevations come straight from the polyline (independent linear interpolation)
    expect(trueTopAt(model, 2, 27.5)).toBeCloseTo(GROUND - 5 - (6 * 7.5) / 15, 9);
  });

  it("reads from the analysis' arrivals when given them, as from a fresh analysis", () => {
    const plan = planWith([
      [-25, GROUND - 5],
      [30, GROUND - 8],
      [95, GROUND - 5],
    ]);
    const model = plan.models[0] as SectionModel;
    const analysis = analyzeSection(model, 0, plan.spread, plan.criteria);
    expect(readSectionOfPlan(plan, 0, {}, analysis)).toEqual(readSectionOfPlan(plan, 0));
  });

  it("uses the arrivals it is given instead of analysing the model again", () => {
    const plan = planWith([
      [-25, GROUND - 5],
      [95, GROUND - 5],
    ]);
    const model = plan.models[0] as SectionModel;
    const analysis = analyzeSection(model, 0, plan.spread, plan.criteria);
    // every arrival 4 ms later than modelled: the plus-minus depths come out deeper
    const late = {
      arrivals: analysis.arrivals.map((s) => ({
        ...s,
        geophones: s.geophones.map((g) => ({ ...g, time: g.time + 0.004 })),
      })),
    };
    const depth = (r: ReturnType<typeof readSectionOfPlan>) =>
      r.readings[0].interfaces.find((i) => i.layer === 2)!.points[0].depth;
    expect(depth(readSectionOfPlan(plan, 0, {}, late))).toBeGreaterThan(
      depth(readSectionOfPlan(plan, 0)) + 0.1,
    );
  });

  it("rejects a model that is not a section", () => {
    const plan = planWith([
      [-25, 95],
      [95, 95],
    ]);
    expect(() => sectionReading(plan, 3, { arrivals: [] })).toThrow(/model 4/);
  });
});

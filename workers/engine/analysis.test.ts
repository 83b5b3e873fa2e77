import { readFileSync, readdirSync } from "node:fs";
import { fileURLToPath } from "node:url";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyzePlan, type PlanAnalysis } from "./analysis";
import { STATUSES, STATUS_CODE, worstStatus } from "./statuses";
import { parsePlan } from "./validate";
import type { Plan } from "./plan-schema";

const examplesDir = fileURLToPath(new URL("../../docs/examples/", import.meta.url));

function example(name: string): Plan {
  const r = parsePlan(JSON.parse(readFileSync(examplesDir + name, "utf8")));
  if (!r.ok) throw new Error(r.issues.join("\n"));
  return r.plan;
}

/** Every number in the output is finite (JSON would turn NaN into null silently); plain data only. */
function expectJsonSafe(value: unknown, path = "analysis"): void {
  if (value === undefined || typeof value === "function" || ArrayBuffer.isView(value)) {
    throw new Error(`${path} is not plain JSON data`);
  }
  if (typeof value === "number") {
    if (!Number.isFinite(value)) throw new Error(`${path} is ${value}`);
  } else if (Array.isArray(value)) value.forEach((v, i) => expectJsonSafe(v, `${path}[${i}]`));
  else if (value && typeof value === "object") {
    for (const [k, v] of Object.entries(value)) expectJsonSafe(v, `${path}.${k}`);
  }
}

describe("analyzePlan on the example plans", () => {
  it("analyses every example in docs/examples without NaN or Infinity", () => {
    const files = readdirSync(examplesDir).filter((f) => f.endsWith(".json"));
    expect(files.length).toBeGreaterThanOrEqual(4);
    for (const f of files) expectJsonSafe(analyzePlan(example(f)), f);
  });

  it("resolves the simple two-layer plan and interprets its depth exactly", () => {
    const a = analyzePlan(example("two-layer-simple.json"));
    expect(a.worstStatus).toBe("resolved");
    const r = a.models[0].refractors[0];
    expect(r).toMatchObject({
      layer: 2,
      velocity: 2800,
      depth: 6,
      headWave: true,
      status: "resolved",
    });
    expect(r.segment?.to).toBeNull();
    expect(a.models[0].interpretation?.refractors[0].error).toBeCloseTo(0, 9);
    expect(a.models[0].interpretation?.crossover?.thickness).toBeCloseTo(6, 9);
  });

  it("finds the thin layer blind and the refractor below it interpreted too shallow", () => {
    const a = analyzePlan(example("thin-blind-layer.json"));
    const [lens, absent] = a.models;
    expect(lens.refractors[0].status).toBe("blind");
    expect(lens.refractors[0].blindEverywhere).toBe(true);
    expect(lens.refractors[0].minimumThickness).toBeGreaterThan(2);
    const below = lens.interpretation!.refractors.find((r) => r.layer === 3)!;
    expect(below.error).toBeLessThan(0);
    expect(lens.recommendation.hidden[0]).toMatchObject({ layer: 2, status: "blind" });
    expect(lens.recommendation.hidden[0].statement).toMatch(/no spread can reveal it/);
    expect(lens.recommendation.hidden[0].statement).toMatch(/boreholes or cone penetration tests/);
    expect(absent.worstStatus).toBe("resolved");
    expect(a.worstStatus).toBe("blind");
  });

  it("finds the inversion and the refractor below it interpreted too deep", () => {
    const a = analyzePlan(example("velocity-inversion.json"));
    const m = a.models[0];
    expect(m.refractors[0]).toMatchObject({
      layer: 2,
      headWave: false,
      status: "inverted",
      interceptTime: null,
    });
    expect(m.refractors[0].minimumThickness).toBeNull();
    expect(m.interpretation!.refractors[0].error).toBeGreaterThan(0);
    expect(m.recommendation.hidden[0].statement).toMatch(/velocity inversion/);
    expect(a.worstStatus).toBe("inverted");
  });

  it("recovers dip and velocity from the reversed end shots and checks reciprocal times", () => {
    const a = analyzePlan(example("dipping-reversed.json"));
    const dips = a.models[0].interpretation!.dips;
    const deep = dips.find((d) => d.layer === 3)!;
    expect(deep.forwardShot).toBe(2); // widest pair: the off-end shots
    expect(deep.reverseShot).toBe(3);
    expect(deep.dip).toBeCloseTo(4, 9);
    expect(deep.velocity).toBeCloseTo(3200, 6);
    expect(Math.abs(deep.reciprocalTime.difference)).toBeLessThan(1e-12);
    expect(deep.reciprocalTime.observable).toBe(true);
    // the flat interface above is recovered with zero dip
    expect(dips.find((d) => d.layer === 2)!.dip).toBeCloseTo(0, 9);
  });
});

describe("analyzePlan behaviour", () => {
  const base = (): Plan => example("two-layer-simple.json");

  it("gives no interpretation when the direct wave is under-sampled on the first shot's longest branch", () => {
    const plan = base();
    plan.spread.shots = [{ position: -40 }, ...plan.spread.shots];
    const a = analyzePlan(plan);
    expect(a.models[0].direct.geophones).toBe(0);
    expect(a.models[0].interpretation).toBeNull();
    expect(a.models[0].uncertainty).toBeNull();
  });

  it("reports the refractor fields the command line promises", () => {
    const r = analyzePlan(base()).models[0].refractors[0];
    for (const key of [
      "layer",
      "velocity",
      "depth",
      "headWave",
      "interceptTime",
      "criticalDistance",
      "segment",
      "geophones",
      "status",
      "minimumThickness",
    ]) {
      expect(r).toHaveProperty(key);
    }
    expect(r.branches).toHaveLength(2);
    expect(r.branches.map((b) => b.side)).toEqual(["forward", "reverse"]);
  });

  it("flags depth uncertainty above the plan's tolerance", () => {
    const plan = base();
    plan.criteria = { ...plan.criteria, pickError: 0.004, depthTolerance: 0.5 };
    const u = analyzePlan(plan).models[0].uncertainty!;
    expect(u.refractors[0].depthSigma).toBeGreaterThan(0.5);
    expect(u.refractors[0].exceedsTolerance).toBe(true);
    plan.criteria = { ...plan.criteria, pickError: 0 };
    expect(analyzePlan(plan).models[0].uncertainty!.refractors[0].depthSigma).toBe(0);
  });

  it("throws a RangeError for a model whose interfaces cross within the spread", () => {
    const plan = base();
    plan.models[0].layers[0] = { ...plan.models[0].layers[0], dip: -20 };
    expect(() => analyzePlan(plan)).toThrow(RangeError);
  });
});

const layerArb = fc.record({
  velocity: fc.double({ min: 150, max: 7000, noNaN: true }),
  thickness: fc.double({ min: 0.3, max: 30, noNaN: true }),
  dip: fc.constantFrom(0, 0, 0, 1, -2, 3.5),
});

const planArb = fc.record({
  models: fc.array(fc.array(layerArb, { minLength: 1, maxLength: 12 }), {
    minLength: 1,
    maxLength: 3,
  }),
  spacing: fc.double({ min: 0.5, max: 10, noNaN: true }),
  channels: fc.integer({ min: 1, max: 96 }),
  shots: fc.array(fc.double({ min: -50, max: 400, noNaN: true }), { minLength: 1, maxLength: 5 }),
  minGeophones: fc.integer({ min: 2, max: 6 }),
});

type PlanArb = typeof planArb extends fc.Arbitrary<infer T> ? T : never;

function planFrom(p: PlanArb): unknown {
  return {
    name: "random",
    models: p.models.map((layers, i) => ({
      name: `m${i}`,
      layers: layers.map((l, j) => (j === layers.length - 1 ? { velocity: l.velocity } : l)),
    })),
    spread: {
      spacing: p.spacing,
      channels: p.channels,
      firstGeophone: 0,
      shots: p.shots.map((position) => ({ position })),
    },
    criteria: { minGeophones: p.minGeophones },
  };
}

describe("analyzePlan properties", () => {
  it("never produces NaN or Infinity and reports consistent worst verdicts", () => {
    fc.assert(
      fc.property(planArb, (p) => {
        const parsed = parsePlan(planFrom(p));
        if (!parsed.ok) {
          // only geometry can fail here, and it is named
          expect(parsed.issues.every((i) => /layers\[\d+\]\.dip:/.test(i))).toBe(true);
          return;
        }
        const a: PlanAnalysis = analyzePlan(parsed.plan, { minimumThickness: false });
        expectJsonSafe(a);
        for (const m of a.models) {
          for (const r of m.refractors) expect(STATUSES).toContain(r.status);
          expect(m.worstStatus).toBe(
            worstStatus([m.direct.status, ...m.refractors.map((r) => r.status)]),
          );
        }
        expect(a.worstStatus).toBe(worstStatus(a.models.map((m) => m.worstStatus)));
      }),
      { numRuns: 150 },
    );
  });

  it("resolves every refractor that can be seen once the recommended spacing and spread length are used", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 200, max: 900, noNaN: true }),
        fc.array(
          fc.record({
            v: fc.double({ min: 150, max: 6000, noNaN: true }),
            h: fc.double({ min: 0.5, max: 12, noNaN: true }),
          }),
          {
            minLength: 1,
            maxLength: 6,
          },
        ),
        fc.integer({ min: 2, max: 4 }),
        (v0, rest, minGeophones) => {
          const layers = [{ velocity: v0, thickness: rest[0].h }];
          rest.forEach((l, i) =>
            layers.push(
              i === rest.length - 1
                ? ({ velocity: l.v } as never)
                : { velocity: l.v, thickness: rest[i + 1].h },
            ),
          );
          const plan = parsePlan({
            models: [{ name: "m", layers }],
            spread: { spacing: 1, channels: 24, firstGeophone: 0, shots: [{ position: -0.5 }] },
            criteria: { minGeophones },
          });
          if (!plan.ok) throw new Error(plan.issues.join());
          const first = analyzePlan(plan.plan, { minimumThickness: false });
          const rec = first.models[0].recommendation;
          fc.pre(rec.channels <= 1024 && (rec.maxSpacing ?? 1) >= 0.01);
          const spacing = rec.maxSpacing ?? 1;
          const redesigned = {
            ...plan.plan,
            spread: {
              spacing,
              channels: rec.channels,
              firstGeophone: 0,
              shots: [{ position: -spacing / 2 }],
            },
          };
          const again = analyzePlan(redesigned, { minimumThickness: false }).models[0];
          expect(again.direct.status).toBe("resolved");
          for (const r of again.refractors) {
            if (r.status === "blind" || r.status === "inverted") continue;
            expect(r.status).toBe("resolved");
          }
          expect(STATUS_CODE[again.worstStatus]).toBeGreaterThanOrEqual(0);
        },
      ),
      { numRuns: 200 },
    );
  });
});

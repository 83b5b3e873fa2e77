import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { analyzePlan } from "./analysis";
import type { GroundModel, Plan, SectionModel } from "./plan-schema";
import { isSectionAnalysis, sectionShotField } from "./section-analysis";
import { sectionFromLayered } from "./section-convert";
import { runSectionSweep } from "./section-sweep";
import { CELL_INVALID } from "./statuses";
import { parsePlan } from "./validate";

const root = fileURLToPath(new URL("../../", import.meta.url));

function planOf(input: unknown): Plan {
  const r = parsePlan(input);
  if (!r.ok) throw new Error(r.issues.join("\n"));
  return r.plan;
}

/** The same plan with every layered model drawn as a section over the spread and shots. */
function asSections(plan: Plan): Plan {
  const s = plan.spread;
  const xs = [s.firstGeophone, s.firstGeophone + (s.channels - 1) * s.spacing];
  for (const shot of s.shots) xs.push(shot.position);
  const from = Math.min(...xs) - 2;
  const to = Math.max(...xs) + 2;
  return {
    ...plan,
    format: "spreadsight-plan/2",
    models: plan.models.map((m) => sectionFromLayered(m as GroundModel, from, to, 100)),
  };
}

describe("section verdicts use the layered definitions", () => {
  // The layered engine's verdicts (verdicts.ts; its examples are checked against published
  // hidden-layer and inversion cases) are the reference: a flat or planar section of the
  // same ground must get the same verdict for the direct wave and every refractor.
  it.each(["two-layer-simple", "thin-blind-layer", "velocity-inversion", "dipping-reversed"])(
    "gives the layered verdicts on docs/examples/%s.json drawn as a section",
    (name) => {
      const plan = planOf(JSON.parse(readFileSync(`${root}docs/examples/${name}.json`, "utf8")));
      const layered = analyzePlan(plan);
      const section = analyzePlan(asSections(plan));
      layered.models.forEach((m, i) => {
        const s = section.models[i];
        expect(isSectionAnalysis(s)).toBe(true);
        expect(s.direct.status).toBe(m.direct.status);
        expect(s.refractors.map((r) => r.status)).toEqual(m.refractors.map((r) => r.status));
      });
    },
  );

  it("marks a refractor under-sampled when it is first only between two geophones", () => {
    const plan = planOf({
      name: "gap",
      models: [
        {
          name: "m",
          layers: [
            { velocity: 400, thickness: 3 },
            { velocity: 1200, thickness: 2.2 },
            { velocity: 2600 },
          ],
        },
      ],
      spread: {
        spacing: 3,
        channels: 24,
        firstGeophone: 0,
        shots: [{ position: -1 }, { position: 70 }],
      },
      criteria: { minGeophones: 3 },
    });
    const layered = analyzePlan(plan).models[0];
    const section = analyzePlan(asSections(plan)).models[0];
    expect(layered.refractors[0].status).toBe("under-sampled");
    expect(section.refractors[0].status).toBe("under-sampled");
    if (!isSectionAnalysis(section)) throw new Error("not a section analysis");
    expect(section.coverage[0].stretches.some((s) => s.geophones === 0 && s.judged)).toBe(true);
  });
});

describe("the section chart's time field and the section sweep", () => {
  const plan = planOf(
    JSON.parse(readFileSync(`${root}docs/examples/section-buried-channel.json`, "utf8")),
  );

  it("gives one ray per geophone from the shot to the geophone, on the time grid", () => {
    const field = sectionShotField(plan, 0, 0);
    expect(field.times).toHaveLength(field.grid.nx * field.grid.nz);
    expect(field.rays).toHaveLength(plan.spread.channels);
    const ray = field.rays[10].points;
    expect(ray[0]).toBeCloseTo(plan.spread.shots[0].position, 9);
    expect(ray[ray.length - 2]).toBeCloseTo(
      plan.spread.firstGeophone + 10 * plan.spread.spacing,
      9,
    );
    expect(() => sectionShotField(plan, 0, 7)).toThrow(RangeError);
  });

  it("sweeps spacing × a base point's elevation and marks geometry that crosses as invalid", () => {
    const model = plan.models[0] as SectionModel;
    const spec = {
      modelIndex: 0,
      spacings: [2, 6],
      // point 3 of the weathered layer's base: 88 m is the model's; 101 m rises above the surface
      parameter: { kind: "elevation" as const, layer: 2, point: 3, values: [88, 101] },
    };
    expect(model.layers[1].base?.[3]).toEqual([58, 87.5]);
    const r = runSectionSweep(plan, spec);
    expect(r.rows).toBe(2);
    expect(r.cols).toBe(2);
    expect(r.status[2]).toBe(CELL_INVALID);
    expect(r.status[3]).toBe(CELL_INVALID);
    expect(r.status[0]).toBeLessThan(4);
    expect(() => runSectionSweep(plan, { ...spec, modelIndex: 3 })).toThrow(/modelIndex/);
  });
});

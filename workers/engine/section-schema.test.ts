import { describe, expect, it } from "vitest";
import { analyzePlan } from "./analysis";
import { parsePlan } from "./validate";

/** The section of issue 9, on a spread inside it. */
const good = () => ({
  name: "Channel",
  models: [
    {
      name: "Channel cut into rockhead",
      kind: "section",
      surface: [
        [0, 102.0],
        [60, 99.5],
        [120, 97.0],
      ] as unknown[],
      layers: [
        {
          name: "silty clay",
          velocity: 550,
          base: [
            [0, 97.0],
            [50, 93.0],
            [70, 92.5],
            [120, 96.0],
          ] as unknown[],
        },
        {
          name: "clay lens",
          velocity: 420,
          base: [
            [0, 95.5],
            [40, 91.0],
            [120, 91.0],
          ] as unknown[],
        },
        { name: "mudstone", velocity: 2600 } as Record<string, unknown>,
      ] as Record<string, unknown>[],
    } as Record<string, unknown>,
  ],
  spread: {
    spacing: 2,
    channels: 48,
    firstGeophone: 10,
    shots: [{ position: 8 }, { position: 110, depth: 1.5 }],
  } as Record<string, unknown>,
});

function issuesOf(input: unknown): string[] {
  const r = parsePlan(input);
  expect(r.ok).toBe(false);
  return r.ok ? [] : r.issues;
}

type Layer = { base?: unknown[]; velocityAt?: unknown[] } & Record<string, unknown>;
const layers = (p: ReturnType<typeof good>) => p.models[0].layers as Layer[];

describe("section models in a plan", () => {
  it("accepts the issue's section, defaults the format to spreadsight-plan/2 and keeps shot depth", () => {
    const r = parsePlan(good());
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.plan.format).toBe("spreadsight-plan/2");
    expect(r.plan.spread.shots[1].depth).toBe(1.5);
    expect(r.plan.models[0].kind).toBe("section");
  });

  it("still reads a spreadsight-plan/1 document of layered models without kind", () => {
    const r = parsePlan({
      format: "spreadsight-plan/1",
      name: "old",
      models: [{ name: "two", layers: [{ velocity: 500, thickness: 3 }, { velocity: 2000 }] }],
      spread: { spacing: 2, channels: 12, firstGeophone: 0, shots: [{ position: -1 }] },
    });
    expect(r.ok).toBe(true);
  });

  it("refuses a section model in a spreadsight-plan/1 document", () => {
    expect(issuesOf({ ...good(), format: "spreadsight-plan/1" })).toContain(
      'models[0].kind: section models need format "spreadsight-plan/2"',
    );
  });

  it("names the point where a base rises above the surface", () => {
    const p = good();
    layers(p)[0].base = [
      [0, 97],
      [40, 101.5],
      [120, 96],
    ];
    expect(issuesOf(p)).toContain(
      "models[0].layers[0].base[1]: base rises above the surface at 40 m",
    );
  });

  it("names the point where a base crosses the base above it", () => {
    const p = good();
    (layers(p)[1].base as number[][])[2] = [120, 97];
    expect(issuesOf(p)).toContain(
      "models[0].layers[1].base[1]: base crosses the base of layer 1 at 70 m (0.75 m above it)",
    );
  });

  it("accepts a base touching the one above (a pinch-out)", () => {
    const p = good();
    layers(p)[1].base = [
      [0, 95.5],
      [50, 93],
      [70, 92.5],
      [120, 92],
    ];
    expect(parsePlan(p).ok).toBe(true);
  });

  it("names an out-of-order point", () => {
    const p = good();
    (p.models[0].surface as number[][])[2] = [50, 97];
    expect(issuesOf(p)[0]).toBe(
      "models[0].surface[2]: positions must increase along the line (50 m follows 60 m)",
    );
  });

  it("refuses a polyline of fewer than two points", () => {
    const p = good();
    layers(p)[0].base = [[0, 97]];
    expect(issuesOf(p)).toContain("models[0].layers[0].base: base needs at least two points");
  });

  it.each([
    ["NaN", NaN, "must be a number"],
    ["a string", "high", "must be a number"],
    ["Infinity", Infinity, ""],
  ])("names a point whose elevation is %s", (_label, value, message) => {
    const p = good();
    (layers(p)[0].base as unknown[][])[1] = [50, value];
    expect(
      issuesOf(p).some(
        (i) => i.startsWith("models[0].layers[0].base[1][1]: elevation") && i.includes(message),
      ),
    ).toBe(true);
  });

  it("refuses a section shorter than the spread", () => {
    const p = good();
    p.spread.channels = 60;
    expect(issuesOf(p)).toEqual([
      "models[0].surface: the section covers 0 to 120 m but the geophones and shots reach 8 to 128 m (the section is shorter than the spread)",
    ]);
  });

  it("refuses a base that does not cover the surface, a missing base and a base on the half-space", () => {
    const p = good();
    layers(p)[0].base = [
      [10, 97],
      [120, 96],
    ];
    delete layers(p)[1].base;
    layers(p)[2].base = [
      [0, 80],
      [120, 80],
    ];
    const issues = issuesOf(p);
    expect(issues).toContain(
      "models[0].layers[0].base: the base must cover the surface from 0 to 120 m (it covers 10 to 120 m)",
    );
    expect(issues).toContain(
      "models[0].layers[1].base: layer 2 needs a base (only the last layer is a half-space)",
    );
    expect(issues).toContain(
      "models[0].layers[2].base: the last layer is a half-space and has no base",
    );
  });

  it("names a bad velocityAt point and an unknown kind", () => {
    const p = good();
    layers(p)[2].velocityAt = [
      [0, 2600],
      [0, 3000],
    ];
    expect(issuesOf(p)).toContain(
      "models[0].layers[2].velocityAt[1]: positions must increase along the line (0 m follows 0 m)",
    );
    expect(
      issuesOf({ ...good(), models: [{ ...good().models[0], kind: "cross-section" }] })[0],
    ).toMatch(/^models\[0\]\.kind: kind must be "layered" or "section"/);
  });

  it("never crashes or yields NaN on random damage to the section (every field named)", () => {
    const damages: ((p: ReturnType<typeof good>) => void)[] = [
      (p) => (p.models[0].surface = []),
      (p) => (p.models[0].surface = [[0, 1], "x"]),
      (p) => (layers(p)[0].base = null as unknown as unknown[]),
      (p) => (layers(p)[0].velocityAt = [[5]]),
      (p) => (p.models[0].layers = []),
      (p) => (p.spread.shots = [{ position: 8, depth: -1 }]),
    ];
    for (const damage of damages) {
      const p = good();
      damage(p);
      const issues = issuesOf(p);
      expect(issues.length).toBeGreaterThan(0);
      for (const i of issues) expect(i).toMatch(/^(models|spread)/);
    }
  });

  it("analyses a valid section with no NaN or Infinity in the output", () => {
    const r = parsePlan(good());
    if (!r.ok) throw new Error(r.issues.join("\n"));
    const text = JSON.stringify(analyzePlan(r.plan));
    expect(text).not.toMatch(/NaN|Infinity/);
    // surface at 110 m: 99.5 + (97 − 99.5)·50/60 m, charge 1.5 m below it
    expect(JSON.parse(text).models[0].arrivals[1].elevation).toBeCloseTo(
      99.5 - 2.5 * (50 / 60) - 1.5,
      6,
    );
  });
});

describe("boreholes stored on a section model", () => {
  const withBoreholes = (boreholes: unknown) => {
    const p = good();
    p.models[0].boreholes = boreholes;
    return p;
  };
  const bh = (over: Record<string, unknown> = {}) => ({
    name: "BH1",
    position: 30,
    depths: [5, 9],
    ...over,
  });

  it("keeps boreholes with and without a top elevation, null depths included", () => {
    const r = parsePlan(
      withBoreholes([bh(), { name: "BH2", position: 90, top: 98.2, depths: [4.5, null] }]),
    );
    if (!r.ok) throw new Error(r.issues.join("\n"));
    expect(r.plan.format).toBe("spreadsight-plan/2");
    const model = r.plan.models[0];
    expect(model.kind === "section" ? model.boreholes : null).toEqual([
      { name: "BH1", position: 30, depths: [5, 9] },
      { name: "BH2", position: 90, top: 98.2, depths: [4.5, null] },
    ]);
  });

  it("does not change the analysis (boreholes are evidence only)", () => {
    const plain = parsePlan(good());
    const logged = parsePlan(withBoreholes([bh()]));
    if (!plain.ok || !logged.ok) throw new Error("both plans should parse");
    expect(JSON.stringify(analyzePlan(logged.plan))).toBe(JSON.stringify(analyzePlan(plain.plan)));
  });

  it("names the borehole and the field of a bad position, top or depth", () => {
    const issues = issuesOf(
      withBoreholes([
        bh(),
        bh({ name: "BH2", position: "far", top: NaN }),
        bh({ name: "BH3", depths: [5, -1] }),
        bh({ name: "BH4", depths: [6, 3] }),
        bh({ name: "BH5", depths: [null, null] }),
        bh({ name: " ", colour: "red" }),
      ]),
    );
    expect(issues).toEqual(
      expect.arrayContaining([
        'models[0].boreholes[1].position: borehole "BH2" position must be a finite number',
        'models[0].boreholes[1].top: borehole "BH2" top elevation must be a finite number (or left out: the surface there)',
        'models[0].boreholes[2].depths[1]: borehole "BH3" depth 2 must not be negative',
        'models[0].boreholes[3].depths[1]: borehole "BH4" depth 2 (3 m) is above the base of the layer over it (6 m)',
        'models[0].boreholes[4].depths: borehole "BH5" logs no depths',
        "models[0].boreholes[5].name: borehole 6 needs a name (1 to 80 characters)",
        'models[0].boreholes[5].colour: borehole 6: unknown field "colour"',
      ]),
    );
  });

  it("refuses a borehole beyond the surface's extent, naming it", () => {
    expect(issuesOf(withBoreholes([bh(), bh({ name: "BH9", position: 130 })]))).toEqual([
      'models[0].boreholes[1].position: borehole "BH9" at 130 m stands beyond the section\'s surface (0 to 120 m)',
    ]);
  });

  it("limits the count of boreholes and of logged bases", () => {
    const many = Array.from({ length: 51 }, (_, i) => bh({ name: `B${i}`, position: i }));
    expect(issuesOf(withBoreholes(many))).toContain(
      "models[0].boreholes: a section has at most 50 boreholes",
    );
    const deep = Array.from({ length: 41 }, (_, i) => i + 1);
    expect(issuesOf(withBoreholes([bh({ depths: deep })]))).toContain(
      'models[0].boreholes[0].depths: borehole "BH1" logs at most 40 bases (it has 41)',
    );
    expect(issuesOf(withBoreholes("BH1"))).toContain(
      "models[0].boreholes: boreholes must be a list of boreholes",
    );
  });

  it("is not a field of a layered model", () => {
    expect(
      issuesOf({
        name: "layered",
        models: [
          {
            name: "two",
            layers: [{ velocity: 500, thickness: 3 }, { velocity: 2000 }],
            boreholes: [bh()],
          },
        ],
        spread: { spacing: 2, channels: 12, firstGeophone: 0, shots: [{ position: -1 }] },
      }),
    ).toContain("models[0].boreholes: unknown field");
  });
});

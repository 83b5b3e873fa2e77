// analyzePlan on a roll-along plan (analysis.ts): each spread is analysed as a spread of its own.
// The independent path: analyzePlan of a plan whose spread is spread k alone, written here by
// hand (first geophone (k − 1)·(N − overlap)·Δx on, the same anchored shots).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyzePlan, type PlanAnalysis } from "./analysis";
import type { PlanInput } from "./plan-schema";
import { sectionShotField } from "./section-analysis";
import { runSweep } from "./sweep";
import { runSectionSweep } from "./section-sweep";
import { parsePlan } from "./validate";

function parse(input: unknown) {
  const r = parsePlan(input);
  if (!r.ok) throw new Error(r.issues.join("; "));
  return r.plan;
}

const endShots = [
  { position: -1, label: "A", anchor: { to: "start" as const, offset: -1 } },
  { position: 47, label: "B", anchor: { to: "end" as const, offset: 1 } },
];

/** Spread k (1-based) of a line of `channels` at `spacing` from 0 m alone, as its own plan. */
function spreadAlone(input: PlanInput, k: number, step: number) {
  const { rollAlong: _roll, ...spread } = input.spread;
  return parse({
    ...input,
    spread: { ...spread, firstGeophone: spread.firstGeophone + (k - 1) * step * spread.spacing },
  });
}

// Rockhead 3 m deep at 0 m deepening at 10° along the line, 24 geophones at 2 m, 3 spreads
// without overlap (0–46, 48–94, 96–142 m). Rough guide from the flat two-layer crossover
// x = 2h √((v2 + v1)/(v2 − v1)) (Kearey, Brooks & Hill 2002, ch. 5): under the first shot of
// spread 2 (47 m, h = 3 + 47 tan 10° ≈ 11.3 m) about 28 m, inside the 47 m branch; under the
// first shot of spread 3 (95 m, h ≈ 19.8 m) about 48 m, beyond every geophone of the spread.
const deepening: PlanInput = {
  name: "Deepening rockhead",
  models: [
    {
      name: "rock deepening east",
      layers: [{ velocity: 500, thickness: 3, dip: 10 }, { velocity: 2500 }],
    },
  ],
  spread: {
    spacing: 2,
    channels: 24,
    firstGeophone: 0,
    shots: endShots,
    rollAlong: { spreads: 3, overlap: 0 },
  },
};

describe("analyzePlan with roll-along: a refractor out of reach under spread 3 only", () => {
  const a = analyzePlan(parse(deepening));
  const ra = a.rollAlong as NonNullable<PlanAnalysis["rollAlong"]>;

  it("checks the guide: the crossover under spread 3's first shot lies beyond its geophones", () => {
    const cross = (h: number) => 2 * h * Math.sqrt((2500 + 500) / (2500 - 500));
    const h = (x: number) => 3 + x * Math.tan((10 * Math.PI) / 180);
    expect(cross(h(47))).toBeLessThan(47);
    expect(cross(h(95))).toBeGreaterThan(47);
  });

  it("makes the line's worst verdict the worst spread's, where spread 1 alone is resolved", () => {
    expect(analyzePlan(spreadAlone(deepening, 1, 24)).worstStatus).toBe("resolved");
    expect(ra.spreads.map((s) => s.worstStatus)).toEqual(["resolved", "resolved", "under-sampled"]);
    expect(a.worstStatus).toBe("under-sampled");
  });

  it("shows spread 3 in detail by default, equal to spread 3 analysed alone", () => {
    expect(ra.shown).toBe(3);
    const alone = analyzePlan(spreadAlone(deepening, 3, 24));
    expect(a.models).toEqual(alone.models);
    expect(a.models[0].refractors[0].status).toBe("under-sampled");
  });

  it("shows the spread asked for, and tells which", () => {
    const two = analyzePlan(parse(deepening), { spread: 2 });
    expect(two.rollAlong?.shown).toBe(2);
    expect(two.worstStatus).toBe("under-sampled");
    expect(two.models).toEqual(analyzePlan(spreadAlone(deepening, 2, 24)).models);
    expect(two.shots.map((s) => [s.label, s.position])).toEqual([
      ["A", 47],
      ["B", 95],
    ]);
  });

  it("falls back to the worst spread for a spread the line does not have", () => {
    expect(analyzePlan(parse(deepening), { spread: 9 }).rollAlong?.shown).toBe(3);
  });

  it("throws when the spread asked for is not a whole number from 1", () => {
    expect(() => analyzePlan(parse(deepening), { spread: 1.5 })).toThrow(RangeError);
    expect(() => analyzePlan(parse(deepening), { spread: 0 })).toThrow(/spread/);
  });

  it("lists the stations, geophone positions and shots of each spread", () => {
    expect(ra.stations).toBe(72);
    expect(ra.step).toBe(24);
    expect(ra.overlap).toBe(0);
    expect(
      ra.spreads.map((s) => [s.firstStation, s.lastStation, s.firstGeophone, s.lastGeophone]),
    ).toEqual([
      [1, 24, 0, 46],
      [25, 48, 48, 94],
      [49, 72, 96, 142],
    ]);
    expect(ra.spreads[2].shots).toEqual([
      { planShot: 0, label: "A", position: 95 },
      { planShot: 1, label: "B", position: 143 },
    ]);
    expect(ra.spreads[2].models).toEqual([
      { name: "rock deepening east", worstStatus: "under-sampled" },
    ]);
  });

  it("says in the recommendation that the line rolls along and where the worst verdict is", () => {
    expect(a.recommendation.text).toMatch(/3 roll-along spreads/);
    expect(a.recommendation.text).toMatch(/stations 1–72 from 0 m to 142 m/);
    expect(a.recommendation.text).toMatch(/worst verdict \(under-sampled\) is on spread 3\./);
    expect(a.recommendation.text).toMatch(/The detailed results are for spread 3\./);
  });
});

describe("analyzePlan with roll-along: flat layers", () => {
  const thin = JSON.parse(readFileSync("docs/examples/thin-layer.json", "utf8")) as PlanInput;
  // 24 geophones at 4 m, 4 spreads sharing 6 stations (step 18 = 72 m), anchored end shots.
  const input: PlanInput = {
    ...thin,
    spread: {
      ...thin.spread,
      shots: [
        { position: -2, label: "north end", anchor: { to: "start", offset: -2 } },
        { position: 94, label: "south end", anchor: { to: "end", offset: 2 } },
      ],
      rollAlong: { spreads: 4, overlap: 6 },
    },
  };
  const a = analyzePlan(parse(input));

  it("gives every spread the verdict of that spread analysed alone", () => {
    for (let k = 1; k <= 4; k++) {
      const alone = analyzePlan(spreadAlone(input, k, 18));
      expect(a.rollAlong?.spreads[k - 1].worstStatus).toBe(alone.worstStatus);
      expect(a.rollAlong?.spreads[k - 1].models).toEqual(
        alone.models.map((m) => ({ name: m.name, worstStatus: m.worstStatus })),
      );
      expect(analyzePlan(parse(input), { spread: k }).models).toEqual(alone.models);
    }
  });

  it("gives the same verdict as the one-spread plan: the ground is the same under every spread", () => {
    const one = analyzePlan(parse(thin));
    expect(a.worstStatus).toBe(one.worstStatus);
    expect(a.rollAlong?.spreads.every((s) => s.worstStatus === one.worstStatus)).toBe(true);
    expect(a.rollAlong?.shown).toBe(1);
  });

  it("combines the recommendation figures as the one-spread plan does", () => {
    const one = analyzePlan(parse(thin));
    expect(a.recommendation.maxSpacing).toBe(one.recommendation.maxSpacing);
    expect(a.recommendation.spreadLength).toBe(one.recommendation.spreadLength);
    expect(a.recommendation.channels).toBe(one.recommendation.channels);
  });
});

describe("analyzePlan with roll-along: fixed shots and spreads without a shot", () => {
  const base: PlanInput = {
    models: [{ name: "two layers", layers: [{ velocity: 500, thickness: 4 }, { velocity: 2500 }] }],
    spread: {
      spacing: 2,
      channels: 24,
      firstGeophone: 0,
      // fixed shots: both near spread 1 (centre 23 m) of 3 spreads without overlap
      shots: [{ position: -1 }, { position: 47 }],
      rollAlong: { spreads: 3, overlap: 0 },
    },
  };

  it("marks a spread that records no shot under-sampled and says so", () => {
    const a = analyzePlan(parse(base));
    // 47 m is 24 m from centre 1 (23 m) and 24 m from centre 2 (71 m): the tie goes to spread 1
    expect(a.rollAlong?.spreads.map((s) => s.shots.length)).toEqual([2, 0, 0]);
    expect(a.rollAlong?.spreads.map((s) => s.worstStatus)).toEqual([
      "resolved",
      "under-sampled",
      "under-sampled",
    ]);
    expect(a.worstStatus).toBe("under-sampled");
    expect(a.rollAlong?.shown).toBe(1);
    expect(a.recommendation.text).toMatch(/Spreads 2 and 3 record no shot/);
  });

  it("analyses a fixed shot only on the spread that records it", () => {
    const a = analyzePlan(
      parse({
        ...base,
        spread: { ...base.spread, shots: [{ position: -1 }, { position: 47.5, label: "mid" }] },
      }),
      { spread: 2 },
    );
    // 47.5 m is 24.5 m from centre 1 and 23.5 m from centre 2: spread 2 records it
    expect(a.rollAlong?.spreads.map((s) => s.shots.map((x) => x.planShot))).toEqual([[0], [1], []]);
    expect(a.shots).toEqual([{ position: 47.5, label: "mid" }]);
    expect(a.models[0].direct.branches.map((b) => b.shotPosition)).toEqual([47.5]);
  });

  it("has no rollAlong field for a plan without roll-along", () => {
    const { rollAlong: _roll, ...spread } = base.spread;
    const a = analyzePlan(parse({ ...base, spread }), { spread: 2 });
    expect("rollAlong" in a).toBe(false);
    expect(Object.keys(a)).toEqual([
      "format",
      "plan",
      "criteria",
      "worstStatus",
      "models",
      "recommendation",
      "shots",
    ]);
  });
});

describe("analyzePlan with roll-along: section models", () => {
  // Flat surface at 100 m, rockhead flat at 95 m except a channel floored at 75 m between
  // 46 and 74 m, under spread 3 (48–70 m) of three 12-channel spreads at 2 m. The flat two-layer
  // crossover for h = 25 m (Kearey et al. 2002, ch. 5), 2 × 25 × √(3000/2000) ≈ 61 m, is beyond
  // any 23 m branch; for h = 5 m it is about 12 m, inside it.
  const input: PlanInput = {
    format: "spreadsight-plan/2",
    name: "Channel under spread 3",
    models: [
      {
        kind: "section",
        name: "channel",
        surface: [
          [-5, 100],
          [80, 100],
        ],
        cellSize: 1,
        layers: [
          {
            velocity: 500,
            base: [
              [-5, 95],
              [44, 95],
              [46, 75],
              [74, 75],
              [76, 95],
              [80, 95],
            ],
          },
          { velocity: 2500 },
        ],
      },
    ],
    spread: {
      spacing: 2,
      channels: 12,
      firstGeophone: 0,
      shots: [
        { position: -1, anchor: { to: "start", offset: -1 } },
        { position: 23, anchor: { to: "end", offset: 1 } },
      ],
      rollAlong: { spreads: 3, overlap: 0 },
    },
  };

  it("finds the channel on spread 3 only and shows spread 3, as spread 3 alone does", () => {
    const a = analyzePlan(parse(input));
    const statuses = a.rollAlong?.spreads.map((s) => s.worstStatus);
    expect(statuses?.slice(0, 2)).toEqual(["resolved", "resolved"]);
    expect(statuses?.[2]).not.toBe("resolved");
    expect(a.worstStatus).toBe(statuses?.[2]);
    expect(a.rollAlong?.shown).toBe(3);
    const alone = analyzePlan(spreadAlone(input, 3, 12));
    expect(alone.worstStatus).toBe(a.worstStatus);
    expect(a.models[0].worstStatus).toBe(alone.models[0].worstStatus);
  });

  it("draws the rays of a shot of the spread asked for (sectionShotField)", () => {
    const plan = parse(input);
    const field = sectionShotField(plan, 0, 0, 3);
    // spread 3's first shot stands at 47 m; its geophone 1 at 48 m, geophone 12 at 70 m
    const ray = field.rays[11].points;
    expect(ray[0]).toBeCloseTo(47, 6);
    expect(ray[ray.length - 2]).toBeCloseTo(70, 6);
    expect(() => sectionShotField(plan, 0, 0, 4)).toThrow(/no spread 4/);
  });

  it("sweeps the line's first spread with the shots it records (runSectionSweep)", () => {
    // a fixed shot at 60 m is nearest spread 3's centre (59 m): spread 1 does not record it
    const shots = [...input.spread.shots, { position: 60, label: "fixed" }];
    const spec = {
      modelIndex: 0,
      spacings: [2],
      parameter: { kind: "velocity" as const, layer: 2, values: [2500] },
    };
    const rolled = runSectionSweep(parse({ ...input, spread: { ...input.spread, shots } }), spec);
    const { rollAlong: _roll, ...first } = input.spread;
    const alone = runSectionSweep(parse({ ...input, spread: first }), spec);
    expect(Array.from(rolled.status)).toEqual(Array.from(alone.status));
    expect(Array.from(rolled.depthError)).toEqual(Array.from(alone.depthError));
    const allShots = runSectionSweep(parse({ ...input, spread: { ...first, shots } }), spec);
    // recording the far shot on spread 1 would read the channel floor into its depth error
    expect(Math.abs(allShots.depthError[0] - alone.depthError[0])).toBeGreaterThan(1);
  });

  it("refuses a section shorter than the whole line, naming the surface", () => {
    const short = structuredClone(input);
    (short.models[0] as { surface: number[][] }).surface = [
      [-5, 100],
      [50, 100],
    ];
    const r = parsePlan(short);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues.join("\n")).toMatch(/models\[0\]\.surface: .*reach -1 to 71 m/);
  });
});

describe("design sweep of a roll-along plan", () => {
  it("maps the line's first spread with the shots it records, as that spread alone", () => {
    const input: PlanInput = {
      models: [
        {
          name: "thin bed",
          layers: [
            { velocity: 400, thickness: 2.5 },
            { velocity: 1100, thickness: 3.5 },
            { velocity: 2200 },
          ],
        },
      ],
      spread: {
        spacing: 4,
        channels: 24,
        firstGeophone: 0,
        // a fixed shot at 100 m is 42 m from spread 2's centre (142 m), 54 m from spread 1's (46 m):
        // spread 1 does not record it
        shots: [...endShots, { position: 100, label: "fixed" }],
        rollAlong: { spreads: 2, overlap: 0 },
      },
    };
    const spec = {
      modelIndex: 0,
      axis: "spacing" as const,
      axisValues: [1, 2, 4, 6],
      parameter: { layer: 2, kind: "thickness" as const, min: 1, max: 6, steps: 4 },
    };
    const rolled = runSweep(parse(input), spec);
    const { rollAlong: _roll, ...spread } = input.spread;
    const first = runSweep(parse({ ...input, spread: { ...spread, shots: endShots } }), spec);
    expect(Array.from(rolled.status)).toEqual(Array.from(first.status));
    expect(Array.from(rolled.depthError)).toEqual(Array.from(first.depthError));
    const withFixed = runSweep(parse({ ...input, spread }), spec);
    // the far fixed shot would change the picture: recording it on spread 1 is not the same
    expect(Array.from(withFixed.status)).not.toEqual(Array.from(first.status));
  });
});

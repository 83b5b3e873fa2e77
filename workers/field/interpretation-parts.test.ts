// The small parts of the interpretation under the line, each against a closed form or a
// hand-worked value: branches (linear interpolation, straight extension, phantoming by a
// constant shift — Hagedoorn 1959; Palmer 1980), the GRM functions (Palmer 1980: XY = 0 is the
// plus-minus method), delay times (Barry 1967), the time-depth recursion (Telford, Geldart &
// Sheriff 1990 §4.3), local slopes (least squares, common practice), reciprocal checks,
// assignments and station elevations (CSV errors name the line).
import { describe, expect, it } from "vitest";
import { branchTimeAt, makeBranch, phantomBranch } from "./branch-times";
import { delayTimes, shotDelays } from "./delay-times";
import { grmFunctions, optimumXy, roughness } from "./grm";
import { fitSlope, localSlopes } from "./local-slope";
import { plusMinusTimes } from "./plus-minus";
import { reciprocalChecks, reciprocalTolerance } from "./reciprocal-times";
import { assignedLayer, checkAssignments, suggestAssignments } from "./refractor-assignment";
import { elevationProfile, parseElevationCsv, surfaceFromModels } from "./station-elevations";
import { thicknessAbove } from "./time-depth";
import { candidateDepth } from "./plan-interpretation";

// Two flat layers: v1 = 500, v2 = 2000, h = 5 → t(x) = x/2000 + 2·5·cos θ/500.
const v1 = 500;
const v2 = 2000;
const ti = (2 * 5 * Math.sqrt(1 - (v1 / v2) ** 2)) / v1;
const head = (s: number, r: number) => Math.abs(r - s) / v2 + ti;
const xs = [10, 12, 14, 16, 18, 20, 22, 24, 26, 28, 30];
const forward = makeBranch(
  0,
  1,
  xs.map((x) => ({ position: x, time: head(0, x) })),
);
const reverse = makeBranch(
  40,
  -1,
  xs.map((x) => ({ position: x, time: head(40, x) })),
);
const T = head(0, 40);

describe("branches", () => {
  it("interpolates between picks, extends straight within reach, and refuses beyond it", () => {
    expect(branchTimeAt(forward, 11)?.time).toBeCloseTo(head(0, 11), 12);
    expect(branchTimeAt(forward, 11)?.how).toBe("between");
    expect(branchTimeAt(forward, 40, 10)?.time).toBeCloseTo(head(0, 40), 12);
    expect(branchTimeAt(forward, 40, 10)?.how).toBe("beyond");
    expect(branchTimeAt(forward, 40, 5)).toBeNull();
  });

  it("phantoms a gap from a farther shot by their mean difference (parallel branches)", () => {
    const near = makeBranch(
      0,
      1,
      [20, 22, 24].map((x) => ({ position: x, time: head(0, x) })),
    );
    const far = makeBranch(
      -20,
      1,
      xs.map((x) => ({ position: x, time: head(-20, x) })),
    );
    const p = phantomBranch(near, [far]);
    const at12 = p.points.find((q) => q.position === 12)!;
    expect(at12.phantom).toBe(true);
    expect(at12.time).toBeCloseTo(head(0, 12), 12);
    expect(p.points.filter((q) => !q.phantom).map((q) => q.position)).toEqual([20, 22, 24]);
  });
});

describe("plus-minus, GRM and delay times on flat layers", () => {
  it("GRM with XY = 0 equals the plus-minus method; time-depth = h cos θ / v1 for any XY", () => {
    const pm = plusMinusTimes(forward, reverse, T, [16, 20]);
    const g0 = grmFunctions(forward, reverse, T, v2, [16, 20], 0);
    expect(g0[0].timeDepth).toBeCloseTo(pm[0].plus / 2, 12);
    const g4 = grmFunctions(forward, reverse, T, v2, [16, 20], 4);
    expect(g4[1].timeDepth).toBeCloseTo(ti / 2, 12);
    // velocity analysis function slope 1/v2 (Palmer 1980)
    expect((g4[1].velocityFunction - g4[0].velocityFunction) / 4).toBeCloseTo(1 / v2, 12);
  });

  it("the XY search prefers the two-layer estimate 2 h tan θ when every XY is equally smooth", () => {
    const expected = 2 * 5 * Math.tan(Math.asin(v1 / v2));
    const s = optimumXy(forward, reverse, T, v2, xs, 2, 8, expected);
    expect(Math.abs(s.optimum - expected)).toBeLessThanOrEqual(1);
    expect(s.candidates[0]).toMatchObject({ xy: 0 });
    expect(
      roughness([
        { position: 0, value: 0 },
        { position: 1, value: 1 },
      ]),
    ).toBeNull();
  });

  it("delay times give h cos θ / v1 with shot delays that sum to T − L/v (Barry 1967)", () => {
    const [da, db] = shotDelays(forward, reverse, T, v2);
    expect(da + db).toBeCloseTo(T - 40 / v2, 12);
    for (const d of delayTimes(forward, reverse, T, v2, xs)) expect(d.delay).toBeCloseTo(ti / 2, 9);
  });

  it("the time-depth recursion inverts t_G = Σ h_j cos θ_jn / v_j", () => {
    expect(thicknessAbove(ti / 2, [v1, v2], [])).toBeCloseTo(5, 9);
    // three layers 3 m (450 m/s) and 7 m (1500 m/s) over 4000 m/s
    const c = (v: number) => Math.sqrt(1 - (v / 4000) ** 2);
    const tG = (3 * c(450)) / 450 + (7 * c(1500)) / 1500;
    expect(thicknessAbove(tG, [450, 1500, 4000], [3])).toBeCloseTo(7, 9);
    expect(thicknessAbove(0.01, [2000, 1500], [])).toBeNaN();
  });
});

describe("local slopes and reciprocal checks", () => {
  it("fits slopes by least squares with the textbook error σ/√Sxx", () => {
    const f = fitSlope([0, 1, 2, 3], [1, 3, 5, 7], 0.1)!;
    expect(f.slope).toBeCloseTo(2, 12);
    expect(f.slopeError).toBeCloseTo(0.1 / Math.sqrt(5), 12);
    const local = localSlopes([0, 1, 2, 3, 4, 5], [0, 1, 2, 4, 6, 8], 3, 0.1);
    expect(local[0].slope).toBeCloseTo(1, 12);
    expect(local[5].slope).toBeCloseTo(2, 12);
    expect(() => localSlopes([0, 1], [0, 1], 1, 0.1)).toThrow(/at least 2/);
  });

  it("flags a pair whose reciprocal times differ by more than the tolerance", () => {
    expect(reciprocalTolerance(0.0005)).toBeCloseTo(0.00212, 5);
    const picks = [
      ...[0, 10, 20, 30, 40].map((r) => ({
        sourcePosition: 0,
        receiverPosition: r,
        time: r / 1000,
      })),
      ...[0, 10, 20, 30, 40].map((r) => ({
        sourcePosition: 40,
        receiverPosition: r,
        time: (40 - r) / 1000 + (r === 0 ? 0.005 : 0),
      })),
    ];
    const [c] = reciprocalChecks(picks, 0.0005, 5);
    expect(c.shots).toEqual([0, 40]);
    expect(c.difference).toBeCloseTo(-0.005, 12);
    expect(c.agrees).toBe(false);
  });
});

describe("assignments and elevations", () => {
  it("assigns by shot and segment, the deeper layer winning an overlap, and refuses bad entries", () => {
    const a = [
      { shot: 0, layer: 1, from: 0, to: 10 },
      { shot: 0, layer: 2, from: 10, to: 40 },
    ];
    expect(assignedLayer(a, { sourcePosition: 0, receiverPosition: 10 })).toBe(2);
    expect(assignedLayer(a, { sourcePosition: 5, receiverPosition: 10 })).toBeNull();
    expect(() => checkAssignments([{ shot: 0, layer: 0, from: 0, to: 1 }])).toThrow(
      /assignment 1: layer/,
    );
    expect(() => checkAssignments([{ shot: 0, layer: 2, from: 5, to: 1 }])).toThrow(/from ≤ to/);
  });

  it("suggests segments from runs of the same modelled wave", () => {
    const picks = [2, 4, 6, 8, 10].map((r) => ({
      sourcePosition: 0,
      receiverPosition: r,
      time: 0,
    }));
    const s = suggestAssignments(picks, (_s, r) => (r < 6 ? 1 : 2));
    expect(s).toEqual([
      { shot: 0, layer: 1, from: 2, to: 4 },
      { shot: 0, layer: 2, from: 6, to: 10 },
    ]);
  });

  it("reads station elevations, naming a bad line, and interpolates between stations", () => {
    const ok = parseElevationCsv("position_m,elevation_m\n0,100\n10,102\n");
    if (!ok.ok) throw new Error("expected ok");
    const profile = elevationProfile(ok.points);
    expect(profile(5)).toBeCloseTo(101, 12);
    expect(profile(-3)).toBe(100);
    const bad = parseElevationCsv("position_m,elevation_m\n0,100\n10,high\n0,3\n");
    expect(bad.ok).toBe(false);
    if (!bad.ok) {
      expect(bad.errors.map((e) => e.message)).toEqual([
        "line 3, column elevation_m: 'high' is not a number",
        "line 4, column position_m: position 0 m appears twice",
      ]);
    }
    expect(parseElevationCsv("x\n1\n").ok).toBe(false);
  });

  it("takes the surface of a section model and the depth of a layered candidate", () => {
    expect(
      surfaceFromModels([
        { layers: [] },
        {
          kind: "section",
          surface: [
            [0, 5],
            [10, 6],
          ],
        },
      ]),
    ).toEqual([
      { position: 0, elevation: 5 },
      { position: 10, elevation: 6 },
    ]);
    expect(surfaceFromModels([{ layers: [] }])).toBeNull();
    // plan-format.md: depth of the base of layer k at x = Σ thickness + x·tan(dip of layer k)
    const model = { layers: [{ velocity: 500, thickness: 4, dip: 45 }, { velocity: 2000 }] };
    expect(candidateDepth(model, 2, 3)).toBeCloseTo(7, 12);
    expect(candidateDepth(model, 3, 3)).toBeNull();
  });
});

describe("interpretPlanPicks (the one function of the screen, the CLI and the report)", () => {
  it("takes elevations from the plan's section surface and suggests the assignment from the best layered candidate", async () => {
    const { interpretPlanPicks } = await import("./plan-interpretation");
    const { flatPicks } = await import("./__fixtures__/reversed-picks");
    const picks = flatPicks([{ velocity: 500, thickness: 6 }, { velocity: 2200 }], [-1, 95]);
    const models = [
      { name: "far off", layers: [{ velocity: 500, thickness: 20 }, { velocity: 4000 }] },
      { name: "six metres", layers: [{ velocity: 500, thickness: 6 }, { velocity: 2200 }] },
      {
        kind: "section",
        name: "surveyed ground",
        surface: [
          [-10, 110],
          [110, 110],
        ],
        layers: [],
      },
    ];
    const r = interpretPlanPicks({ models, criteria: { pickError: 0.0005 } }, picks);
    expect(r.suggestedFrom).toBe("six metres");
    expect(r.elevationSource).toBe("plan");
    expect(r.result.datum).toBe(110);
    for (const d of r.result.refractors[0].depth) {
      expect(d.elevation).toBeCloseTo(104, 1);
      expect(d.depth).toBeCloseTo(6, 1);
    }
    expect(r.misfits.map((m) => m.name)).toEqual(["far off", "six metres"]);
    expect(r.misfits[1].layers[0].rms).toBeLessThan(0.06);
    expect(() => interpretPlanPicks({ models: [] }, picks)).toThrow(/no layered ground model/);
  });
});

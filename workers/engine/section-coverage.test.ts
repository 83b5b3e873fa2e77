import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { analyzePlan } from "./analysis";
import type { GroundModel, Plan, SectionModel } from "./plan-schema";
import { solveSection } from "./section-arrivals";
import { isSectionAnalysis } from "./section-analysis";
import { sectionFromLayered } from "./section-convert";
import {
  exitPoint,
  FEATURE_DIP_TOLERANCE_DEG,
  interfaceFeatures,
  practicalSpacing,
} from "./section-features";
import { parsePlan } from "./validate";

const root = fileURLToPath(new URL("../../", import.meta.url));

function planOf(input: unknown): Plan {
  const r = parsePlan(input);
  if (!r.ok) throw new Error(r.issues.join("\n"));
  return r.plan;
}

const line = (pts: [number, number][]) => ({
  xs: Float64Array.from(pts.map((p) => p[0])),
  ys: Float64Array.from(pts.map((p) => p[1])),
});

/** Dip of a segment, degrees (plane geometry: atan of drop over run). */
const dipOf = (a: [number, number], b: [number, number]) =>
  (Math.atan2(a[1] - b[1], b[0] - a[0]) * 180) / Math.PI;

describe("interface features", () => {
  it("keeps a planar (collinear) interface as one feature", () => {
    const f = interfaceFeatures(
      line([
        [0, 95],
        [30, 93],
        [60, 91],
        [120, 87],
      ]),
    );
    expect(f).toHaveLength(1);
    expect([f[0].from, f[0].to]).toEqual([0, 120]);
    // plane geometry: a drop of 8 m over 120 m
    expect(f[0].dip).toBeCloseTo((Math.atan(8 / 120) * 180) / Math.PI, 9);
  });

  it("splits a channel into shoulders, walls and floor, and keeps a gently curved floor whole", () => {
    // the floor is drawn with three segments whose dips differ by about 4.3° (< 5°)
    const pts: [number, number][] = [
      [0, 95],
      [40, 95],
      [50, 91],
      [54, 90.85],
      [58, 91],
      [68, 95],
      [120, 95],
    ];
    expect(Math.abs(dipOf(pts[2], pts[3]) - dipOf(pts[3], pts[4]))).toBeLessThan(
      FEATURE_DIP_TOLERANCE_DEG,
    );
    const f = interfaceFeatures(line(pts));
    expect(f.map((x) => [x.from, x.to])).toEqual([
      [0, 40],
      [40, 50],
      [50, 58],
      [58, 68],
      [68, 120],
    ]);
    expect(f[1].dip).toBeCloseTo(dipOf(pts[1], pts[2]), 9);
  });

  it("makes a vertical step (two points at one position) a feature of its own", () => {
    const f = interfaceFeatures(
      line([
        [0, 95],
        [50, 95],
        [50, 90],
        [100, 90],
      ]),
    );
    expect(f.map((x) => [x.from, x.to])).toEqual([
      [0, 50],
      [50, 50],
      [50, 100],
    ]);
  });

  it("rounds a spacing down to a practical value", () => {
    // 8 m / 3 = 2.67 m → 2.5 m; 1 m / 3 = 0.33 m → 0.3 m (common practice: cable marks)
    expect(practicalSpacing(8, 3)).toBe(2.5);
    expect(practicalSpacing(12, 3)).toBe(4);
    expect(practicalSpacing(1, 3)).toBe(0.3);
  });
});

describe("exit points of head-wave rays", () => {
  it("lie h·tan θc from the geophone towards the shot on a flat two-layer model", () => {
    // Telford et al. 1990 §4.3 (closed form): the head wave leaves a flat refractor at the
    // critical angle θc = asin(v1/v2), so the exit point is h·tan θc from the geophone
    // towards the shot (h the refractor depth).
    const v1 = 500;
    const v2 = 2500;
    const h = 5;
    const plan = planOf({
      format: "spreadsight-plan/2",
      name: "flat",
      models: [
        {
          name: "m",
          kind: "section",
          surface: [
            [-5, 100],
            [125, 100],
          ],
          layers: [
            {
              velocity: v1,
              base: [
                [-5, 100 - h],
                [125, 100 - h],
              ],
            },
            { velocity: v2 },
          ],
        },
      ],
      spread: {
        spacing: 2,
        channels: 60,
        firstGeophone: 1,
        shots: [{ position: 0 }, { position: 120 }],
      },
    });
    const solved = solveSection(plan.models[0] as SectionModel, plan.spread);
    const offset = h * Math.tan(Math.asin(v1 / v2));
    let checked = 0;
    for (const shot of solved.shots) {
      solved.geophoneX.forEach((g, k) => {
        if (shot.via[k] !== 1 || Math.abs(g - shot.x) < 20) return;
        const towardsShot = g - Math.sign(g - shot.x) * offset;
        expect(exitPoint(shot.from[k], shot.to[k], g)).toBeCloseTo(towardsShot, 0);
        expect(Math.abs(exitPoint(shot.from[k], shot.to[k], g) - towardsShot)).toBeLessThan(
          solved.grid.h,
        );
        checked++;
      });
    }
    expect(checked).toBeGreaterThan(60);
  });
});

/**
 * Brute-force Fermat search (written here, independent of the solver) for a two-layer
 * section under a flat surface at `zs`: the first arrival at a geophone is the least time
 * over an entry point a and an exit point e on the refractor of
 *   |shot − a| / v1 + L(a, e) / v2 + |e − geophone| / v1,
 * L the shortest path in the (homogeneous) refractor between a and e: the taut string
 * under the polyline, i.e. the lower convex hull of a, the vertices between and e
 * (straight rays in homogeneous layers, Fermat's principle; Snell's law follows). The
 * legs in the top layer must stay above the refractor. Returns each geophone's exit point
 * (searched within `window`, every 5 cm; entry points every 20 cm), or null when the direct wave is first.
 */
function fermatExits(
  base: [number, number][],
  zs: number,
  v1: number,
  v2: number,
  shot: number,
  geophones: number[],
  window: [number, number],
): (number | null)[] {
  const elev = (x: number) => {
    for (let i = 1; i < base.length; i++) {
      if (x <= base[i][0]) {
        const [x0, y0] = base[i - 1];
        const [x1, y1] = base[i];
        return y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
      }
    }
    return base[base.length - 1][1];
  };
  const above = (ax: number, az: number, bx: number, bz: number) => {
    for (let q = 1; q < 20; q++) {
      const x = ax + ((bx - ax) * q) / 20;
      if (az + ((bz - az) * q) / 20 < elev(x) - 1e-9) return false;
    }
    return true;
  };
  const hull = (pts: [number, number][]) => {
    const h: [number, number][] = [];
    for (const p of pts) {
      while (h.length >= 2) {
        const a = h[h.length - 2];
        const b = h[h.length - 1];
        if ((b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0]) <= 0) h.pop();
        else break;
      }
      h.push(p);
    }
    let L = 0;
    for (let i = 1; i < h.length; i++) {
      L += Math.hypot(h[i][0] - h[i - 1][0], h[i][1] - h[i - 1][1]);
    }
    return L;
  };
  // time to each candidate exit point through the refractor, entry within 20 m of the shot
  const exits: { e: number; t: number }[] = [];
  for (let e = window[0]; e <= window[1] + 1e-9; e += 0.05) {
    const dir = Math.sign(e - shot);
    let t = Infinity;
    for (let d = 0; d <= 20 && d <= Math.abs(e - shot); d += 0.2) {
      const a = shot + dir * d;
      const lo = Math.min(a, e);
      const hi = Math.max(a, e);
      const pts: [number, number][] = [
        [lo, elev(lo)],
        ...base.filter(([x]) => x > lo && x < hi),
        [hi, elev(hi)],
      ];
      t = Math.min(t, Math.hypot(a - shot, zs - elev(a)) / v1 + hull(pts) / v2);
    }
    exits.push({ e, t });
  }
  return geophones.map((g) => {
    let best = Math.abs(g - shot) / v1; // the direct wave
    let exit: number | null = null;
    for (const { e, t } of exits) {
      if (Math.sign(e - shot) !== Math.sign(g - shot)) continue;
      const total = t + Math.hypot(g - e, zs - elev(e)) / v1;
      if (total < best && above(e, elev(e), g, zs)) {
        best = total;
        exit = e;
      }
    }
    return exit;
  });
}

describe("a buried channel in rockhead is judged by the exit points on its floor", () => {
  // A box-like channel 4 m deep cut into rockhead 5 m down: walls dipping 22°, an 8 m floor.
  const base: [number, number][] = [
    [10, 95],
    [40, 95],
    [50, 91],
    [58, 91],
    [68, 95],
    [110, 95],
  ];
  const planAt = (spacing: number, firstGeophone: number) =>
    planOf({
      format: "spreadsight-plan/2",
      name: "channel",
      models: [
        {
          name: "box channel",
          kind: "section",
          surface: [
            [10, 100],
            [110, 100],
          ],
          layers: [
            { name: "clay", velocity: 500, base },
            { name: "rockhead", velocity: 2500 },
          ],
        },
      ],
      spread: {
        spacing,
        channels: Math.floor((100 - firstGeophone) / spacing) + 1,
        firstGeophone,
        shots: [{ position: 20 }, { position: 100 }],
      },
      criteria: { minGeophones: 3 },
    });

  /** Geophones (positions) whose Fermat exit point falls on the floor (50–58 m), per shot. */
  const fermatFloor = (plan: Plan, shot: number) => {
    const xs = Array.from(
      { length: plan.spread.channels },
      (_, i) => plan.spread.firstGeophone + i * plan.spread.spacing,
    ).filter((g) => g > 44 && g < 66);
    const exits = fermatExits(base, 100, 500, 2500, shot, xs, [44, 66]);
    return xs.filter((_, i) => {
      const e = exits[i];
      return e !== null && e >= 50 && e <= 58;
    });
  };

  it("flags the floor under a 4 m spacing with the exit-point count of each branch", () => {
    const plan = planAt(4, 21);
    const a = analyzePlan(plan).models[0];
    if (!isSectionAnalysis(a)) throw new Error("not a section analysis");
    const rock = a.coverage[0];
    const floor = rock.stretches.filter((s) => s.feature === "channel floor");
    expect(floor.map((s) => [s.shot, s.side])).toEqual([
      [0, "forward"],
      [1, "reverse"],
    ]);
    for (const s of floor) {
      const expected = fermatFloor(plan, plan.spread.shots[s.shot ?? 0].position);
      expect(expected.length).toBeGreaterThan(0);
      expect(expected.length).toBeLessThan(3);
      expect(s.geophonePositions).toEqual(expected);
      expect(s.geophones).toBe(expected.length);
      expect([s.from, s.to, s.status, s.judged]).toEqual([50, 58, "under-sampled", true]);
    }
    expect(rock.status).toBe("under-sampled");
    expect(rock.summary).toContain(
      `the channel floor from 50 to 58 m is seen on ${floor[0].geophones} geophone`,
    );
    expect(rock.summary).toContain("by shot 1 forward: under-sampled");
    const rec = a.section.recommendations.find((r) => r.from === 50 && r.to === 58);
    // 8 m / 3 exit points = 2.67 m, rounded down to the practical 2.5 m (common practice)
    expect(rec?.spacing).toBe(2.5);
    expect(rec?.text).toContain("channel floor");
    // each feature stretch follows its branch's run stretch
    const i = rock.stretches.indexOf(floor[0]);
    expect(rock.stretches[i - 1].feature).toBeUndefined();
    expect(rock.stretches[i - 1].shot).toBe(0);
  });

  it("resolves the floor under a 1 m spacing", () => {
    const plan = planAt(1, 20.5);
    const a = analyzePlan(plan).models[0];
    if (!isSectionAnalysis(a)) throw new Error("not a section analysis");
    const forward = fermatFloor(plan, 20);
    const reverse = fermatFloor(plan, 100);
    expect(Math.max(forward.length, reverse.length)).toBeGreaterThanOrEqual(3);
    const rock = a.coverage[0];
    expect(rock.stretches.filter((s) => s.feature === "channel floor" && s.judged)).toEqual([]);
    expect(rock.status).toBe("resolved");
  });

  it("judges a feature resolved when another branch puts enough exit points on it", () => {
    const a = analyzePlan(planAt(4, 21)).models[0];
    if (!isSectionAnalysis(a)) throw new Error("not a section analysis");
    const rock = a.coverage[0];
    const weak = rock.stretches.filter((s) => s.feature !== undefined && !s.judged);
    expect(weak.length).toBeGreaterThan(0);
    for (const s of weak) {
      // another branch put ≥ 3 exit points on the same feature (rule: reversed shots image
      // the same refractor; common practice)
      expect(rock.summary).toContain(`from ${s.from} to ${s.to} m is seen on ${s.geophones}`);
      expect(rock.summary).toMatch(/resolved by shot \d (forward|reverse)/);
    }
  });
});

describe("planar sections keep the layered verdicts (no feature stretches)", () => {
  // The layered engine's verdicts are the reference (as section-analysis.test.ts): a flat or
  // planar-dipping section of the same ground is one feature per interface, so the
  // exit-point rule adds nothing and the verdicts stay the layered ones.
  it.each(["two-layer-simple", "dipping-reversed"])(
    "docs/examples/%s.json as a section",
    (name) => {
      const plan = planOf(JSON.parse(readFileSync(`${root}docs/examples/${name}.json`, "utf8")));
      const s = plan.spread;
      const xs = [s.firstGeophone, s.firstGeophone + (s.channels - 1) * s.spacing];
      for (const shot of s.shots) xs.push(shot.position);
      const from = Math.min(...xs) - 2;
      const to = Math.max(...xs) + 2;
      const sectionPlan: Plan = {
        ...plan,
        format: "spreadsight-plan/2",
        models: plan.models.map((m) => sectionFromLayered(m as GroundModel, from, to, 100)),
      };
      const layered = analyzePlan(plan).models;
      analyzePlan(sectionPlan).models.forEach((section, i) => {
        if (!isSectionAnalysis(section)) throw new Error("not a section analysis");
        expect(section.refractors.map((r) => r.status)).toEqual(
          layered[i].refractors.map((r) => r.status),
        );
        for (const c of section.coverage) {
          expect(c.stretches.filter((x) => x.feature !== undefined)).toEqual([]);
        }
      });
    },
  );
});

describe("docs/examples/section-buried-channel.json", () => {
  it("flags the channel floor of rockhead with its spread", () => {
    const plan = planOf(
      JSON.parse(readFileSync(`${root}docs/examples/section-buried-channel.json`, "utf8")),
    );
    const a = analyzePlan(plan).models[0];
    if (!isSectionAnalysis(a)) throw new Error("not a section analysis");
    const rock = a.coverage[1];
    // the mudstone's top drawn in the example: walls 44–50 m and 58–64 m, floor 50–58 m
    const floor = rock.stretches.filter((s) => s.feature === "channel floor" && s.judged);
    expect(floor.length).toBeGreaterThan(0);
    for (const s of floor) {
      expect([s.from, s.to, s.status]).toEqual([50, 58, "under-sampled"]);
      expect(s.geophones).toBeLessThan(plan.criteria.minGeophones);
    }
    expect(rock.status).toBe("under-sampled");
    expect(rock.summary).toMatch(/the channel floor from 50 to 58 m is seen on \d geophone/);
  });
});

// Field check maths. Physics checks name their source beside them: the flat-layer formulas of
// Telford, Geldart & Sheriff (1990) §4.3 and the two-layer crossover form of Kearey, Brooks &
// Hill (2002) ch. 5, both as quoted in docs of this project (design.md). Models are invented.
import { describe, expect, it } from "vitest";
import { compareModels, fitModel, residualsFor } from "./residuals";
import { fitSegment } from "./segment-fit";
import { interceptTimeDepths } from "./intercept-time";
import { localOutliers, misfitWarnings, straightPieces } from "./misfit-pattern";
import { groupByShotSide, shotSidePoints, type ObservedPick } from "./field-picks";
import { firstArrival, interceptTime, type TestLayer } from "./__fixtures__/flat-layers";
import { seededNormal } from "./__fixtures__/random";
import { lineCovariance, propagateUncertainty } from "../engine/uncertainty";

function picksFrom(
  layers: TestLayer[],
  options: { shots: number[]; noise?: number; seed?: number },
): ObservedPick[] {
  const t = firstArrival(layers);
  const noise = seededNormal(options.seed ?? 1);
  const picks: ObservedPick[] = [];
  for (const s of options.shots) {
    for (let k = 0; k < 48; k++) {
      const r = k * 2;
      if (r === s) continue;
      picks.push({
        sourcePosition: s,
        receiverPosition: r,
        time: t(s, r) + (options.noise ?? 0) * noise(),
      });
    }
  }
  return picks;
}

describe("residuals and model comparison", () => {
  const truth: TestLayer[] = [{ velocity: 450, thickness: 4 }, { velocity: 1800 }];
  const picks = picksFrom(truth, { shots: [-1, 95], noise: 0.0005, seed: 3 });

  it("gives observed minus modelled time per pick, with the offset", () => {
    const r = residualsFor([{ sourcePosition: 10, receiverPosition: 4, time: 0.02 }], () => 0.015);
    expect(r[0].offset).toBe(6);
    expect(r[0].residual).toBeCloseTo(0.005, 12);
  });

  it("leaves picks the model cannot time out of the RMS and counts them", () => {
    const fit = fitModel("gap", picks, (s, g) => (g > 50 ? Number.NaN : firstArrival(truth)(s, g)));
    expect(fit.unmodelled).toBeGreaterThan(0);
    expect(fit.count + fit.unmodelled).toBe(picks.length);
    expect(fit.residuals.filter((r) => r.residual === null)).toHaveLength(fit.unmodelled);
  });

  it("finds the true model best, with an RMS near the pick noise", () => {
    const { fits, best } = compareModels(picks, [
      {
        name: "thick cover",
        firstArrival: firstArrival([{ velocity: 450, thickness: 8 }, { velocity: 1800 }]),
      },
      { name: "as drilled", firstArrival: firstArrival(truth) },
      {
        name: "fast cover",
        firstArrival: firstArrival([{ velocity: 700, thickness: 4 }, { velocity: 1800 }]),
      },
    ]);
    expect(best).toBe(1);
    expect(fits[1].rms).toBeGreaterThan(0.0003);
    expect(fits[1].rms).toBeLessThan(0.0007);
    expect(fits[0].meanResidual).toBeLessThan(0);
  });

  it("does not prefer a model that leaves picks out", () => {
    const { best } = compareModels(picks, [
      { name: "partial", firstArrival: (s, g) => (g > 20 ? Infinity : firstArrival(truth)(s, g)) },
      {
        name: "near miss",
        firstArrival: firstArrival([{ velocity: 460, thickness: 4.2 }, { velocity: 1800 }]),
      },
    ]);
    expect(best).toBe(1);
  });

  it("throws a RangeError for a pick with a non-finite time", () => {
    expect(() =>
      residualsFor([{ sourcePosition: 0, receiverPosition: 2, time: Number.NaN }], () => 0),
    ).toThrow(RangeError);
  });
});

describe("groupByShotSide", () => {
  it("splits picks by shot and side and sorts them by offset", () => {
    const groups = groupByShotSide([
      { sourcePosition: 10, receiverPosition: 14, time: 0.01 },
      { sourcePosition: 10, receiverPosition: 6, time: 0.01 },
      { sourcePosition: 10, receiverPosition: 12, time: 0.005 },
      { sourcePosition: 0, receiverPosition: 2, time: 0.004 },
    ]);
    expect(groups.map((g) => [g.sourcePosition, g.side, g.picks.map((p) => p.offset)])).toEqual([
      [0, "forward", [2]],
      [10, "forward", [2, 4]],
      [10, "reverse", [4]],
    ]);
  });
});

describe("fitSegment", () => {
  it("recovers slope and intercept exactly from points on a line, with zero errors", () => {
    const pts = [10, 12, 14, 16].map((x) => ({ offset: x, time: 0.012 + x / 2000 }));
    const fit = fitSegment(pts, [10, 16]);
    if (!fit.ok) throw new Error(fit.reason);
    expect(fit.velocity).toBeCloseTo(2000, 6);
    expect(fit.intercept).toBeCloseTo(0.012, 10);
    expect(fit.slopeError).toBeCloseTo(0, 10);
    expect(fit.count).toBe(4);
  });

  it("gives standard errors that match the scatter of seeded noisy picks", () => {
    // Checked by repetition: the spread of fitted intercepts over many noise draws should be
    // close to the reported standard error (least-squares theory, common practice).
    const intercepts: number[] = [];
    let reported = 0;
    for (let seed = 1; seed <= 200; seed++) {
      const noise = seededNormal(seed);
      const pts = Array.from({ length: 10 }, (_, k) => ({
        offset: 20 + 2 * k,
        time: 0.01 + (20 + 2 * k) / 1500 + 0.001 * noise(),
      }));
      const fit = fitSegment(pts, [20, 38]);
      if (!fit.ok) throw new Error(fit.reason);
      intercepts.push(fit.intercept);
      reported += (fit.interceptError ?? 0) / 200;
    }
    const mean = intercepts.reduce((a, b) => a + b, 0) / intercepts.length;
    const sd = Math.sqrt(
      intercepts.reduce((a, b) => a + (b - mean) ** 2, 0) / (intercepts.length - 1),
    );
    expect(mean).toBeCloseTo(0.01, 3);
    expect(reported / sd).toBeGreaterThan(0.8);
    expect(reported / sd).toBeLessThan(1.2);
  });

  it("gives no standard errors for two picks and refuses fewer, one offset or a falling line", () => {
    const two = fitSegment(
      [
        { offset: 1, time: 0.002 },
        { offset: 3, time: 0.006 },
      ],
      [0, 5],
    );
    expect(two.ok && two.velocityError).toBeNull();
    expect(fitSegment([{ offset: 1, time: 0.002 }], [0, 5])).toMatchObject({ ok: false, count: 1 });
    expect(
      fitSegment(
        [
          { offset: 1, time: 0.002 },
          { offset: 1, time: 0.003 },
        ],
        [0, 5],
      ).ok,
    ).toBe(false);
    expect(
      fitSegment(
        [
          { offset: 1, time: 0.004 },
          { offset: 3, time: 0.002 },
        ],
        [0, 5],
      ),
    ).toMatchObject({
      ok: false,
      reason: "time does not increase with offset in this range",
    });
    expect(() => fitSegment([], [5, 1])).toThrow(RangeError);
  });
});

describe("interceptTimeDepths", () => {
  it("recovers a two-layer thickness: h1 = t_i v1 v2 / (2√(v2² − v1²)) (Telford et al. 1990 §4.3)", () => {
    const layers: TestLayer[] = [{ velocity: 500, thickness: 5 }, { velocity: 2000 }];
    const ti = interceptTime(layers, 1);
    const result = interceptTimeDepths([
      { velocity: 500, intercept: 0 },
      { velocity: 2000, intercept: ti },
    ]);
    if (!result.ok) throw new Error(result.reason);
    expect(result.layers[0].thickness).toBeCloseTo(5, 9);
    expect(result.layers[1].depth).toBeCloseTo(5, 9);
    expect(result.layers[1].thickness).toBeNull();
    // Independent check by the crossover distance (Kearey, Brooks & Hill 2002 ch. 5):
    // x_co = t_i / (1/v1 − 1/v2), h = (x_co/2)·√((v2 − v1)/(v2 + v1)).
    const xco = ti / (1 / 500 - 1 / 2000);
    expect(result.layers[0].thickness).toBeCloseTo((xco / 2) * Math.sqrt(1500 / 2500), 9);
  });

  it("recovers three- and four-layer thicknesses by the recursion of Telford et al. 1990 §4.3", () => {
    const layers: TestLayer[] = [
      { velocity: 400, thickness: 3 },
      { velocity: 1500, thickness: 8 },
      { velocity: 2600, thickness: 12 },
      { velocity: 4500 },
    ];
    const segments = layers.map((l, n) => ({
      velocity: l.velocity,
      intercept: n === 0 ? 0 : interceptTime(layers, n),
    }));
    const result = interceptTimeDepths(segments);
    if (!result.ok) throw new Error(result.reason);
    expect(result.layers.map((l) => l.thickness)).toEqual([
      expect.closeTo(3, 9),
      expect.closeTo(8, 9),
      expect.closeTo(12, 9),
      null,
    ]);
    expect(result.layers[3].depth).toBeCloseTo(23, 9);
    expect(result.notes).toEqual([]);
  });

  it("propagates segment errors into thickness errors that match a seeded repetition", () => {
    const layers: TestLayer[] = [{ velocity: 600, thickness: 6 }, { velocity: 2400 }];
    const ti = interceptTime(layers, 1);
    const sigmaT = 0.001;
    const one = interceptTimeDepths([
      { velocity: 600, intercept: 0, velocityError: 0 },
      { velocity: 2400, intercept: ti, interceptError: sigmaT },
    ]);
    if (!one.ok) throw new Error(one.reason);
    // Linear in t_i: σ_h = σ_t · v1 v2 / (2√(v2² − v1²)).
    expect(one.layers[0].thicknessError).toBeCloseTo(
      (sigmaT * 600 * 2400) / (2 * Math.sqrt(2400 ** 2 - 600 ** 2)),
      6,
    );
    expect(one.layers[1].depthError).toBeCloseTo(one.layers[0].thicknessError ?? -1, 9);
  });

  it("depth ± keeps each fit's slope–intercept covariance: agrees with a seeded repetition and with the planner", () => {
    // Two layers, picks every 2 m, σ_t = 0.5 ms. Independent check: repeat the whole reading
    // (two least-squares fits → intercept-time depth) 3000 times with seeded noise and take the
    // spread of the depths (a brute-force Monte Carlo written here). The planner's propagation
    // (workers/engine/uncertainty.ts, J C Jᵀ with the full covariance) must agree too.
    const layers: TestLayer[] = [{ velocity: 500, thickness: 6 }, { velocity: 2200 }];
    const t = firstArrival(layers);
    const sigmaT = 0.0005;
    const direct = [2, 4, 6, 8, 10, 12];
    const head = Array.from({ length: 14 }, (_, i) => 24 + 4 * i);
    const noise = seededNormal(77);
    const depths: number[] = [];
    let last: ReturnType<typeof interceptTimeDepths> | null = null;
    const lsq = (xs: number[], ts: number[]) => {
      const n = xs.length;
      const mx = xs.reduce((a, b) => a + b, 0) / n;
      const mt = ts.reduce((a, b) => a + b, 0) / n;
      let sxx = 0;
      let sxt = 0;
      xs.forEach((x, i) => {
        sxx += (x - mx) ** 2;
        sxt += (x - mx) * (ts[i] - mt);
      });
      const p = sxt / sxx;
      return { p, tau: mt - p * mx, mx, sxx, n };
    };
    for (let r = 0; r < 3000; r++) {
      const a = lsq(
        direct,
        direct.map((x) => t(0, x) + sigmaT * noise()),
      );
      const b = lsq(
        head,
        head.map((x) => t(0, x) + sigmaT * noise()),
      );
      const cov = (f: typeof a) => ({
        velocityError: Math.sqrt(sigmaT ** 2 / f.sxx) / f.p ** 2,
        interceptError: Math.sqrt(sigmaT ** 2 * (1 / f.n + f.mx ** 2 / f.sxx)),
        velocityInterceptCovariance: (sigmaT ** 2 * f.mx) / f.sxx / f.p ** 2,
      });
      last = interceptTimeDepths([
        { velocity: 1 / a.p, intercept: a.tau, ...cov(a) },
        { velocity: 1 / b.p, intercept: b.tau, ...cov(b) },
      ]);
      if (last.ok) depths.push(last.layers[1].depth);
    }
    expect(depths.length).toBe(3000);
    const mean = depths.reduce((x, y) => x + y, 0) / depths.length;
    const spread = Math.sqrt(depths.reduce((x, y) => x + (y - mean) ** 2, 0) / (depths.length - 1));
    if (!last?.ok) throw new Error("no interpretation");
    const predicted = last.layers[1].depthError ?? NaN;
    // First-order propagation against the Monte Carlo spread: within 10 % (3000 draws give the
    // spread to about ±1.3 %; the rest is the linearisation).
    expect(predicted / spread).toBeGreaterThan(0.9);
    expect(predicted / spread).toBeLessThan(1.1);
    // The planner's propagation of the same lines and σ_t (free direct-wave intercept).
    const stats = (xs: number[]) => ({
      n: xs.length,
      sum: xs.reduce((x, y) => x + y, 0),
      sumSq: xs.reduce((x, y) => x + y * y, 0),
    });
    const exact = [{ intercept: interceptTime(layers, 1), slowness: 1 / 2200 }];
    const planner = propagateUncertainty(
      1 / 500,
      lineCovariance(stats(direct), sigmaT).varSlowness,
      exact,
      [lineCovariance(stats(head), sigmaT)],
    );
    const exactReading = interceptTimeDepths([
      {
        velocity: 500,
        intercept: 0,
        velocityError: Math.sqrt(sigmaT ** 2 / lsq(direct, direct).sxx) * 500 ** 2,
      },
      {
        velocity: 2200,
        intercept: exact[0].intercept,
        velocityError: Math.sqrt(lineCovariance(stats(head), sigmaT).varSlowness) * 2200 ** 2,
        interceptError: Math.sqrt(lineCovariance(stats(head), sigmaT).varIntercept),
        velocityInterceptCovariance: -lineCovariance(stats(head), sigmaT).covariance * 2200 ** 2,
      },
    ]);
    if (!exactReading.ok) throw new Error(exactReading.reason);
    expect(exactReading.layers[1].depthError).toBeCloseTo(planner.depthSigma[0], 4);
  });

  it("refuses velocities that do not increase, and segments that imply a negative thickness", () => {
    expect(
      interceptTimeDepths([
        { velocity: 800, intercept: 0 },
        { velocity: 600, intercept: 0.01 },
      ]),
    ).toMatchObject({
      ok: false,
    });
    const bad = interceptTimeDepths([
      { velocity: 400, intercept: 0 },
      { velocity: 1500, intercept: 0.03 },
      { velocity: 3000, intercept: 0.01 },
    ]);
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.reason).toMatch(/thickness of -\d+\.\d\d m for layer 2/);
    expect(() => interceptTimeDepths([{ velocity: 400, intercept: 0 }])).toThrow(RangeError);
  });

  it("notes a direct-wave intercept far from zero", () => {
    const result = interceptTimeDepths([
      { velocity: 500, intercept: 0.003 },
      { velocity: 2000, intercept: 0.02 },
    ]);
    expect(result.ok && result.notes[0]).toMatch(/direct-wave segment has an intercept of 3.0 ms/);
  });

  it("recovers the layers from noisy picks through segment fits (end to end)", () => {
    const truth: TestLayer[] = [
      { velocity: 500, thickness: 4 },
      { velocity: 1600, thickness: 10 },
      { velocity: 4200 },
    ];
    const picks = picksFrom(truth, { shots: [-1], noise: 0.0003, seed: 9 });
    const pts = shotSidePoints(picks, -1, "forward");
    // Ranges read off the time–offset plot (crossovers of this model are at about 11 m and 32 m).
    const fits = [fitSegment(pts, [0, 9]), fitSegment(pts, [13, 29]), fitSegment(pts, [35, 95])];
    const segments = fits.map((f) => {
      if (!f.ok) throw new Error(f.reason);
      return f;
    });
    const result = interceptTimeDepths(segments);
    if (!result.ok) throw new Error(result.reason);
    // Tolerance: within 3 standard errors of the truth, and within 15 % (our choice).
    expect(Math.abs((result.layers[0].thickness ?? 0) - 4)).toBeLessThan(
      3 * (result.layers[0].thicknessError ?? 0) + 0.05,
    );
    expect(result.layers[2].depth).toBeGreaterThan(14 * 0.85);
    expect(result.layers[2].depth).toBeLessThan(14 * 1.15);
  });
});

describe("misfitWarnings", () => {
  const planned: TestLayer[] = [{ velocity: 500, thickness: 6 }, { velocity: 3000 }];

  it("stays quiet when the picks follow the model within their error (20 seeds, two plans)", () => {
    const threeLayer: TestLayer[] = [
      { velocity: 400, thickness: 3 },
      { velocity: 1400, thickness: 6 },
      { velocity: 3500 },
    ];
    for (const plan of [planned, threeLayer]) {
      for (let seed = 21; seed <= 40; seed++) {
        const picks = picksFrom(plan, { shots: [-1, 95], noise: 0.0005, seed });
        expect(misfitWarnings(picks, firstArrival(plan), { pickError: 0.0005 })).toEqual([]);
      }
    }
  });

  it("names a middle offset range of early picks and the extra break of a layer the plan missed", () => {
    // Truth: a 1200 m/s layer between the cover and the refractor, with the same intercept
    // time for the 3000 m/s refractor as the plan, so only the middle offsets differ.
    const truth: TestLayer[] = [
      { velocity: 500, thickness: 2.5 },
      { velocity: 1200, thickness: 9 },
      { velocity: 3000 },
    ];
    const ti = interceptTime(truth, 2);
    const h1 = (ti * 500 * 3000) / (2 * Math.sqrt(3000 ** 2 - 500 ** 2));
    const plan: TestLayer[] = [{ velocity: 500, thickness: h1 }, { velocity: 3000 }];
    const picks = picksFrom(truth, { shots: [-1], noise: 0.0003, seed: 5 });
    const warnings = misfitWarnings(picks, firstArrival(plan), { pickError: 0.0005 });
    const early = warnings.filter((w) => w.kind === "early");
    expect(early).toHaveLength(1);
    expect(early[0].from).toBeGreaterThan(1);
    expect(early[0].to).toBeLessThan(90);
    expect(early[0].message).toMatch(
      /^Picks are early by .* between \d+(\.\d)? m and \d+(\.\d)? m offset: a faster layer whose segment the model lacks/,
    );
    expect(warnings.some((w) => w.kind === "extra-break")).toBe(true);
    expect(warnings.every((w) => w.kind !== "late")).toBe(true);
  });

  it("names late picks out to the far end when the cover is thicker than planned", () => {
    const truth: TestLayer[] = [{ velocity: 500, thickness: 9 }, { velocity: 3000 }];
    const picks = picksFrom(truth, { shots: [95], noise: 0.0003, seed: 8 });
    const warnings = misfitWarnings(picks, firstArrival(planned), { pickError: 0.0005 });
    const late = warnings.filter((w) => w.kind === "late");
    expect(late).toHaveLength(1);
    expect(late[0].side).toBe("reverse");
    expect(late[0].to).toBe(95);
    expect(late[0].message).toMatch(/thicker cover/);
  });

  it("names a modelled break the picks do not show", () => {
    // The plan has a 3000 m/s refractor; the ground has none within reach (one slow layer).
    const picks = picksFrom([{ velocity: 500 }], { shots: [-1], noise: 0.0003, seed: 2 });
    const warnings = misfitWarnings(picks, firstArrival(planned), { pickError: 0.0005 });
    expect(warnings.some((w) => w.kind === "missing-break")).toBe(true);
  });

  it("splits noise-free straight pieces at their true break", () => {
    const x = Array.from({ length: 20 }, (_, k) => 2 * k + 1);
    const t = x.map((v) => Math.min(v / 500, 0.02 + v / 2500));
    const pieces = straightPieces(x, t, 0.0005, 3);
    expect(pieces).toHaveLength(2);
    // Crossover at x = 0.02 / (1/500 − 1/2500) = 12.5 m (design.md crossover formula).
    expect(x[pieces[0].last]).toBeLessThanOrEqual(12.5);
    expect(x[pieces[1].first]).toBeGreaterThanOrEqual(12.5);
    expect(1 / pieces[1].slope).toBeCloseTo(2500, 3);
  });
});

describe("misfitWarnings with a single bad pick", () => {
  const plan: TestLayer[] = [{ velocity: 500, thickness: 6 }, { velocity: 3000 }];

  it("names one outlier and reads no layer into it", () => {
    const picks = picksFrom(plan, { shots: [-1], noise: 0.0003, seed: 14 });
    const k = 9;
    const bad = picks.map((p, i) => (i === k ? { ...p, time: p.time + 0.008 } : p));
    const warnings = misfitWarnings(bad, firstArrival(plan), { pickError: 0.0005 });
    expect(warnings.map((w) => w.kind)).toEqual(["outlier"]);
    expect(warnings[0].from).toBeCloseTo(
      Math.abs(picks[k].receiverPosition - picks[k].sourcePosition),
      9,
    );
    expect(warnings[0].message).toMatch(
      /^The pick at geophone .* later than the trend of its neighbours/,
    );
  });

  it("does not call a step between two straight pieces an outlier", () => {
    const x = Array.from({ length: 12 }, (_, k) => 2 * k + 1);
    const r = x.map((v) => (v < 12 ? 0 : 0.006));
    expect(localOutliers(x, r, 0.0005)).toEqual([]);
    const spike = r.map((v, i) => (i === 3 ? v + 0.006 : v));
    expect(localOutliers(x, spike, 0.0005).map((o) => o.index)).toEqual([3]);
  });
});

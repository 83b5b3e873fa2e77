import { describe, expect, it } from "vitest";
import type { FirstBreakPick } from "@/contracts/field";
import type { GroundModel } from "@engine";
import { fieldApi } from "../../../../../workers/field/worker-api";
import { LINE_METHODS as CORE_LINE_METHODS } from "../../../../../workers/field/index";
import { LINE_METHODS } from "../format";
import { curvePath, residualDomain, tdScales } from "../td-chart";

// The comparison, the suggested segments and the modelled curves run in the field worker: the
// same functions are called here directly.
const { compareCandidates, modelledCurves, readSegments, shotSides, suggestSegments } = fieldApi;

// Two-layer flat model; picks from its closed form (Telford, Geldart & Sheriff 1990 §4.3):
// t = min(x/v1, x/v2 + 2h·cos θ / v1), sin θ = v1/v2.
const v1 = 500;
const v2 = 2500;
const h = 5;
const truth: GroundModel = {
  name: "sand over sandstone",
  layers: [{ velocity: v1, thickness: h }, { velocity: v2 }],
};
const ti = (2 * h * Math.sqrt(1 - (v1 / v2) ** 2)) / v1;
const time = (x: number) => Math.min(x / v1, x / v2 + ti);
const picks: FirstBreakPick[] = Array.from({ length: 24 }, (_, k) => ({
  sourcePosition: -1,
  receiverPosition: 2 * k,
  time: time(2 * k + 1),
  origin: "auto",
}));
const thicker: GroundModel = {
  name: "thicker cover",
  layers: [{ velocity: v1, thickness: 9 }, { velocity: v2 }],
};
const candidates = [
  { name: thicker.name, model: thicker, source: "plan" as const },
  { name: truth.name, model: truth, source: "borehole" as const },
];

describe("comparing the picks with the candidates", () => {
  it("names the model the picks were made from as the best fit, with zero RMS", () => {
    const c = compareCandidates(picks, candidates, null, 0.0005);
    expect(c.best).toBe(1);
    expect(c.shown).toBe(1);
    expect(c.fits[1].rms).toBeCloseTo(0, 9);
    expect(c.fits[0].rms).toBeGreaterThan(0.002);
    // Thicker cover delays the head wave: the picks come early against it.
    expect(c.fits[0].meanResidual).toBeLessThan(0);
  });

  it("warns of early picks against the thicker model, none against the true one", () => {
    expect(compareCandidates(picks, candidates, 1, 0.0005).warnings).toEqual([]);
    const w = compareCandidates(picks, candidates, 0, 0.0005);
    expect(w.shown).toBe(0);
    expect(w.warnings.some((x) => x.kind === "early")).toBe(true);
  });

  it("has nothing to compare without picks", () => {
    expect(compareCandidates([], candidates, null, 0.0005)).toEqual({
      fits: [],
      best: null,
      shown: 0,
      warnings: [],
    });
  });
});

describe("segments and the intercept-time method", () => {
  it("groups the picks by shot and side", () => {
    // All 24 picks lie beyond the shot at −1 m (invented layout above).
    expect(shotSides(picks)).toEqual([{ sourcePosition: -1, side: "forward", count: 24 }]);
  });

  it("suggests one range per arrival and recovers velocities and the depth", () => {
    const ranges = suggestSegments(picks, -1, "forward", truth);
    expect(ranges).toHaveLength(2);
    const reading = readSegments(picks, -1, "forward", ranges);
    expect(reading.fits.every((f) => f.ok)).toBe(true);
    const interp = reading.interpretation;
    expect(interp?.ok).toBe(true);
    if (interp?.ok) {
      expect(interp.layers[0].velocity).toBeCloseTo(v1, 6);
      expect(interp.layers[1].velocity).toBeCloseTo(v2, 6);
      // Two-layer intercept-time depth (Kearey, Brooks & Hill 2002 ch. 5): h = t_i v1 v2 / (2 √(v2² − v1²)).
      expect(interp.layers[1].depth).toBeCloseTo(h, 6);
    }
  });

  it("leaves a single mis-pick out of the line fits and says which", () => {
    const spiked = picks.map((p, i) => (i === 12 ? { ...p, time: p.time + 0.008 } : p));
    const ranges = suggestSegments(picks, -1, "forward", truth);
    const reading = readSegments(spiked, -1, "forward", ranges, 0.0005);
    expect(reading.excluded).toEqual([25]);
    const interp = reading.interpretation;
    expect(interp?.ok).toBe(true);
    if (interp?.ok) expect(interp.layers[1].velocity).toBeCloseTo(v2, 6);
  });

  it("gives no interpretation while a segment cannot be fitted", () => {
    const reading = readSegments(picks, -1, "forward", [
      [0, 3],
      [100, 120],
    ]);
    expect(reading.fits[1].ok).toBe(false);
    expect(reading.interpretation).toBeNull();
  });
});

describe("time–distance chart transforms", () => {
  const frame = { width: 600, height: 300, margin: { left: 50, right: 10, top: 10, bottom: 40 } };

  it("covers every pick with time upwards from zero", () => {
    const s = tdScales(frame, picks);
    expect(s.y(0)).toBe(260);
    expect(s.y.domain()[1]).toBeGreaterThanOrEqual(Math.max(...picks.map((p) => p.time)));
    expect(s.x(-1)).toBeGreaterThanOrEqual(50);
    expect(s.x(46)).toBeLessThanOrEqual(590);
  });

  it("draws the modelled curve as a path through the model's times", () => {
    const s = tdScales(frame, picks);
    const { curves, maxTime } = modelledCurves([truth], [-1], -1, 46, 48);
    expect(curves[0][0].times).toHaveLength(48);
    // Closed-form two-layer times (Telford et al. 1990 §4.3) at every sampled position.
    curves[0][0].positions.forEach((x, i) =>
      expect(curves[0][0].times[i]).toBeCloseTo(time(x + 1), 9),
    );
    expect(maxTime).toBeCloseTo(time(47), 9);
    const path = curvePath(curves[0][0], s);
    expect(path.startsWith("M")).toBe(true);
    expect(path.split("L")).toHaveLength(48);
  });

  it("makes a symmetric residual scale with a floor", () => {
    expect(residualDomain([0.001, -0.004, null])).toEqual([
      -0.0044000000000000003, 0.0044000000000000003,
    ]);
    expect(residualDomain([], 0.002)).toEqual([-0.0022000000000000001, 0.0022000000000000001]);
  });
});

describe("method names on the screen", () => {
  it("are the field core's names of the methods", () => {
    expect(LINE_METHODS).toEqual(CORE_LINE_METHODS);
  });
});

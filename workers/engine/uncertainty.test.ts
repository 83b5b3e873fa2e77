import { describe, expect, it } from "vitest";
import { interceptTimeMethod } from "./interpretation";
import { earthFromModel } from "./geometry";
import { prepareEarth } from "./head-waves";
import { createPieces, firstArrivalPieces } from "./segments";
import { branchOf, branchOffset, firstAtOrBeyond, countBetween } from "./branches";
import {
  directWaveCovariance,
  lineCovariance,
  pickStats,
  propagateUncertainty,
} from "./uncertainty";

/** Seeded uniform generator (mulberry32) and normal deviates (Box–Muller). */
function rng(seed: number) {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

function fit(xs: number[], ts: number[], throughOrigin: boolean) {
  if (throughOrigin) {
    let sxy = 0;
    let sxx = 0;
    xs.forEach((x, i) => {
      sxy += x * ts[i];
      sxx += x * x;
    });
    return { intercept: 0, slowness: sxy / sxx };
  }
  const n = xs.length;
  const mx = xs.reduce((a, b) => a + b, 0) / n;
  const mt = ts.reduce((a, b) => a + b, 0) / n;
  let sxy = 0;
  let sxx = 0;
  xs.forEach((x, i) => {
    sxy += (x - mx) * (ts[i] - mt);
    sxx += (x - mx) ** 2;
  });
  const slowness = sxy / sxx;
  return { intercept: mt - slowness * mx, slowness };
}

describe("lineCovariance", () => {
  it("matches the textbook least-squares variances (common practice)", () => {
    // picks at x = 1, 2, 3, 4: Sxx = 5, mean 2.5
    const c = lineCovariance({ n: 4, sum: 10, sumSq: 30 }, 0.001);
    expect(c.varSlowness).toBeCloseTo(1e-6 / 5, 18);
    expect(c.varIntercept).toBeCloseTo((1e-6 * 30) / (4 * 5), 18);
    expect(c.covariance).toBeCloseTo((-1e-6 * 2.5) / 5, 18);
  });

  it("gives infinite variance when the picks cannot define the line", () => {
    expect(lineCovariance({ n: 1, sum: 3, sumSq: 9 }, 0.001).varSlowness).toBe(Infinity);
  });
});

describe("directWaveCovariance", () => {
  it("fits the direct wave with a free intercept: σ_p² = σ²/Sxx, not σ²/Σx² (common practice)", () => {
    // picks at x = 2, 4, 6, 8: Sxx = 20, Σx² = 120
    const c = directWaveCovariance({ n: 4, sum: 20, sumSq: 120 }, 0.001);
    expect(c.varSlowness).toBeCloseTo(1e-6 / 20, 18);
    expect(c.varSlowness).toBeGreaterThan(
      lineCovariance({ n: 4, sum: 20, sumSq: 120 }, 0.001, true).varSlowness,
    );
  });
});

describe("propagateUncertainty", () => {
  it("agrees with a seeded Monte Carlo simulation of noisy picks within 8 %", () => {
    const layers = [
      { velocity: 450, thickness: 4 },
      { velocity: 1500, thickness: 9 },
      { velocity: 3800 },
    ];
    const prep = prepareEarth(earthFromModel({ layers }));
    const lines = prep.flat!;
    const layout = { spacing: 2, channels: 48, firstGeophone: 0, shots: [-1] };
    const branch = branchOf(layout, -1, "forward");
    const pieces = firstArrivalPieces(lines, 3, createPieces(3));
    const sigma = 0.001;
    const offsets = [0, 1, 2].map((m) => {
      const xs: number[] = [];
      for (let i = 0; i < pieces.count; i++) {
        if (pieces.arrival[i] !== m) continue;
        const k0 = firstAtOrBeyond(layout, branch, pieces.from[i]);
        const c = countBetween(layout, branch, pieces.from[i], pieces.to[i]);
        for (let k = k0; k < k0 + c; k++) xs.push(branchOffset(layout, branch, k));
      }
      return xs;
    });
    expect(offsets.map((x) => x.length)).toEqual(
      [0, 1, 2].map((m) => pickStats(layout, branch, pieces, m).n),
    );
    const observed = [1, 2].map((m) => ({
      intercept: lines.intercept[m],
      slowness: lines.slowness[m],
    }));
    const covs = [1, 2].map((m) => lineCovariance(pickStats(layout, branch, pieces, m), sigma));
    const directVar = directWaveCovariance(pickStats(layout, branch, pieces, 0), sigma).varSlowness;
    const predicted = propagateUncertainty(lines.slowness[0], directVar, observed, covs);

    const normal = rng(20240611);
    const trials = 3000;
    const depths: number[][] = [[], []];
    const v2: number[] = [];
    for (let t = 0; t < trials; t++) {
      const fits = [0, 1, 2].map((m) => {
        // A 2 ms trigger delay on every pick: the free intercepts absorb it (common practice).
        const ts = offsets[m].map(
          (x) =>
            0.002 +
            lines.intercept[m] * (m === 0 ? 0 : 1) +
            lines.slowness[m] * x +
            sigma * normal(),
        );
        const f = fit(offsets[m], ts, false);
        return { intercept: f.intercept - 0.002, slowness: f.slowness };
      });
      const r = interceptTimeMethod(fits[0].slowness, fits.slice(1));
      depths[0].push(r.depths[0]);
      depths[1].push(r.depths[1]);
      v2.push(r.velocities[1]);
    }
    const std = (a: number[]) => {
      const mean = a.reduce((x, y) => x + y, 0) / a.length;
      return Math.sqrt(a.reduce((x, y) => x + (y - mean) ** 2, 0) / (a.length - 1));
    };
    expect(std(depths[0]) / predicted.depthSigma[0]).toBeGreaterThan(0.92);
    expect(std(depths[0]) / predicted.depthSigma[0]).toBeLessThan(1.08);
    expect(std(depths[1]) / predicted.depthSigma[1]).toBeGreaterThan(0.92);
    expect(std(depths[1]) / predicted.depthSigma[1]).toBeLessThan(1.08);
    expect(std(v2) / predicted.velocitySigma[1]).toBeGreaterThan(0.92);
    expect(std(v2) / predicted.velocitySigma[1]).toBeLessThan(1.08);
  });
});

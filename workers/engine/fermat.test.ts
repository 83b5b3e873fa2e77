/**
 * Independent check of the closed forms and the ray tracing by brute force: Fermat's
 * principle says the head wave and the reflection take the least-time path among paths
 * made of straight legs between the planar interfaces. Here travel times are minimised
 * directly over the horizontal crossing points with nested golden-section searches (the
 * travel time is convex in the crossing points, so each nested search is unimodal). No
 * Snell's law, no critical angle and no engine formula is used to build these paths.
 */
import { describe, expect, it } from "vitest";
import { earthFromModel, findInterfaceProblem, type Earth } from "./geometry";
import { linesFor, prepareEarth } from "./head-waves";
import { createLineSet } from "./lines";
import { reflectionSolver } from "./reflections";
import type { GroundModel } from "./plan-schema";

const PHI = (Math.sqrt(5) - 1) / 2;

/** Minimum of a unimodal function on [a, b] by golden-section search. */
function golden(
  f: (x: number) => number,
  a: number,
  b: number,
  iterations = 90,
): { x: number; f: number } {
  let c = b - PHI * (b - a);
  let d = a + PHI * (b - a);
  let fc = f(c);
  let fd = f(d);
  for (let i = 0; i < iterations; i++) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - PHI * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + PHI * (b - a);
      fd = f(d);
    }
  }
  return fc < fd ? { x: c, f: fc } : { x: d, f: fd };
}

const depthAt = (e: Earth, k: number, x: number) =>
  k === 0 ? 0 : e.depthAtZero[k] + x * e.slope[k];

/**
 * Least time from the surface point (x0, 0) to the point at position xEnd on interface
 * `last`, crossing interfaces 1..last−1 at freely chosen positions.
 */
function legTime(e: Earth, x0: number, last: number, xEnd: number, lo: number, hi: number): number {
  const from = (k: number, px: number): number => {
    // time from point on interface k at px down to the end point
    const pz = depthAt(e, k, px);
    if (k === last - 1) {
      return Math.hypot(xEnd - px, depthAt(e, last, xEnd) - pz) / e.velocity[k];
    }
    return golden(
      (qx) => Math.hypot(qx - px, depthAt(e, k + 1, qx) - pz) / e.velocity[k] + from(k + 1, qx),
      lo,
      hi,
    ).f;
  };
  return from(0, x0);
}

/** Brute-force head-wave time along the top of layer m between positions xs and xg (xg ≠ xs). */
function fermatHeadWave(
  e: Earth,
  m: number,
  xs: number,
  xg: number,
): { t: number; xa: number; xb: number } {
  const sign = xg > xs ? 1 : -1;
  const lo = Math.min(xs, xg) - 300;
  const hi = Math.max(xs, xg) + 300;
  const perX = Math.hypot(1, e.slope[m]) / e.velocity[m]; // time per metre of position along the refractor
  const down = golden((xa) => legTime(e, xs, m, xa, lo, hi) - sign * xa * perX, lo, hi);
  const up = golden((xb) => legTime(e, xg, m, xb, lo, hi) + sign * xb * perX, lo, hi);
  return { t: down.f + up.f, xa: down.x, xb: up.x };
}

/** Brute-force reflection time from the top of layer m between positions xs and xg. */
function fermatReflection(e: Earth, m: number, xs: number, xg: number): number {
  const lo = Math.min(xs, xg) - 300;
  const hi = Math.max(xs, xg) + 300;
  return golden((xr) => legTime(e, xs, m, xr, lo, hi) + legTime(e, xg, m, xr, lo, hi), lo, hi).f;
}

function engineHeadWave(model: Pick<GroundModel, "layers">, m: number, xs: number, xg: number) {
  const e = earthFromModel(model);
  const sign = xg > xs ? 1 : -1;
  const lines = linesFor(prepareEarth(e), xs, sign, createLineSet(e.layerCount));
  const offset = Math.abs(xg - xs);
  return {
    t: lines.intercept[m] + lines.slowness[m] * offset,
    start: lines.start[m],
    exists: lines.exists[m],
  };
}

const flatThree = {
  layers: [{ velocity: 500, thickness: 4 }, { velocity: 1800, thickness: 9 }, { velocity: 4200 }],
};
const dippingThree = {
  layers: [
    { velocity: 650, thickness: 5, dip: 3 },
    { velocity: 1900, thickness: 8, dip: -1.5 },
    { velocity: 4600 },
  ],
};
const dippingFour = {
  layers: [
    { velocity: 400, thickness: 3, dip: -2 },
    { velocity: 1200, thickness: 4, dip: 5 },
    { velocity: 2300, thickness: 6, dip: 2 },
    { velocity: 5000 },
  ],
};

describe("Fermat brute force agrees with the engine to 1e-9 s", () => {
  it.each([
    ["flat, refractor 2", flatThree, 1, 0, 60],
    ["flat, refractor 3", flatThree, 2, 10, 95],
    ["dipping, refractor 2, down-dip", dippingThree, 1, -10, 55],
    ["dipping, refractor 3, down-dip", dippingThree, 2, -10, 90],
    ["dipping, refractor 3, up-dip", dippingThree, 2, 90, -10],
    ["four dipping layers, refractor 4, up-dip", dippingFour, 3, 70, 0],
    ["four dipping layers, refractor 3, down-dip", dippingFour, 2, 0, 70],
  ] as const)("head wave: %s", (_label, model, m, xs, xg) => {
    const e = earthFromModel(model);
    expect(findInterfaceProblem(e, Math.min(xs, xg), Math.max(xs, xg))).toBeNull();
    const brute = fermatHeadWave(e, m, xs, xg);
    const engine = engineHeadWave(model, m, xs, xg);
    expect(engine.exists).toBe(1);
    expect(Math.abs(xg - xs)).toBeGreaterThan(engine.start); // beyond the critical distance
    expect(Math.sign(brute.xb - brute.xa)).toBe(Math.sign(xg - xs)); // the path runs along the refractor
    expect(Math.abs(engine.t - brute.t)).toBeLessThan(1e-9);
  });

  it("puts the critical distance where the brute-force path starts to run along the refractor", () => {
    const e = earthFromModel(dippingThree);
    const { start } = engineHeadWave(dippingThree, 2, 0, 80);
    // just beyond the critical distance the least-time path has its two feet in order …
    const beyond = fermatHeadWave(e, 2, 0, start * 1.02);
    expect(beyond.xb - beyond.xa).toBeGreaterThan(0);
    // … just before it the unconstrained minimum would need the feet crossed (no head wave)
    const before = fermatHeadWave(e, 2, 0, start * 0.98);
    expect(before.xb - before.xa).toBeLessThan(0);
  });

  it.each([
    ["flat, top of layer 2", flatThree, 1, 0, 37],
    ["flat, top of layer 3", flatThree, 2, 5, 64],
    ["flat, top of layer 3, zero offset", flatThree, 2, 5, 5],
    ["dipping, top of layer 3, down-dip", dippingThree, 2, 0, 45],
    ["dipping, top of layer 3, up-dip", dippingThree, 2, 45, 0],
    ["four dipping layers, top of layer 4", dippingFour, 3, 10, 40],
  ] as const)("reflection: %s", (_label, model, m, xs, xg) => {
    const e = earthFromModel(model);
    expect(findInterfaceProblem(e, Math.min(xs, xg), Math.max(xs, xg))).toBeNull();
    const brute = fermatReflection(e, m, xs, xg);
    const engine = reflectionSolver(e, m, xs)(xg);
    expect(Math.abs(engine - brute)).toBeLessThan(1e-9);
  });
});

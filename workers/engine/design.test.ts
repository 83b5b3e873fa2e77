import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { earthFromModel, findInterfaceProblem, withThickness } from "./geometry";
import { prepareEarth } from "./head-waves";
import { createPieces, firstArrivalPieces, countOnSegments } from "./segments";
import {
  lastCrossover,
  MAX_DESIGN_THICKNESS,
  maxSpacingFor,
  minimumThickness,
  spreadLengthFor,
} from "./design";
import { createJudgeScratch, worstCodes } from "./verdicts";
import { branchOf } from "./branches";

const cosC = (a: number, b: number) => Math.cos(Math.asin(a / b));

describe("minimumThickness", () => {
  const layers = [
    { velocity: 500, thickness: 5 },
    { velocity: 1500, thickness: 2 },
    { velocity: 3000 },
  ];
  const layout = { spacing: 1, channels: 96, firstGeophone: 0, shots: [-0.5, 95.5] };
  const extent = { from: -0.5, to: 95.5 };

  it("is the thickness from which the layer's refractor is resolved", () => {
    const earth = earthFromModel({ layers });
    const h = minimumThickness(prepareEarth(earth), layout, 2, 1, extent)!;
    const status = (t: number) => {
      const w = new Uint8Array(3);
      worstCodes(prepareEarth(withThickness(earth, 1, t)), layout, 2, createJudgeScratch(3), w);
      return w[1];
    };
    expect(status(h)).toBe(0);
    expect(status(h * 0.999)).not.toBe(0);
  });

  it("approaches the blind-layer limit from equating the two crossover distances (Soske 1959) as spacing shrinks", () => {
    // x(1→2) = t2 / (1/v1 − 1/v2) must equal x(2→3) = (t3 − t2) / (1/v2 − 1/v3); t3 is linear in h2.
    const [v1, v2, v3, h1] = [500, 1500, 3000, 5];
    const t2 = (2 * h1 * cosC(v1, v2)) / v1;
    const x12 = t2 / (1 / v1 - 1 / v2);
    const limit =
      ((x12 * (1 / v2 - 1 / v3) + t2 - (2 * h1 * cosC(v1, v3)) / v1) * v2) / (2 * cosC(v2, v3));
    const fine = { spacing: 0.001, channels: 60000, firstGeophone: 0, shots: [-0.0005] };
    const h = minimumThickness(prepareEarth(earthFromModel({ layers })), fine, 2, 1, {
      from: -0.0005,
      to: 60,
    })!;
    expect(h).toBeGreaterThan(limit);
    expect(h - limit).toBeLessThan(0.01);
  });

  it("is null for an inverted layer and for the half-space", () => {
    const inv = earthFromModel({
      layers: [
        { velocity: 1500, thickness: 5 },
        { velocity: 800, thickness: 2 },
        { velocity: 3000 },
      ],
    });
    expect(minimumThickness(prepareEarth(inv), layout, 2, 1, extent)).toBeNull();
    expect(minimumThickness(prepareEarth(inv), layout, 2, 2, extent)).toBeNull();
  });
});

// ---------------------------------------------------------------------------------------
// Independent brute force for the closed-form minimum thickness, written here from the
// textbook (Telford, Geldart & Sheriff 1990 §4.3: t_m(x) = x/v_m + Σ 2 h_i cos θ_im / v_i
// from x_crit,m = Σ 2 h_i tan θ_im, sin θ_im = v_i / v_m) and the verdict rules of
// design.md / verdicts.ts, sharing no code with the engine: the first arrival is found by
// testing every interval between all critical distances and pairwise crossings, and the
// thickness by plain bisection on those verdicts.
// ---------------------------------------------------------------------------------------

interface BruteLine {
  tau: number;
  p: number;
  start: number;
}

/** Direct wave and head-wave lines (null where no head wave), textbook formulas. */
function bruteLines(v: number[], h: number[]): (BruteLine | null)[] {
  const out: (BruteLine | null)[] = [{ tau: 0, p: 1 / v[0], start: 0 }];
  for (let m = 1; m < v.length; m++) {
    if (!v.slice(0, m).every((u) => u < v[m])) {
      out.push(null);
      continue;
    }
    let tau = 0;
    let xc = 0;
    for (let i = 0; i < m; i++) {
      const theta = Math.asin(v[i] / v[m]);
      tau += (2 * h[i] * Math.cos(theta)) / v[i];
      xc += 2 * h[i] * Math.tan(theta);
    }
    out.push({ tau, p: 1 / v[m], start: xc });
  }
  return out;
}

/** Offset intervals [from, to) on which arrival `m` is the first arrival. */
function bruteSegment(lines: (BruteLine | null)[], m: number): [number, number][] {
  const cuts = [0];
  lines.forEach((a, i) => {
    if (!a) return;
    cuts.push(a.start);
    lines.forEach((b, j) => {
      if (b && j > i && a.p !== b.p) cuts.push((b.tau - a.tau) / (a.p - b.p));
    });
  });
  const xs = [...new Set(cuts.filter((x) => x >= 0 && Number.isFinite(x)))].sort((a, b) => a - b);
  const out: [number, number][] = [];
  xs.forEach((from, k) => {
    const to = k + 1 < xs.length ? xs[k + 1] : Infinity;
    const mid = to === Infinity ? from + 1 : 0.5 * (from + to);
    let best = -1;
    let bestT = Infinity;
    lines.forEach((l, i) => {
      if (!l || l.start > mid) return;
      const t = l.tau + l.p * mid;
      if (t < bestT) [best, bestT] = [i, t];
    });
    if (best !== m) return;
    if (out.length > 0 && out[out.length - 1][1] === from) out[out.length - 1][1] = to;
    else out.push([from, to]);
  });
  return out;
}

/** Verdict rules: resolved (0), judged bad (1), or not judged (2) on one branch's offsets. */
function bruteBranch(seg: [number, number][], offsets: number[], min: number, dx: number) {
  if (seg.length === 0) return 1; // blind: judged
  const count = offsets.filter((o) => seg.some(([a, b]) => o >= a && o < b)).length;
  if (count >= min) return 0;
  const [from, to] = [seg[0][0], seg[seg.length - 1][1]];
  const spans = offsets[0] <= from + dx && offsets[offsets.length - 1] >= to - dx;
  return spans ? 1 : 2;
}

function bruteMinimumThickness(
  v: number[],
  h: number[],
  m: number,
  layout: { spacing: number; channels: number; firstGeophone: number; shots: number[] },
  min: number,
): number | null {
  const branches: number[][] = [];
  for (const shot of layout.shots) {
    const pos = Array.from(
      { length: layout.channels },
      (_, i) => layout.firstGeophone + i * layout.spacing,
    );
    const fwd = pos.filter((x) => x > shot).map((x) => x - shot);
    const rev = pos
      .filter((x) => x < shot)
      .map((x) => shot - x)
      .reverse();
    for (const b of [fwd, rev]) if (b.length > 0) branches.push(b);
  }
  const resolvedAt = (t: number) => {
    const seg = bruteSegment(
      bruteLines(
        v,
        h.map((x, i) => (i === m ? t : x)),
      ),
      m,
    );
    const verdicts = branches.map((b) => bruteBranch(seg, b, min, layout.spacing));
    return verdicts.every((x) => x !== 1) && verdicts.some((x) => x === 0);
  };
  if (!resolvedAt(MAX_DESIGN_THICKNESS)) return null;
  let [lo, hi] = [0, MAX_DESIGN_THICKNESS];
  while (hi - lo > 1e-10 * hi && hi > 1e-9) {
    const mid = 0.5 * (lo + hi);
    if (resolvedAt(mid)) hi = mid;
    else lo = mid;
  }
  return hi > 1e-9 ? hi : 0;
}

describe("minimumThickness against independent checks", () => {
  it("agrees with a brute force written in this test: textbook head-wave lines, every crossing scanned, bisected over thickness (flat, property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 200, max: 1500, noNaN: true }),
        fc.array(
          fc.record({
            ratio: fc.double({ min: 0.7, max: 3, noNaN: true }),
            thickness: fc.double({ min: 0.2, max: 20, noNaN: true }),
          }),
          { minLength: 2, maxLength: 6 },
        ),
        fc.record({
          spacing: fc.double({ min: 0.5, max: 6, noNaN: true }),
          channels: fc.integer({ min: 2, max: 96 }),
          shots: fc.array(fc.double({ min: -30, max: 300, noNaN: true }), {
            minLength: 1,
            maxLength: 4,
          }),
          min: fc.integer({ min: 2, max: 4 }),
        }),
        (v0, steps, s) => {
          const v = [v0];
          steps.forEach((st) => v.push(v[v.length - 1] * st.ratio));
          const h = steps.map((st) => st.thickness);
          const layers = v.map((velocity, i) =>
            i < h.length ? { velocity, thickness: h[i] } : { velocity },
          );
          const layout = {
            spacing: s.spacing,
            channels: s.channels,
            firstGeophone: 0,
            shots: s.shots,
          };
          const prep = prepareEarth(earthFromModel({ layers }));
          const extent = {
            from: Math.min(0, ...s.shots),
            to: Math.max((s.channels - 1) * s.spacing, ...s.shots),
          };
          for (let m = 1; m < v.length - 1; m++) {
            const closed = minimumThickness(prep, layout, s.min, m, extent);
            const brute = bruteMinimumThickness(v, h, m, layout, s.min);
            if (brute === null) expect(closed).toBeNull();
            else {
              expect(closed).not.toBeNull();
              expect(Math.abs((closed as number) - brute)).toBeLessThan(1e-6 * Math.max(1, brute));
            }
          }
        },
      ),
      { numRuns: 100, seed: 20261202 },
    );
  });

  it("matches the brute force on a thin layer that needs more than 1 m to show on 3 geophones", () => {
    const v = [400, 900, 2000, 3500];
    const h = [3, 1, 6];
    const layout = { spacing: 2, channels: 48, firstGeophone: 0, shots: [-1, 95] };
    const brute = bruteMinimumThickness(v, h, 1, layout, 3) as number;
    const layers = v.map((velocity, i) => (i < 3 ? { velocity, thickness: h[i] } : { velocity }));
    const closed = minimumThickness(prepareEarth(earthFromModel({ layers })), layout, 3, 1, {
      from: -1,
      to: 95,
    }) as number;
    expect(brute).toBeGreaterThan(1);
    expect(Math.abs(closed - brute)).toBeLessThan(1e-6 * brute);
  });

  it("agrees with a bisection over the full verdicts, rebuilding the dipping model at every step (property)", () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            ratio: fc.double({ min: 1.1, max: 2.5, noNaN: true }),
            thickness: fc.double({ min: 1, max: 15, noNaN: true }),
            dip: fc.double({ min: -3, max: 3, noNaN: true }),
          }),
          { minLength: 2, maxLength: 5 },
        ),
        fc.integer({ min: 12, max: 96 }),
        (steps, channels) => {
          const v = [400];
          steps.forEach((st) => v.push(v[v.length - 1] * st.ratio));
          const layers = v.map((velocity, i) =>
            i < steps.length
              ? { velocity, thickness: steps[i].thickness, dip: i === 0 ? 0 : steps[i].dip }
              : { velocity },
          );
          const layout = {
            spacing: 2,
            channels,
            firstGeophone: 0,
            shots: [-1, channels - 0.5, 2 * channels],
          };
          const extent = { from: -1, to: 2 * channels };
          const earth = earthFromModel({ layers });
          if (findInterfaceProblem(earth, extent.from, extent.to)) return;
          const prep = prepareEarth(earth);
          for (let m = 1; m < v.length - 1; m++) {
            const resolvedAt = (t: number) => {
              const e = withThickness(earth, m, t);
              if (findInterfaceProblem(e, extent.from, extent.to)) return false;
              const w = new Uint8Array(v.length);
              worstCodes(prepareEarth(e), layout, 2, createJudgeScratch(v.length), w);
              return w[m] === 0;
            };
            const closed = minimumThickness(prep, layout, 2, m, extent);
            if (!resolvedAt(MAX_DESIGN_THICKNESS)) {
              expect(closed).toBeNull();
              continue;
            }
            let [lo, hi] = [0, MAX_DESIGN_THICKNESS];
            while (hi - lo > 1e-10 * hi && hi > 1e-9) {
              const mid = 0.5 * (lo + hi);
              if (resolvedAt(mid)) hi = mid;
              else lo = mid;
            }
            const bisected = hi > 1e-9 ? hi : 0;
            expect(closed).not.toBeNull();
            expect(Math.abs((closed as number) - bisected)).toBeLessThan(
              1e-6 * Math.max(1, bisected),
            );
          }
        },
      ),
      { numRuns: 40, seed: 7 },
    );
  });
});

describe("maxSpacing and spreadLength", () => {
  it("guarantee the minimum count on every bounded segment and past the last crossover, wherever the line starts (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 200, max: 800, noNaN: true }),
        fc.array(
          fc.record({
            r: fc.double({ min: 1.1, max: 3, noNaN: true }),
            h: fc.double({ min: 0.5, max: 15, noNaN: true }),
          }),
          {
            minLength: 1,
            maxLength: 5,
          },
        ),
        fc.integer({ min: 2, max: 5 }),
        fc.double({ min: 0, max: 0.999, noNaN: true }),
        (v0, steps, min, shift) => {
          let v = v0;
          const layers = [{ velocity: v0, thickness: steps[0].h }];
          steps.forEach((s, i) => {
            v *= s.r;
            layers.push(
              i === steps.length - 1
                ? ({ velocity: v } as never)
                : { velocity: v, thickness: steps[i + 1].h },
            );
          });
          const prep = prepareEarth(earthFromModel({ layers }));
          const n = layers.length;
          const pieces = firstArrivalPieces(prep.flat!, n, createPieces(n));
          const spacing = maxSpacingFor([pieces], n, min);
          const dx = spacing ?? 5;
          const { spreadLength, channels } = spreadLengthFor(lastCrossover([pieces]), dx, min);
          // an end shot, the first geophone anywhere within one spacing of it
          const layout = { spacing: dx, channels, firstGeophone: shift * dx, shots: [0] };
          const counts = countOnSegments(
            pieces,
            layout,
            branchOf(layout, 0, "forward"),
            new Int32Array(n),
          );
          for (let i = 0; i < pieces.count; i++)
            expect(counts[pieces.arrival[i]]).toBeGreaterThanOrEqual(min);
          expect(layout.firstGeophone + (channels - 1) * dx).toBeGreaterThanOrEqual(
            spreadLength - dx,
          );
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("spreadLengthFor: channel count", () => {
  it("counts intervals: N channels at Δx span (N − 1)·Δx, at least the spread length (issue 14's 24 m at 5.14 m)", () => {
    // By hand: 24 m / 5.14 m = 4.67 intervals → 5 intervals → 6 channels (5 × 5.14 = 25.7 m).
    const r = spreadLengthFor(24 - 2 * 5.14, 5.14, 2);
    expect(r.spreadLength).toBeCloseTo(24, 9);
    expect(r.channels).toBe(6);
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 500, noNaN: true }),
        fc.double({ min: 0.1, max: 20, noNaN: true }),
        (c, dx) => {
          const { spreadLength, channels } = spreadLengthFor(c, dx, 2);
          expect((channels - 1) * dx).toBeGreaterThanOrEqual(spreadLength - 1e-6);
          expect((channels - 2) * dx).toBeLessThan(spreadLength);
        },
      ),
    );
  });
});

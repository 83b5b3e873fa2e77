import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { branchOf } from "./branches";
import { computeArrivals } from "./arrivals";
import { earthFromModel, withThickness } from "./geometry";
import { linesFor, prepareEarth } from "./head-waves";
import { createLineSet } from "./lines";
import { countOnSegments, createPieces, firstArrivalPieces, segmentHull } from "./segments";
import { STATUS_CODE } from "./statuses";
import {
  branchCodes,
  coverageOf,
  createJudgeScratch,
  judgedBranches,
  worstCodes,
} from "./verdicts";

function judge(
  layers: { velocity: number; thickness?: number; dip?: number }[],
  layout: { spacing: number; channels: number; firstGeophone: number; shots: number[] },
  min = 2,
) {
  const earth = earthFromModel({ layers });
  const worst = new Uint8Array(earth.layerCount);
  worstCodes(prepareEarth(earth), layout, min, createJudgeScratch(earth.layerCount), worst);
  return Array.from(worst);
}

const endShots = { spacing: 2, channels: 48, firstGeophone: 0, shots: [-1, 95] };

describe("verdicts", () => {
  it("resolves every refractor of a simple increasing model", () => {
    const codes = judge(
      [{ velocity: 400, thickness: 3 }, { velocity: 1500, thickness: 8 }, { velocity: 4000 }],
      endShots,
    );
    expect(codes).toEqual([0, 0, 0]);
  });

  // Blind layer: a head wave that is never the first arrival (Soske 1959; Kearey, Brooks &
  // Hill 2002, ch. 5).
  it("calls a thin intermediate layer blind when its head wave is never first", () => {
    const codes = judge(
      [{ velocity: 500, thickness: 5 }, { velocity: 1500, thickness: 2 }, { velocity: 3000 }],
      endShots,
    );
    expect(codes[1]).toBe(STATUS_CODE.blind);
    expect(codes[2]).toBe(STATUS_CODE.resolved);
  });

  // Velocity inversion: no head wave along a layer slower than one above it (Telford,
  // Geldart & Sheriff 1990, §4.3).
  it("calls a slower layer under a faster one inverted", () => {
    const codes = judge(
      [{ velocity: 1500, thickness: 3 }, { velocity: 700, thickness: 5 }, { velocity: 3000 }],
      endShots,
    );
    expect(codes[1]).toBe(STATUS_CODE.inverted);
  });

  // At least two picks per segment to fit a line (common practice; three for a residual).
  it("calls a refractor under-sampled when its segment holds fewer geophones than the minimum", () => {
    // segment of layer 2: offsets 14.1 m to 18.2 m (4.0 m long)
    const layers = [
      { velocity: 500, thickness: 5 },
      { velocity: 1500, thickness: 4.5 },
      { velocity: 3000 },
    ];
    const fine = { spacing: 0.25, channels: 400, firstGeophone: 0, shots: [-0.5, 100] };
    const coarse = { spacing: 5, channels: 24, firstGeophone: 0, shots: [-2.5, 117.5] };
    expect(judge(layers, fine)[1]).toBe(STATUS_CODE.resolved);
    expect(judge(layers, coarse)[1]).toBe(STATUS_CODE["under-sampled"]);
    expect(judge(layers, fine, 50)[1]).toBe(STATUS_CODE["under-sampled"]);
  });

  it("does not let a branch judge a segment its geophones do not reach (short side of a centre shot)", () => {
    // crossover 2h√((v2+v1)/(v2−v1)) = 23.1 m: beyond the 23 m half-branches of a centre shot
    const layers = [{ velocity: 500, thickness: 10 }, { velocity: 3500 }];
    const ends = { spacing: 2, channels: 24, firstGeophone: 0, shots: [-1, 47] };
    const withCentre = { ...ends, shots: [-1, 23, 47] };
    expect(judge(layers, ends)[1]).toBe(STATUS_CODE.resolved);
    expect(judge(layers, withCentre)[1]).toBe(STATUS_CODE.resolved);
    // … but with the centre shot alone nothing reaches it: under-sampled
    expect(judge(layers, { ...ends, shots: [23] })[1]).toBe(STATUS_CODE["under-sampled"]);
  });

  it("does not let an off-end shot judge the direct wave it cannot record", () => {
    const layers = [{ velocity: 500, thickness: 3 }, { velocity: 2500 }];
    const onEnd = { spacing: 1, channels: 24, firstGeophone: 0, shots: [-0.5] };
    expect(judge(layers, onEnd)[0]).toBe(STATUS_CODE.resolved);
    expect(judge(layers, { ...onEnd, shots: [-0.5, -30] })[0]).toBe(STATUS_CODE.resolved);
    expect(judge(layers, { ...onEnd, shots: [-30] })[0]).toBe(STATUS_CODE["under-sampled"]);
  });

  it("lets a branch that spans a short segment judge it under-sampled even if another branch resolves it", () => {
    // segment of layer 2 runs from 14.1 m to 18.2 m
    const layers = [
      { velocity: 500, thickness: 5 },
      { velocity: 1500, thickness: 4.5 },
      { velocity: 3000 },
    ];
    const spread = { spacing: 3, channels: 30, firstGeophone: 0 };
    // shot at 89.2 m: offsets 14.2 and 17.2 m fall on the segment; shot at −1.5 m: only 16.5 m
    expect(judge(layers, { ...spread, shots: [89.2] })[1]).toBe(STATUS_CODE.resolved);
    expect(judge(layers, { ...spread, shots: [-1.5] })[1]).toBe(STATUS_CODE["under-sampled"]);
    expect(judge(layers, { ...spread, shots: [-1.5, 89.2] })[1]).toBe(STATUS_CODE["under-sampled"]);
  });

  it("judges only branches that hold geophones", () => {
    const l = { spacing: 2, channels: 10, firstGeophone: 0, shots: [0, 18] };
    expect(judgedBranches(l).map((b) => `${b.shot}${b.branch.side}`)).toEqual([
      "0forward",
      "1reverse",
    ]);
  });

  it("counts on a segment exactly the geophones whose first arrival is that head wave", () => {
    const model = {
      layers: [
        { velocity: 450, thickness: 3 },
        { velocity: 1400, thickness: 6 },
        { velocity: 3600 },
      ],
    };
    const spread = { spacing: 1.5, channels: 60, firstGeophone: 0, shots: [{ position: 30.2 }] };
    const shot = computeArrivals(model, spread, 0);
    const earth = earthFromModel(model);
    const prep = prepareEarth(earth);
    const layout = { ...spread, shots: [30.2] };
    for (const side of ["forward", "reverse"] as const) {
      const br = branchOf(layout, 30.2, side);
      const lines = linesFor(prep, 30.2, br.sign, createLineSet(3));
      const pieces = firstArrivalPieces(lines, 3, createPieces(3));
      const counts = countOnSegments(pieces, layout, br, new Int32Array(3));
      for (const m of [0, 1, 2]) {
        const brute = shot.geophones.filter(
          (g) =>
            g.side === side &&
            (m === 0
              ? g.first.kind === "direct"
              : g.first.kind === "head" && g.first.layer === m + 1),
        ).length;
        expect(counts[m]).toBe(brute);
      }
      const codes = branchCodes(
        prep,
        lines,
        pieces,
        counts,
        2,
        coverageOf(layout, br),
        new Uint8Array(3),
        new Uint8Array(3),
      );
      expect(Array.from(codes)).toEqual([0, 0, 0]);
    }
  });
});

const increasing = fc
  .array(
    fc.record({
      ratio: fc.double({ min: 1.15, max: 3, noNaN: true }),
      thickness: fc.double({ min: 0.5, max: 5, noNaN: true }),
    }),
    { minLength: 2, maxLength: 6 },
  )
  .chain((steps) =>
    fc.record({
      v0: fc.double({ min: 200, max: 800, noNaN: true }),
      steps: fc.constant(steps),
      layer: fc.integer({ min: 1, max: steps.length - 1 }),
    }),
  );

function layersOf(v0: number, steps: { ratio: number; thickness: number }[]) {
  let v = v0;
  return steps.map((s, i) => {
    if (i > 0) v *= s.ratio;
    return i === steps.length - 1 ? { velocity: v } : { velocity: v, thickness: s.thickness };
  });
}

describe("verdict properties", () => {
  it("a refractor's segment grows with the thickness of its layer", () => {
    fc.assert(
      fc.property(
        increasing,
        fc.array(fc.double({ min: 0.1, max: 60, noNaN: true }), { minLength: 2, maxLength: 6 }),
        ({ v0, steps, layer }, hs) => {
          fc.pre(layer < steps.length - 1);
          const base = earthFromModel({ layers: layersOf(v0, steps) });
          const n = base.layerCount;
          let previous = -1;
          for (const h of [...hs].sort((a, b) => a - b)) {
            const prep = prepareEarth(withThickness(base, layer, h));
            const pieces = firstArrivalPieces(prep.flat!, n, createPieces(n));
            const hull = segmentHull(pieces, layer);
            const length = hull ? hull.to - hull.from : 0;
            expect(length).toBeGreaterThanOrEqual(previous - 1e-9 * Math.max(1, previous));
            previous = length;
          }
        },
      ),
      { numRuns: 200 },
    );
  });

  it("a layer fast enough and thick enough is resolved", () => {
    fc.assert(
      fc.property(increasing, ({ v0, steps, layer }) => {
        fc.pre(layer < steps.length - 1);
        const base = earthFromModel({ layers: layersOf(v0, steps) });
        const thick = withThickness(base, layer, 400);
        const worst = new Uint8Array(thick.layerCount);
        const layout = { spacing: 1, channels: 1000, firstGeophone: 0, shots: [-0.5] };
        worstCodes(prepareEarth(thick), layout, 2, createJudgeScratch(thick.layerCount), worst);
        expect(worst[layer]).toBe(STATUS_CODE.resolved);
      }),
      { numRuns: 200 },
    );
  });
});

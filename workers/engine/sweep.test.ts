import { describe, expect, it } from "vitest";
import { analyzePlan } from "./analysis";
import { CELL_INVALID, CELL_NOT_COMPUTED, STATUS_CODE } from "./statuses";
import { createSweepRunner, followShots, runSweep } from "./sweep";
import { parsePlan } from "./validate";
import { layeredModel, type Plan } from "./plan-schema";

function plan(input: unknown): Plan {
  const r = parsePlan(input);
  if (!r.ok) throw new Error(r.issues.join("\n"));
  return r.plan;
}

const base = plan({
  name: "sweep",
  models: [
    {
      name: "thin lens",
      layers: [
        { velocity: 450, thickness: 4 },
        { velocity: 1600, thickness: 2 },
        { velocity: 3400 },
      ],
    },
    {
      name: "dipping",
      layers: [
        { velocity: 500, thickness: 3, dip: 2 },
        { velocity: 1800, thickness: 5, dip: -1 },
        { velocity: 3600 },
      ],
    },
  ],
  spread: {
    spacing: 2,
    channels: 24,
    firstGeophone: 0,
    shots: [
      { position: -1, anchor: { to: "start", offset: -1 } },
      { position: 47, anchor: { to: "end", offset: 1 } },
    ],
  },
  criteria: { minGeophones: 3 },
});

/** The cell's expected values from a full analysis of the same plan. */
function expected(p: Plan, modelIndex: number) {
  const a = analyzePlan({ ...p, models: [p.models[modelIndex]] }, { minimumThickness: false })
    .models[0];
  let worst = NaN;
  for (const r of a.interpretation?.refractors ?? []) {
    if (r.error !== null && !(Math.abs(r.error) <= Math.abs(worst))) worst = r.error;
  }
  return { status: STATUS_CODE[a.worstStatus], depthError: worst };
}

describe("runSweep", () => {
  it.each([
    ["thickness × spacing on a flat model", 0, "spacing", "thickness", 2],
    ["velocity × channels on a flat model", 0, "channels", "velocity", 2],
    ["thickness × spacing on a dipping model", 1, "spacing", "thickness", 1],
    ["velocity × channels on a dipping model", 1, "channels", "velocity", 3],
  ] as const)(
    "agrees cell by cell with the full analysis: %s",
    (_label, modelIndex, axis, kind, layer) => {
      const spec = {
        modelIndex,
        axis,
        ...(axis === "spacing" ? { min: 0.5, max: 4, steps: 6 } : { axisValues: [6, 12, 24, 48] }),
        parameter:
          kind === "thickness"
            ? { layer, kind, min: 0.5, max: 8, steps: 5 }
            : { layer, kind, min: 800, max: 5000, steps: 5 },
      };
      const r = runSweep(base, spec);
      expect(r.cancelled).toBe(false);
      expect(r.status).toHaveLength(r.rows * r.cols);
      for (let i = 0; i < r.rows; i++) {
        for (let j = 0; j < r.cols; j++) {
          const spacing = axis === "spacing" ? r.axis.values[j] : 2;
          const channels = axis === "channels" ? r.axis.values[j] : 24;
          const layers = base.models[modelIndex].layers.map((l, k) =>
            k === layer - 1 ? { ...l, [kind]: r.parameter.values[i] } : l,
          );
          const end = (channels - 1) * spacing;
          const cellPlan: Plan = {
            ...base,
            models: base.models.map((m, k) =>
              k === modelIndex ? { ...layeredModel(m), layers } : m,
            ),
            // end shots follow the spread: half a metre... one metre beyond each end
            spread: {
              spacing,
              channels,
              firstGeophone: 0,
              shots: [{ position: -1 }, { position: end + 1 }],
            },
          };
          const e = expected(cellPlan, modelIndex);
          const idx = i * r.cols + j;
          expect(r.status[idx]).toBe(e.status);
          if (Number.isNaN(e.depthError)) expect(Number.isNaN(r.depthError[idx])).toBe(true);
          else expect(r.depthError[idx]).toBeCloseTo(e.depthError, 9);
        }
      }
    },
  );

  it("shows the lens turning from blind to resolved as it thickens", () => {
    const r = runSweep(base, {
      modelIndex: 0,
      axis: "channels",
      axisValues: [200],
      parameter: { layer: 2, kind: "thickness", min: 0.5, max: 10, steps: 20 },
    });
    const codes = Array.from(r.status);
    expect(codes[0]).toBe(STATUS_CODE.blind);
    expect(codes[codes.length - 1]).toBe(STATUS_CODE.resolved);
    // monotone: once resolved, stays resolved
    const firstResolved = codes.indexOf(STATUS_CODE.resolved);
    expect(codes.slice(firstResolved).every((c) => c === STATUS_CODE.resolved)).toBe(true);
    // the missed lens makes the bedrock look too shallow
    expect(r.depthError[0]).toBeLessThan(0);
  });

  it("reports progress in fractions up to 1, once per row", () => {
    const seen: number[] = [];
    runSweep(
      base,
      {
        modelIndex: 0,
        axis: "spacing",
        min: 1,
        max: 3,
        steps: 3,
        parameter: { layer: 1, kind: "thickness", min: 1, max: 5, steps: 7 },
      },
      { onProgress: (f) => seen.push(f) },
    );
    expect(seen).toHaveLength(7);
    expect(seen[seen.length - 1]).toBe(1);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThan(seen[i - 1]);
  });

  it("stops when cancelled and marks the cells it did not compute", () => {
    let polls = 0;
    const r = runSweep(
      base,
      {
        modelIndex: 0,
        axis: "spacing",
        min: 1,
        max: 3,
        steps: 4,
        parameter: { layer: 1, kind: "thickness", min: 1, max: 5, steps: 10 },
      },
      { shouldCancel: () => ++polls > 3 },
    );
    expect(r.cancelled).toBe(true);
    expect(r.completedRows).toBe(3);
    expect(r.status[3 * 4]).toBe(CELL_NOT_COMPUTED);
    expect(r.status[2 * 4]).not.toBe(CELL_NOT_COMPUTED);
    expect(Number.isNaN(r.depthError[9 * 4 + 3])).toBe(true);
  });

  it("marks cells where the varied model's interfaces cross within the spread as invalid", () => {
    const crossing = plan({
      ...base,
      models: [
        {
          name: "converging",
          layers: [
            { velocity: 500, thickness: 2, dip: 3 },
            { velocity: 1800, thickness: 4, dip: -1 },
            { velocity: 3600 },
          ],
        },
      ],
    });
    const r = runSweep(crossing, {
      modelIndex: 0,
      axis: "spacing",
      axisValues: [1, 2],
      parameter: { layer: 2, kind: "thickness", min: 0.2, max: 8, steps: 3 },
    });
    expect(r.status[0]).toBe(CELL_INVALID);
    expect(r.status[r.status.length - 1]).not.toBe(CELL_INVALID);
  });

  it.each([
    [
      {
        modelIndex: 5,
        axis: "spacing",
        axisValues: [1],
        parameter: { layer: 1, kind: "thickness", min: 1, max: 2, steps: 2 },
      },
      /modelIndex/,
    ],
    [
      {
        modelIndex: 0,
        axis: "spacing",
        axisValues: [1],
        parameter: { layer: 3, kind: "thickness", min: 1, max: 2, steps: 2 },
      },
      /half-space/,
    ],
    [
      {
        modelIndex: 0,
        axis: "spacing",
        axisValues: [1],
        parameter: { layer: 9, kind: "velocity", min: 1, max: 2, steps: 2 },
      },
      /no layer 9/,
    ],
    [
      {
        modelIndex: 0,
        axis: "spacing",
        axisValues: [0],
        parameter: { layer: 1, kind: "velocity", min: 1, max: 2, steps: 2 },
      },
      /spacing must be > 0/,
    ],
    [
      {
        modelIndex: 0,
        axis: "spacing",
        parameter: { layer: 1, kind: "velocity", min: 1, max: 2, steps: 2 },
      },
      /axisValues or min, max and steps/,
    ],
    [
      {
        modelIndex: 0,
        axis: "spacing",
        axisValues: [1],
        parameter: { layer: 1, kind: "velocity", min: -1, max: 2, steps: 0 },
      },
      /min must be > 0.*steps must be at least 1|steps must be at least 1.*min must be > 0/,
    ],
    [
      {
        modelIndex: 0,
        axis: "spacing",
        min: 1,
        max: 2,
        steps: 1000,
        parameter: { layer: 1, kind: "velocity", min: 1, max: 2, steps: 1000 },
      },
      /at most 250000 cells/,
    ],
  ])("throws a RangeError naming the problem for a bad spec (%#)", (spec, message) => {
    expect(() => createSweepRunner(base, spec as never)).toThrow(message);
    expect(() => createSweepRunner(base, spec as never)).toThrow(RangeError);
  });
});

describe("followShots", () => {
  it("keeps off-end distances and interior fractions as the spread changes", () => {
    const layout = { spacing: 2, channels: 24, firstGeophone: 0, shots: [-5, 0, 23, 46, 50] };
    expect(Array.from(followShots(layout, 4, 24))).toEqual([-5, 0, 46, 92, 96]);
  });
});

import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { planSchema, type Layer, type PlanInput } from "@engine";
import { alignLayers, diffRevisions, matchModels, type DiffSide } from "./plan-diff";
import { summarizeDocument } from "./revisions";

const layer = (velocity: number, thickness?: number, name?: string): Layer => ({
  velocity,
  ...(thickness === undefined ? {} : { thickness }),
  ...(name === undefined ? {} : { name }),
});

const A = layer(500, 2, "soil");
const B = layer(1400, 3, "clay");
const C = layer(3000, undefined, "rock");
const X = layer(900, 0.6, "lens");

function side(input: PlanInput): DiffSide {
  const document = planSchema.parse(input);
  return { document, summary: summarizeDocument(document) };
}

const base: PlanInput = {
  name: "Diff base",
  models: [
    { name: "North", layers: [A, B, C] },
    { name: "South", layers: [A, C] },
  ],
  spread: {
    spacing: 3,
    channels: 24,
    firstGeophone: 0,
    shots: [
      { position: -1.5, label: "A" },
      { position: 70.5, label: "B" },
    ],
  },
};

describe("alignLayers", () => {
  it("reads a layer inserted in the middle as one added layer", () => {
    expect(alignLayers([A, B, C], [A, X, B, C])).toEqual([
      [0, 0],
      [null, 1],
      [1, 2],
      [2, 3],
    ]);
  });

  it("reads a layer taken out as one removed layer", () => {
    expect(alignLayers([A, B, C], [A, C])).toEqual([
      [0, 0],
      [1, null],
      [2, 1],
    ]);
  });

  it("pairs a changed layer with its old self", () => {
    expect(alignLayers([A, B, C], [A, { ...B, thickness: 1 }, C])).toEqual([
      [0, 0],
      [1, 1],
      [2, 2],
    ]);
  });

  it("covers every layer of both lists exactly once, in order (property)", () => {
    const pool = [A, B, C, X, layer(2000, 5), layer(700, 1)];
    const list = fc.array(fc.integer({ min: 0, max: pool.length - 1 }), { maxLength: 8 });
    fc.assert(
      fc.property(list, list, (a, b) => {
        const from = a.map((i) => pool[i]);
        const to = b.map((i) => pool[i]);
        const pairs = alignLayers(from, to);
        const froms = pairs.map((p) => p[0]).filter((i): i is number => i !== null);
        const tos = pairs.map((p) => p[1]).filter((i): i is number => i !== null);
        expect(froms).toEqual(from.map((_, i) => i));
        expect(tos).toEqual(to.map((_, i) => i));
        expect(pairs.every(([i, j]) => i !== null || j !== null)).toBe(true);
      }),
    );
  });
});

describe("matchModels", () => {
  it("matches by name whatever the order, then by position", () => {
    const m = (name: string) => ({ name, layers: [A, C] });
    expect(matchModels([m("a"), m("b")], [m("b"), m("a")])).toEqual([
      [1, 0],
      [0, 1],
    ]);
    expect(matchModels([m("a"), m("b")], [m("a"), m("c"), m("d")])).toEqual([
      [0, 0],
      [1, 1],
      [null, 2],
    ]);
  });
});

describe("diffRevisions", () => {
  it("finds nothing between a revision and itself", () => {
    const diff = diffRevisions(side(base), side(base));
    expect(diff.identical).toBe(true);
    expect(diff.models).toEqual([]);
    expect(diff.verdicts).toEqual([]);
  });

  it("ignores reordered models", () => {
    const reordered = { ...base, models: [base.models[1], base.models[0]] };
    expect(diffRevisions(side(base), side(reordered)).models).toEqual([]);
  });

  it("reports layers, spread, shots and criteria with old and new values", () => {
    const next: PlanInput = {
      ...base,
      models: [
        { name: "North", layers: [A, X, { ...B, thickness: 2.5 }, C] },
        { name: "South", layers: [A, C] },
        { name: "West", layers: [A, C] },
      ],
      spread: {
        spacing: 2,
        channels: 24,
        firstGeophone: 0,
        shots: [
          { position: -1.5, label: "A" },
          { position: 34.5, label: "centre" },
        ],
      },
      criteria: { minGeophones: 3, pickError: 0.0005, depthTolerance: 0.5 },
    };
    const diff = diffRevisions(side(base), side(next));
    expect(diff.identical).toBe(false);
    expect(diff.models.map((m) => [m.change, m.fromName, m.toName])).toEqual([
      ["changed", "North", "North"],
      ["added", null, "West"],
    ]);
    const north = diff.models[0];
    expect(north.layers.map((l) => [l.change, l.fromIndex, l.toIndex])).toEqual([
      ["added", null, 1],
      ["changed", 1, 2],
    ]);
    expect(north.layers[0].fields).toEqual([
      { field: "name", from: null, to: "lens" },
      { field: "velocity", from: null, to: 900 },
      { field: "thickness", from: null, to: 0.6 },
    ]);
    expect(north.layers[1].fields).toEqual([{ field: "thickness", from: 3, to: 2.5 }]);
    expect(diff.models[1].layers.map((l) => l.change)).toEqual(["added", "added"]);
    expect(diff.spread).toEqual([{ field: "spacing", from: 3, to: 2 }]);
    expect(diff.shots).toEqual({
      added: [{ position: 34.5, label: "centre" }],
      removed: [{ position: 70.5, label: "B" }],
    });
    expect(diff.criteria).toEqual([
      { field: "minGeophones", from: 2, to: 3 },
      { field: "depthTolerance", from: 1, to: 0.5 },
    ]);
    expect(diff.name).toBeNull();
  });

  it("reports the verdicts that changed, following layers through an insertion", () => {
    const thick = side({ ...base, models: [{ name: "North", layers: [A, layer(1400, 6), C] }] });
    const thin = side({ ...base, models: [{ name: "North", layers: [A, layer(1400, 0.4), C] }] });
    // The engine's own verdicts are the reference for what changed.
    const statuses = (s: DiffSide) => s.summary!.models[0].refractors.map((r) => r.status);
    const [before, after] = [statuses(thick), statuses(thin)];
    expect(before).not.toEqual(after);
    const diff = diffRevisions(thick, thin);
    const expected = [2, 3]
      .filter((layerNo) => before[layerNo - 2] !== after[layerNo - 2])
      .map((layerNo) => ({ layer: layerNo, from: before[layerNo - 2], to: after[layerNo - 2] }));
    expect(
      diff.verdicts
        .filter((v) => v.layer !== null)
        .map(({ layer, from, to }) => ({ layer, from, to })),
    ).toEqual(expected);
    const worst = diff.verdicts.find((v) => v.layer === null);
    const [w1, w2] = [thick.summary!.worstVerdict, thin.summary!.worstVerdict];
    expect(worst ? [worst.from, worst.to] : null).toEqual(w1 === w2 ? null : [w1, w2]);
    expect(diff.worstVerdict).toEqual(w1 === w2 ? null : { from: w1, to: w2 });

    // Inserting a layer shifts numbers: the rock refractor keeps its identity (layer 2 → 3).
    const inserted = side({ ...base, models: [{ name: "North", layers: [A, layer(1400, 6), C] }] });
    const plain = side({ ...base, models: [{ name: "North", layers: [A, C] }] });
    const rock = diffRevisions(plain, inserted).verdicts.filter((v) => v.layer !== null);
    const rockBefore = plain.summary!.models[0].refractors[0].status;
    const rockAfter = inserted.summary!.models[0].refractors[1].status;
    const lensAfter = inserted.summary!.models[0].refractors[0].status;
    expect(rock).toEqual(
      expect.arrayContaining([expect.objectContaining({ layer: 2, from: null, to: lensAfter })]),
    );
    expect(rock.some((v) => v.layer === 3)).toBe(rockBefore !== rockAfter);
  });
});

import { describe, expect, it } from "vitest";
import type { SectionDraft } from "../plan-form";
import { insertPoint, movePoint, removePoint, spreadExtent } from "../section-edit";
import { buildSectionView, clipLine, lineAt } from "../section-view";

const draft = (): SectionDraft => ({
  surface: [
    [0, 102],
    [60, 99.5],
    [120, 97],
  ],
  layers: [
    {
      name: "silty clay",
      velocity: 550,
      base: [
        [0, 97],
        [50, 93],
        [120, 96],
      ],
    },
    { name: "mudstone", velocity: 2600 },
  ],
});

describe("section editing", () => {
  it("interpolates a polyline linearly (hand computation)", () => {
    // between (0, 97) and (50, 93): at 25 m, 97 + (93 − 97)·25/50 = 95 m
    expect(lineAt(draft().layers[0].base!, 25)).toBeCloseTo(95, 9);
    // level beyond the ends
    expect(lineAt(draft().layers[0].base!, 500)).toBe(96);
    expect(clipLine(draft().surface, 30, 90)).toEqual([
      [30, 100.75],
      [60, 99.5],
      [90, 98.25],
    ]);
  });

  it("keeps an end point at its position and an inner point between its neighbours", () => {
    const moved = movePoint(draft(), -1, 0, 40, 103);
    expect(moved.surface[0]).toEqual([0, 103]);
    const inner = movePoint(draft(), 0, 1, 200, 90);
    expect(inner.layers[0].base![1]).toEqual([120, 90]);
    // the input is not changed
    expect(draft().layers[0].base![1]).toEqual([50, 93]);
  });

  it("inserts a point on the line, so the ground is unchanged", () => {
    const { draft: next, index } = insertPoint(draft(), 0, 85);
    expect(index).toBe(2);
    // between (50, 93) and (120, 96): 93 + 3·35/70 = 94.5 m
    expect(next.layers[0].base![2]).toEqual([85, 94.5]);
  });

  it("refuses to remove an end point or one of the last two", () => {
    expect(removePoint(draft(), -1, 0)).toBeNull();
    expect(removePoint(draft(), -1, 1)?.surface).toEqual([
      [0, 102],
      [120, 97],
    ]);
  });

  it("covers every geophone and shot with a spacing to spare", () => {
    expect(
      spreadExtent({
        spacing: 3,
        channels: 24,
        firstGeophone: 0,
        shots: [{ position: -1.5 }, { position: 70.5 }],
      }),
    ).toEqual([-4.5, 73.5]);
  });

  it("draws elevation upwards and stands geophones on the surface", () => {
    const view = buildSectionView({
      section: draft(),
      spread: { spacing: 10, channels: 12, firstGeophone: 5, shots: [{ position: 0 }] },
      shotIndex: 0,
      width: 600,
      units: "metric",
      exaggeration: 1,
    });
    expect(view.y(102)).toBeLessThan(view.y(97));
    // true scale: a metre across is a metre down
    expect(view.x(10) - view.x(0)).toBeCloseTo(view.y(90) - view.y(100), 6);
    const g = view.geophones[0];
    expect(g.py).toBeCloseTo(view.y(lineAt(draft().surface, 5)), 6);
    expect(view.yLabel).toBe("Elevation (m)");
  });

  it("writes layer velocities grouped, as the layered Section and the tables do (issue 14 QA)", () => {
    const view = buildSectionView({
      section: draft(),
      spread: { spacing: 10, channels: 12, firstGeophone: 5, shots: [{ position: 0 }] },
      shotIndex: 0,
      width: 600,
      units: "imperial",
      exaggeration: 1,
    });
    // 2600 m/s / 0.3048 = 8530 ft/s (by hand): "8,530 ft/s", not "8530 ft/s".
    expect(view.layers[1].velocityText).toBe("8,530 ft/s");
  });
});

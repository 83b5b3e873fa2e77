import { describe, expect, it } from "vitest";
import type { CoverageStretch, InterfaceCoverage } from "@engine";
import type { SectionDraft } from "../plan-form";
import { featureBands, orderStretches, stretchMarks } from "../section-answers";
import { buildSectionView, lineAt } from "../section-view";

/** An invented channel cut into rockhead (positions and elevations in m). */
const section: SectionDraft = {
  surface: [
    [0, 100],
    [120, 100],
  ],
  layers: [
    {
      name: "silty clay",
      velocity: 550,
      base: [
        [0, 96],
        [40, 95],
        [50, 90],
        [58, 90],
        [68, 95],
        [120, 96],
      ],
    },
    { name: "mudstone", velocity: 2600 },
  ],
} as unknown as SectionDraft;

const view = buildSectionView({
  section,
  spread: { spacing: 4, channels: 24, firstGeophone: 10, shots: [{ position: 8 }] },
  shotIndex: 0,
  width: 480,
  units: "metric",
  exaggeration: 1,
} as Parameters<typeof buildSectionView>[0]);

const stretch = (over: Partial<CoverageStretch>): CoverageStretch => ({
  from: 0,
  to: 0,
  geophones: 1,
  status: "under-sampled",
  shot: 0,
  side: "forward",
  judged: true,
  geophonePositions: [],
  ...over,
});

/** Hand-made coverage: the run, then a weak floor, two weak short features side by side, a resolved wall. */
const coverage: InterfaceCoverage[] = [
  {
    layer: 2,
    name: "mudstone",
    status: "under-sampled",
    summary: "",
    stretches: [
      stretch({ from: 12, to: 100, geophones: 20, status: "resolved" }),
      stretch({ from: 40, to: 50, judged: false, feature: "slope dipping 27°" }),
      stretch({ from: 50, to: 58, feature: "channel floor" }),
      stretch({ from: 50, to: 58, feature: "channel floor", shot: 1, side: "reverse" }),
      stretch({ from: 58, to: 59, geophones: 0, feature: "crest" }),
      stretch({ from: 59, to: 60, geophones: 0, feature: "level stretch" }),
    ],
  } as InterfaceCoverage,
];

describe("feature stretches on the section", () => {
  const bands = featureBands(view, section, coverage);

  it("draws one band per under-sampled feature, exactly from its start to its end on the interface", () => {
    // the resolved slope (judged false) is not drawn; the floor flagged by two branches is drawn once
    expect(bands.map((b) => b.feature)).toEqual(["channel floor", "crest", "level stretch"]);
    const floor = bands[0];
    const pts = [...floor.path.matchAll(/[ML](-?[\d.]+),(-?[\d.]+)/g)].map((m) => [
      view.x.invert(Number(m[1])),
      view.y.invert(Number(m[2])),
    ]);
    // ends within one pixel of 50 m and 58 m (path coordinates are rounded to 0.1 px)
    const mPerPx = (view.to - view.from) / (view.x(view.to) - view.x(view.from));
    expect(Math.abs(pts[0][0] - 50)).toBeLessThan(mPerPx);
    expect(Math.abs(pts[pts.length - 1][0] - 58)).toBeLessThan(mPerPx);
    // on the interface itself (independent check: the polyline's elevation there)
    for (const [x, z] of pts)
      expect(Math.abs(z - lineAt(section.layers[0].base!, x))).toBeLessThan(0.1);
    expect(floor.label.text).toBe("channel floor: 1 geophone");
  });

  it("keeps the labels of neighbouring features apart", () => {
    const boxes = bands.map((b) => ({
      x0: b.label.x,
      x1: b.label.x + b.label.text.length * 6.1,
      y: b.label.y,
    }));
    for (let i = 0; i < boxes.length; i++)
      for (let j = i + 1; j < boxes.length; j++) {
        const a = boxes[i];
        const b = boxes[j];
        const overlapX = a.x0 < b.x1 && b.x0 < a.x1;
        const overlapY = Math.abs(a.y - b.y) < 12;
        expect(overlapX && overlapY).toBe(false);
      }
  });

  it("keeps feature stretches off the branch rows and lists weak features first", () => {
    const marks = stretchMarks(view, section, coverage);
    expect(marks.every((m) => m.stretch.feature === undefined)).toBe(true);
    const order = orderStretches(coverage[0].stretches);
    expect(order.slice(0, 4).map((s) => s.feature)).toEqual([
      "channel floor",
      "channel floor",
      "crest",
      "level stretch",
    ]);
  });

  it("never writes two branch counts over each other, nor a feature label over a count", () => {
    // branches whose first-choice count places coincide: 30 % along 12–100 m and 70 % along
    // 10–50 m are both at 38 m, on rows 5 px apart
    const runs: InterfaceCoverage[] = [
      {
        ...coverage[0],
        stretches: [
          stretch({ from: 12, to: 100, geophones: 20, status: "resolved", shot: 0 }),
          stretch({ from: 10, to: 50, geophones: 9, status: "resolved", shot: 1 }),
          stretch({ from: 12, to: 96, geophones: 21, status: "resolved", shot: 2 }),
          stretch({ from: 20, to: 90, geophones: 22, status: "resolved", shot: 3 }),
          stretch({ from: 50, to: 58, feature: "channel floor" }),
        ],
      },
    ];
    const marks = stretchMarks(view, section, runs);
    const boxes = [
      ...marks.flatMap((m) =>
        m.label
          ? [
              {
                x0: m.label.x - m.label.text.length * 3.1,
                x1: m.label.x + m.label.text.length * 3.1,
                y: m.label.y,
              },
            ]
          : [],
      ),
      ...featureBands(view, section, runs, marks).map((b) => ({
        x0: b.label.x,
        x1: b.label.x + b.label.text.length * 6.1,
        y: b.label.y,
      })),
    ];
    expect(boxes.length).toBeGreaterThan(3);
    for (let i = 0; i < boxes.length; i++)
      for (let j = i + 1; j < boxes.length; j++) {
        const a = boxes[i];
        const b = boxes[j];
        expect(a.x0 < b.x1 && b.x0 < a.x1 && Math.abs(a.y - b.y) < 11).toBe(false);
      }
  });
});

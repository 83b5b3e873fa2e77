import { render, screen } from "@testing-library/react";
import { afterEach, describe, expect, it } from "vitest";
import type { Plan, SectionModelAnalysis } from "@engine";
import type { SectionReading } from "../../../../../../workers/field/section-reading";
import { setModeller, type ModellerClient } from "../../../lib/modeller-client";
import { readingSentence, SectionAnswerFigure } from "../section-answers";

/** An invented section plan and a hand-made reading of it (fake results, not the engine's). */
const plan = {
  format: "spreadsight-plan/2",
  name: "Holm Lane, line 1",
  models: [
    {
      kind: "section",
      name: "Trough",
      surface: [
        [-5, 100],
        [75, 100],
      ],
      layers: [
        {
          name: "clay",
          velocity: 500,
          base: [
            [-5, 95],
            [35, 89],
            [75, 95],
          ],
        },
        { name: "rockhead", velocity: 2000 },
      ],
    },
  ],
  spread: { spacing: 3, channels: 24, firstGeophone: 0, shots: [{ position: 0 }] },
  criteria: { minGeophones: 2, pickError: 0.0005, depthTolerance: 1 },
} as unknown as Plan;

const analysis = {
  kind: "section",
  arrivals: [],
  coverage: [],
  section: {
    grid: { cellSize: 0.25, cellSizeSource: "geometry", nx: 1, nz: 1, x0: 0, zTop: 100 },
    warnings: [],
    interpretation: { method: "intercept-time", interfaces: [], worst: null },
    recommendations: [],
  },
} as unknown as SectionModelAnalysis;

const point = (position: number, depth: number, trueDepth: number) => ({
  position,
  depth,
  elevation: 100 - depth,
  trueDepth,
  trueElevation: 100 - trueDepth,
  error: depth - trueDepth,
});

const reading: SectionReading = {
  modelIndex: 0,
  readings: [
    {
      method: "plus-minus",
      datum: 100,
      interfaces: [
        {
          layer: 2,
          velocity: 2000,
          points: [point(30, 8.6, 9.0), point(36, 9.76, 10.6), point(42, 7.7, 8.2)],
          worst: { position: 36, error: 9.76 - 10.6 },
        },
      ],
      worst: { layer: 2, position: 36, error: 9.76 - 10.6 },
      notes: [],
    },
  ],
};

afterEach(() => setModeller(null));

describe("the crew's plus-minus reading on the section", () => {
  it("states the worst depth error and where", () => {
    // −0.84 m = 9.76 − 10.6 (hand-made reading above)
    expect(readingSentence(reading, "metric")).toMatch(
      /^Worst depth error of a plus-minus reading: [−-]0\.84 m at 36(\.0+)? m/,
    );
    expect(readingSentence(null, "metric")).toBeNull();
  });

  it("draws the reading dashed with its legend entry and the worst-error line", async () => {
    const asked: number[] = [];
    const given: unknown[] = [];
    setModeller({
      sectionField: () => new Promise(() => {}),
      sectionReading: (_p: Plan, m: number, _o: unknown, a: { arrivals: unknown }) => {
        asked.push(m);
        given.push(a?.arrivals);
        return Promise.resolve(reading);
      },
    } as unknown as ModellerClient);
    render(
      <SectionAnswerFigure
        plan={plan}
        analysis={analysis}
        modelIndex={0}
        shotIndex={0}
        units="metric"
        showRays={false}
      />,
    );
    expect(
      await screen.findByText(/Worst depth error of a plus-minus reading/),
    ).toBeInTheDocument();
    expect(asked).toEqual([0]);
    // read from the arrivals already on the page, not a second analysis in the worker
    expect(given).toEqual([analysis.arrivals]);
    expect(screen.getByText("crew's reading: plus-minus")).toBeInTheDocument();
    const overlay = document.querySelector('g[aria-label="Crew\'s reading: plus-minus"]');
    expect(overlay).not.toBeNull();
    const path = overlay!.querySelector('path[data-role="reading"]')!;
    // three points: one move and two line segments; dashed unlike the intercept-time "5 4"
    expect(path.getAttribute("d")!.match(/[ML]/g)).toEqual(["M", "L", "L"]);
    expect(path.getAttribute("stroke-dasharray")).not.toBe("5 4");
    expect(path.getAttribute("stroke-dasharray")).toBeTruthy();
  });
});

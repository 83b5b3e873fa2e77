import { render, screen, within } from "@testing-library/react";
import { afterEach, describe, expect, it } from "vitest";
import type { Plan, SectionModelAnalysis } from "@engine";
import { setModeller, type ModellerClient } from "../../../lib/modeller-client";
import { SectionAnswers } from "../section-answers";

/** An invented section plan and a hand-made analysis of it (a fake result, not the engine's). */
const plan = {
  format: "spreadsight-plan/2",
  name: "Fallow Beck, line 3",
  models: [
    {
      kind: "section",
      name: "Channel",
      surface: [
        [-5, 100],
        [75, 100],
      ],
      layers: [
        {
          name: "sandy soil",
          velocity: 600,
          base: [
            [-5, 96],
            [35, 90],
            [75, 96],
          ],
        },
        { name: "rockhead", velocity: 2400 },
      ],
    },
  ],
  spread: { spacing: 3, channels: 24, firstGeophone: 0, shots: [{ position: -1.5 }] },
  criteria: { minGeophones: 2, pickError: 0.0005, depthTolerance: 1 },
} as unknown as Plan;

const analysis = {
  kind: "section",
  arrivals: [
    {
      shot: 0,
      position: -1.5,
      elevation: 100,
      geophones: [
        { position: 0, elevation: 100, time: 0.0025, via: 1 },
        { position: 3, elevation: 100, time: 0.0075, via: 1 },
        { position: 6, elevation: 100, time: 0.011, via: 2 },
      ],
    },
  ],
  coverage: [
    {
      layer: 2,
      name: "rockhead",
      status: "under-sampled",
      summary:
        "rockhead sampled from 12 to 30 m; from 33 to 36 m it is seen on one geophone: under-sampled.",
      stretches: [
        {
          from: 12,
          to: 30,
          geophones: 7,
          status: "resolved",
          shot: 0,
          side: "forward",
          judged: true,
          geophonePositions: [],
        },
        {
          from: 33,
          to: 36,
          geophones: 1,
          status: "under-sampled",
          shot: 0,
          side: "forward",
          judged: true,
          geophonePositions: [],
        },
      ],
    },
  ],
  section: {
    grid: { cellSize: 0.25, cellSizeSource: "geometry", nx: 321, nz: 60, x0: -5, zTop: 100 },
    warnings: ["sandy soil is thinner than two cells between 34 and 36 m"],
    interpretation: { method: "intercept-time", interfaces: [], worst: null },
    recommendations: [
      {
        layer: 2,
        from: 33,
        to: 36,
        spacing: 1,
        shots: [20],
        text: "Use a spacing of at most 1 m and a shot near 20 m to sample 33–36 m.",
      },
    ],
  },
} as unknown as SectionModelAnalysis;

/**
 * The same plan's analysis with feature stretches (hand-made, not the engine's): the channel
 * floor (30–40 m) is seen on 1 geophone by S1 forward and is under-sampled (judged); the
 * west wall (20–30 m) gets 1 exit point on S1 forward but another branch resolves it
 * (judged false). minGeophones is 2 in the plan's criteria.
 */
const withFeatures = {
  ...analysis,
  coverage: [
    {
      layer: 2,
      name: "rockhead",
      status: "under-sampled",
      summary:
        "rockhead sampled from 12 to 60 m; the channel floor from 30 to 40 m is seen on 1 geophone by shot 1 forward: under-sampled.",
      stretches: [
        {
          from: 12,
          to: 60,
          geophones: 17,
          status: "resolved",
          shot: 0,
          side: "forward",
          judged: true,
          geophonePositions: [],
        },
        {
          from: 20,
          to: 30,
          geophones: 1,
          status: "under-sampled",
          shot: 0,
          side: "forward",
          judged: false,
          geophonePositions: [45],
          feature: "west wall",
        },
        {
          from: 30,
          to: 40,
          geophones: 1,
          status: "under-sampled",
          shot: 0,
          side: "forward",
          judged: true,
          geophonePositions: [54],
          feature: "channel floor",
        },
        {
          from: 62,
          to: 69,
          geophones: 1,
          status: "under-sampled",
          shot: 0,
          side: "forward",
          judged: false,
          geophonePositions: [69],
        },
      ],
    },
  ],
  section: {
    ...analysis.section,
    warnings: [],
    recommendations: [
      {
        layer: 2,
        from: 30,
        to: 40,
        spacing: 1.5,
        shots: [10],
        text: "Use a spacing of at most 1.5 m and a shot near 10 m to sample the channel floor.",
      },
    ],
  },
} as unknown as SectionModelAnalysis;

afterEach(() => setModeller(null));

describe("SectionAnswers", () => {
  it("shows the grid cell, the warning, each stretch with its geophones and the recommendation", () => {
    render(
      <SectionAnswers
        plan={plan}
        analysis={analysis}
        modelIndex={0}
        shotIndex={0}
        units="metric"
        tab="resolvability"
      />,
    );
    expect(screen.getByRole("alert").textContent).toMatch(/thinner than two cells/);
    expect(screen.getByText("0.25 m")).toBeInTheDocument();
    const table = screen.getByRole("table", { name: "Stretches of the top of layer 2" });
    const rows = within(table).getAllByRole("row");
    expect(rows[2].textContent).toMatch(/33\.00 m – 36\.00 m.*1.*Under-sampled/);
    expect(screen.getByText(/at most 1 m and a shot near 20 m/)).toBeInTheDocument();
  });

  it("states in feet for an imperial user (1 ft = 0.3048 m exactly)", () => {
    render(
      <SectionAnswers
        plan={plan}
        analysis={analysis}
        modelIndex={0}
        shotIndex={0}
        units="imperial"
        tab="resolvability"
      />,
    );
    // 0.25 m = 0.82 ft
    expect(screen.getByText("0.82 ft")).toBeInTheDocument();
    // The engine's sentences read in feet too (issue 14 QA: they stayed in metres):
    // 12 m = 39 ft, 30 m = 98 ft, 33 m = 108 ft, 36 m = 118 ft; 1 m = 3 ft, 20 m = 66 ft (by hand).
    expect(
      screen.getByText(
        "rockhead sampled from 39 to 98 ft; from 108 to 118 ft it is seen on one geophone: under-sampled.",
      ),
    ).toBeInTheDocument();
    expect(
      screen.getByText("Use a spacing of at most 3 ft and a shot near 66 ft to sample 108–118 ft."),
    ).toBeInTheDocument();
  });

  it("draws the section with the stretches and asks the modeller for the shot's rays", () => {
    const asked: number[] = [];
    setModeller({
      sectionField: (_p: Plan, _m: number, shot: number) => {
        asked.push(shot);
        return new Promise(() => {});
      },
    } as unknown as ModellerClient);
    render(
      <SectionAnswers
        plan={plan}
        analysis={analysis}
        modelIndex={0}
        shotIndex={0}
        units="metric"
        tab="section"
      />,
    );
    expect(
      screen.getByRole("img", { name: /stretches sampled by head waves/ }),
    ).toBeInTheDocument();
    expect(asked).toEqual([0]);
    expect(screen.getByText(/No interface could be interpreted/)).toBeInTheDocument();
  });

  it("lists the under-sampled channel floor first with its exit points and recommendation, and a resolved feature as such", () => {
    render(
      <SectionAnswers
        plan={plan}
        analysis={withFeatures}
        modelIndex={0}
        shotIndex={0}
        units="metric"
        tab="resolvability"
      />,
    );
    const missed = screen.getByRole("group", {
      name: "Features of the top of rockhead the spread misses",
    });
    expect(missed.textContent).toMatch(
      /channel floor\s*30\.00 m – 40\.00 m: 1 geophone \(S1 forward\)/,
    );
    expect(within(missed).getByText(/at most 1\.5 m and a shot near 10 m/)).toBeInTheDocument();
    // the resolved west wall is not listed as missed
    expect(missed.textContent).not.toMatch(/west wall/);

    const table = screen.getByRole("table", { name: "Stretches of the top of layer 2" });
    const rows = within(table).getAllByRole("row");
    // weak feature first (row 0 is the header)
    expect(rows[1].textContent).toMatch(
      /channel floor.*30\.00 m – 40\.00 m.*1 exit point\b.*Under-sampled/,
    );
    const wall = rows.find((r) => /west wall/.test(r.textContent ?? ""));
    expect(wall?.textContent).toMatch(/resolved by another branch/);
    expect(wall?.textContent).not.toMatch(/runs off the spread/);
    // an ordinary unjudged stretch at the end of the spread keeps its reason
    const edge = rows.find((r) => /62\.00 m – 69\.00 m/.test(r.textContent ?? ""));
    expect(edge?.textContent).toMatch(/runs off the spread/);
  });

  it("marks the under-sampled feature on the section's interface, not the resolved one", () => {
    setModeller({
      sectionField: () => new Promise(() => {}),
    } as unknown as ModellerClient);
    render(
      <SectionAnswers
        plan={plan}
        analysis={withFeatures}
        modelIndex={0}
        shotIndex={0}
        units="metric"
        tab="section"
      />,
    );
    const band = screen.getByRole("img", {
      name: "channel floor from 30.00 m to 40.00 m: 1 geophone, under-sampled",
    });
    expect(within(band).getByText("channel floor: 1 geophone")).toBeInTheDocument();
    expect(screen.queryByRole("img", { name: /^west wall/ })).toBeNull();
  });
});

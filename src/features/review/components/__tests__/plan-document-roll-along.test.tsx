import { describe, expect, it } from "vitest";
import { render, screen } from "@testing-library/react";
import type { Plan } from "@engine";
import { PlanDocumentView } from "../plan-document";

const plan = (rollAlong?: { spreads: number; overlap: number }): Plan => ({
  format: "spreadsight-plan/1",
  name: "Invented line",
  models: [{ name: "Two layers", layers: [{ velocity: 500, thickness: 3 }, { velocity: 2000 }] }],
  spread: {
    spacing: 2,
    channels: 48,
    firstGeophone: 0,
    shots: [{ position: -1 }],
    ...(rollAlong ? { rollAlong } : {}),
  },
  criteria: { minGeophones: 2, pickError: 0.0005, depthTolerance: 1 },
});

describe("PlanDocumentView roll-along (light)", () => {
  it("lists a roll-along line's spreads, stations and length", () => {
    render(<PlanDocumentView document={plan({ spreads: 3, overlap: 2 })} units="metric" />);
    // 48 + 2 · 46 = 140 stations over 139 · 2 = 278 m (by hand).
    expect(screen.getByText("Roll-along")).toBeVisible();
    expect(
      screen.getByText("3 spreads of 48, overlap 2: stations 1–140 over 278.0 m"),
    ).toBeVisible();
  });

  it("says nothing of roll-along for one spread", () => {
    render(<PlanDocumentView document={plan()} units="metric" />);
    expect(screen.queryByText("Roll-along")).toBeNull();
  });
});

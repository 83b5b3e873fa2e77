import { describe, expect, it } from "vitest";
import { render, screen, within } from "@testing-library/react";
import type { PlanDiff } from "@/contracts/plans";
import { DiffView } from "../diff-view";
import { PLAN_ID } from "../../testing/fixtures";

const empty: PlanDiff = {
  planId: PLAN_ID,
  from: 1,
  to: 2,
  name: null,
  models: [],
  spread: [],
  shots: { added: [], removed: [] },
  criteria: [],
  worstVerdict: null,
  verdicts: [],
  identical: false,
};

describe("DiffView", () => {
  it("strikes the old value and highlights the new one, in the user's units", () => {
    render(
      <DiffView
        units="metric"
        diff={{
          ...empty,
          spread: [
            { field: "spacing", from: 4, to: 2 },
            { field: "channels", from: 24, to: 48 },
          ],
          criteria: [{ field: "pickError", from: 0.0005, to: 0.001 }],
        }}
      />,
    );
    const oldSpacing = screen.getByText("4.00 m");
    const newSpacing = screen.getByText("2.00 m");
    expect(oldSpacing.tagName).toBe("DEL");
    expect(newSpacing.tagName).toBe("INS");
    expect(oldSpacing.closest("span")).toHaveTextContent("geophone spacing:4.00 m→2.00 m");
    expect(screen.getByText("48").tagName).toBe("INS");
    expect(screen.getByText("0.50 ms").tagName).toBe("DEL");
    expect(screen.getByText("1.00 ms").tagName).toBe("INS");
    expect(screen.getByText("No verdict changed between these revisions.")).toBeInTheDocument();
  });

  it("converts lengths to feet for an imperial user", () => {
    render(
      <DiffView
        units="imperial"
        diff={{ ...empty, spread: [{ field: "spacing", from: 3.048, to: 1.524 }] }}
      />,
    );
    expect(screen.getByText("10.00 ft").tagName).toBe("DEL");
    expect(screen.getByText("5.00 ft").tagName).toBe("INS");
  });

  it("marks verdicts that got worse or better, in words as well as colour", () => {
    render(
      <DiffView
        units="metric"
        diff={{
          ...empty,
          worstVerdict: { from: "under-sampled", to: "resolved" },
          verdicts: [
            {
              model: "Lens present",
              layer: 2,
              from: "under-sampled",
              to: "resolved",
              errorFrom: null,
              errorTo: 0.12,
            },
            {
              model: "Lens present",
              layer: 3,
              from: "resolved",
              to: "blind",
              errorFrom: -0.2,
              errorTo: null,
            },
          ],
        }}
      />,
    );
    const table = screen.getByRole("table", { name: "Verdicts that changed" });
    const [, better, worse] = within(table).getAllByRole("row");
    expect(better).toHaveAttribute("data-trend", "better");
    expect(within(better).getByText("▲ better")).toBeInTheDocument();
    expect(better).toHaveClass("bg-moss-soft/50");
    expect(worse).toHaveAttribute("data-trend", "worse");
    expect(within(worse).getByText("▼ worse")).toBeInTheDocument();
    expect(worse).toHaveClass("bg-brick-soft/50");
    expect(within(worse).getByText("Blind")).toBeInTheDocument();
    expect(within(better).getByText("— → +0.12 m")).toBeInTheDocument();
  });

  it("lists added and removed layers and shots, and changed layer fields", () => {
    render(
      <DiffView
        units="metric"
        diff={{
          ...empty,
          models: [
            {
              change: "changed",
              fromName: "Lens present",
              toName: "Lens present",
              fromIndex: 0,
              toIndex: 0,
              layers: [
                {
                  change: "changed",
                  fromIndex: 1,
                  toIndex: 1,
                  from: { name: "clay lens", velocity: 1300, thickness: 1.5 },
                  to: { name: "clay lens", velocity: 1300, thickness: 2.5 },
                  fields: [{ field: "thickness", from: 1.5, to: 2.5 }],
                },
                {
                  change: "added",
                  fromIndex: null,
                  toIndex: 2,
                  from: null,
                  to: { name: "gravel", velocity: 1800, thickness: 1 },
                  fields: [
                    { field: "name", from: null, to: "gravel" },
                    { field: "velocity", from: null, to: 1800 },
                    { field: "thickness", from: null, to: 1 },
                  ],
                },
              ],
            },
          ],
          shots: { added: [{ position: 23 }], removed: [{ position: 47, label: "east end" }] },
        }}
      />,
    );
    expect(screen.getByText("1.50 m").tagName).toBe("DEL");
    expect(screen.getByText("2.50 m").tagName).toBe("INS");
    const added = screen.getByText("Layer 3 · gravel").closest("li")!;
    expect(within(added).getByText("added")).toBeInTheDocument();
    expect(added).toHaveTextContent("velocity 1,800 m/s");
    expect(screen.getByText("23.0 m").tagName).toBe("INS");
    expect(screen.getByText("east end 47.0 m").tagName).toBe("DEL");
  });

  it("says so when two revisions do not differ", () => {
    render(<DiffView units="metric" diff={{ ...empty, identical: true }} />);
    expect(screen.getByText(/have the same document and the same verdicts/)).toBeInTheDocument();
  });
});

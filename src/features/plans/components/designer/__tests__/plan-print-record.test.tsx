import { afterEach, describe, expect, it, vi } from "vitest";
import { act, render, screen, within } from "@testing-library/react";
import type { PlanAnalysis } from "../../../lib/engine";
import { usePrintMedia } from "../../../hooks/use-print-media";
import { PlanPrintRecord } from "../plan-print-record";
import { planDetail, threeLayerPlan } from "../../../__tests__/fixtures";

/** Only what the record reads of an analysis: the verdict of each model. */
const analysis = {
  worstStatus: "resolved",
  models: [{ worstStatus: "resolved" }],
} as unknown as PlanAnalysis;

describe("PlanPrintRecord", () => {
  it("writes the inputs out in the reader's units, with each model's verdict", () => {
    render(
      <PlanPrintRecord
        detail={planDetail()}
        plan={threeLayerPlan()}
        analysis={analysis}
        units="imperial"
      />,
    );
    expect(screen.getByText("Harrow Beck culvert")).toBeInTheDocument();
    expect(screen.getByText(/revision 3/)).toBeInTheDocument();
    const layers = screen.getByRole("table", { name: "Printed layers of Expected ground" });
    const rows = within(layers).getAllByRole("row");
    // 1 ft = 0.3048 m (the international foot, by definition): 6 m = 19.69 ft, 1600 m/s = 5249 ft/s
    expect(rows[2]).toHaveTextContent("2. stiff clay");
    expect(rows[2]).toHaveTextContent("5,249 ft/s");
    expect(rows[2]).toHaveTextContent("19.69 ft");
    expect(rows[3]).toHaveTextContent("half-space");
    expect(screen.getByText("Resolved")).toBeInTheDocument();
    // 5 m spacing = 16.40 ft; spread (24 − 1) × 5 m = 115 m = 377.30 ft
    expect(screen.getByText(/24 geophones at 16\.40 ft/)).toHaveTextContent("377.30 ft");
    const shots = screen.getByRole("table", { name: "Printed shots" });
    expect(within(shots).getAllByRole("row")).toHaveLength(3);
    expect(shots).toHaveTextContent("-8.20 ft"); // −2.5 m
    expect(shots).toHaveTextContent("end, far");
    expect(screen.getByText(/at least 2 geophones/)).toBeInTheDocument();
  });

  it("says so, and prints no inputs, while the plan as typed has fields to fix", () => {
    render(<PlanPrintRecord detail={planDetail()} plan={null} analysis={null} units="metric" />);
    expect(screen.getByText(/has fields to fix/)).toBeInTheDocument();
    expect(screen.queryByRole("table")).toBeNull();
  });
});

describe("usePrintMedia", () => {
  afterEach(() => vi.unstubAllGlobals());

  function Probe() {
    return <p>{usePrintMedia() ? "printing" : "on screen"}</p>;
  }

  it("follows the print media query and the browser's print events", () => {
    const listeners = new Set<() => void>();
    const query = {
      matches: false,
      addEventListener: (_: string, f: () => void) => listeners.add(f),
      removeEventListener: (_: string, f: () => void) => listeners.delete(f),
    };
    vi.stubGlobal("matchMedia", (q: string) => (q === "print" ? query : null));
    render(<Probe />);
    expect(screen.getByText("on screen")).toBeInTheDocument();

    query.matches = true;
    act(() => listeners.forEach((f) => f()));
    expect(screen.getByText("printing")).toBeInTheDocument();

    query.matches = false;
    act(() => window.dispatchEvent(new Event("afterprint")));
    expect(screen.getByText("on screen")).toBeInTheDocument();
    act(() => window.dispatchEvent(new Event("beforeprint")));
    expect(screen.getByText("printing")).toBeInTheDocument();
  });
});

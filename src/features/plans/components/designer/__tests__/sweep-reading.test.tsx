import { describe, expect, it } from "vitest";
import { render, screen } from "@testing-library/react";
import { SweepReading } from "../sweep-reading";

describe("SweepReading", () => {
  it("says the colour is the worst verdict over all refractors", () => {
    render(<SweepReading axis="channels" channels={24} spacing={2} units="metric" />);
    expect(screen.getByText(/worst verdict over all refractors/)).toBeVisible();
    expect(screen.queryByRole("note")).toBeNull();
  });

  it("warns that a finer spacing shortens the spread when the channel count is fixed", () => {
    render(<SweepReading axis="spacing" channels={24} spacing={3} units="imperial" />);
    // 23 intervals × 3 m = 69 m = 226.38 ft (1 ft = 0.3048 m exactly).
    expect(screen.getByRole("note")).toHaveTextContent(
      /channel count stays at 24.*shortens the spread \(now 226\.38 ft\)/,
    );
  });
});

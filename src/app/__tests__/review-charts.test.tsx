import { describe, expect, it } from "vitest";
import { screen, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp } from "@/testing/render";
import { planDocument } from "@/features/review/testing/fixtures";
import { ReviewCharts } from "../review-charts";

describe("charts on the Review screen", () => {
  it("draws the designer's Arrivals chart for the revision, one model and shot at a time", async () => {
    renderWithApp(<ReviewCharts document={planDocument} units="metric" />);
    const first = `Arrivals, ${planDocument.models[0].name}, shot 1`;
    expect(
      await screen.findByRole("img", { name: new RegExp(first) }, { timeout: 3000 }),
    ).toBeInTheDocument();
    // Read-only: no field of the plan can be edited here.
    expect(screen.queryByRole("spinbutton")).toBeNull();
    expect(screen.queryByRole("textbox")).toBeNull();
    await userEvent.selectOptions(screen.getByLabelText("Shot"), "1");
    const second = `Arrivals, ${planDocument.models[0].name}, shot 2`;
    const chart = await screen.findByRole("img", { name: new RegExp(second) }, { timeout: 3000 });
    expect(within(chart).getAllByText(/offset/i).length).toBeGreaterThan(0);
  });
});

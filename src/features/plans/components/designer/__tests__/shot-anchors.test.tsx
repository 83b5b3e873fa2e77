import { describe, expect, it } from "vitest";
import { screen, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import type { PlanDetail } from "@/contracts/plans";
import { PlanDesignerPage } from "../plan-designer-page";
import { PLAN_ID, planDetail } from "../../../__tests__/fixtures";

function open(detail: PlanDetail = planDetail()) {
  const calls = stubFetch({
    [`GET /api/plans/${PLAN_ID}`]: () => ({ status: 200, body: detail }),
  });
  renderWithApp(<PlanDesignerPage />, {
    path: "/plans/:planId",
    route: `/plans/${PLAN_ID}`,
    me: testMe(),
  });
  return calls;
}

describe("shot anchors in the designer", () => {
  it("keeps an end shot beyond the last geophone when channels go from 24 to 48", async () => {
    open();
    await userEvent.click(await screen.findByRole("tab", { name: "Spread" }));
    // The fixture's old plan has no anchors: both shots are fixed.
    expect(screen.getByLabelText("Shot 2 placed")).toHaveValue("");
    await userEvent.selectOptions(screen.getByLabelText("Shot 2 placed"), "end");
    // 24 geophones at 5 m end at 115 m (by hand); the shot at 117.5 m is 2.5 m beyond.
    expect(screen.getByLabelText("Shot 2 offset from the end (m)")).toHaveValue("2.5");
    const channels = screen.getByLabelText("Channels");
    await userEvent.clear(channels);
    await userEvent.type(channels, "48");
    // 48 geophones at 5 m end at 235 m: the end shot stands at 237.5 m, still outside.
    const row = screen.getByLabelText("Shot 2 placed").closest("tr")!;
    expect(within(row).getByText("at 237.50 m")).toBeVisible();
    expect(within(row).getByText(/beyond the last/)).toBeVisible();
    // Shot 1 stayed fixed at −2.5 m.
    expect(screen.getByLabelText("Shot 1 position (m)")).toHaveValue("-2.5");
  });

  it("anchors new end and centre shots by default", async () => {
    open();
    await userEvent.click(await screen.findByRole("tab", { name: "Spread" }));
    await userEvent.click(screen.getByRole("button", { name: "+ Centre shot" }));
    expect(screen.getByLabelText("Shot 3 placed")).toHaveValue("centre");
    await userEvent.click(screen.getByRole("button", { name: "+ Off-end shots" }));
    expect(screen.getByLabelText("Shot 4 placed")).toHaveValue("start");
    expect(screen.getByLabelText("Shot 5 placed")).toHaveValue("end");
  });
});

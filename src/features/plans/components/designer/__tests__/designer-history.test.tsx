import { describe, expect, it } from "vitest";
import { fireEvent, screen, waitFor } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import { PlanDesignerPage } from "../plan-designer-page";
import { PLAN_ID, planDetail } from "../../../__tests__/fixtures";

describe("designer undo and redo", () => {
  it("undoes a typed velocity with Ctrl+Z and the button, and redoes it", async () => {
    stubFetch({ [`GET /api/plans/${PLAN_ID}`]: () => ({ status: 200, body: planDetail() }) });
    renderWithApp(<PlanDesignerPage />, {
      path: "/plans/:planId",
      route: `/plans/${PLAN_ID}`,
      me: testMe(),
    });
    await screen.findByLabelText("Layer 2 velocity (m/s)");
    // Undo redraws the layer rows: look the box up again each time.
    const velocity = () => screen.getByLabelText("Layer 2 velocity (m/s)");
    const undo = screen.getByRole("button", { name: "↶ Undo" });
    expect(undo).toBeDisabled();
    fireEvent.change(velocity(), { target: { value: "1800" } });
    expect(await screen.findByText("● Unsaved changes")).toBeVisible();
    await userEvent.keyboard("{Control>}z{/Control}");
    expect(velocity()).toHaveValue("1600");
    await waitFor(() => expect(screen.queryByText("● Unsaved changes")).toBeNull());
    await userEvent.click(screen.getByRole("button", { name: "↷ Redo" }));
    expect(velocity()).toHaveValue("1800");
    await userEvent.click(undo);
    expect(velocity()).toHaveValue("1600");
    await userEvent.keyboard("{Control>}{Shift>}z{/Shift}{/Control}");
    expect(velocity()).toHaveValue("1800");
  });
});

import { describe, expect, it } from "vitest";
import { screen, waitFor, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import type { PlanDetail } from "@/contracts/plans";
import { PlanDesignerPage } from "../plan-designer-page";
import { PLAN_ID, planDetail } from "../../../__tests__/fixtures";

const route = `/plans/${PLAN_ID}`;

function open(detail: PlanDetail = planDetail(), me = testMe(), extra = {}) {
  const calls = stubFetch({
    [`GET /api/plans/${PLAN_ID}`]: () => ({ status: 200, body: detail }),
    ...extra,
  });
  const utils = renderWithApp(<PlanDesignerPage />, { path: "/plans/:planId", route, me });
  return { calls, ...utils };
}

const upToDate = () => screen.findByText("Analysis up to date", {}, { timeout: 3000 });

describe("PlanDesignerPage", () => {
  it("shows the plan's layers in the user's units and the engine's verdict", async () => {
    open();
    expect(await screen.findByRole("heading", { name: "Culvert crossing, line 2" })).toBeVisible();
    expect(screen.getByLabelText("Layer 2 velocity (m/s)")).toHaveValue("1600");
    expect(screen.getByLabelText("Layer 1 thickness (m)")).toHaveValue("3");
    await upToDate();
    expect(
      within(screen.getByLabelText("Verdicts")).getAllByText("Resolved").length,
    ).toBeGreaterThan(0);
  });

  it("converts to feet for an imperial user and states limits in feet too", async () => {
    open(planDetail(), testMe({ preferences: { units: "imperial" } }));
    const velocity = await screen.findByLabelText("Layer 2 velocity (ft/s)");
    expect(velocity).toHaveValue("5249");
    expect(screen.getByLabelText("Layer 1 thickness (ft)")).toHaveValue("9.84");
    await userEvent.clear(velocity);
    await userEvent.type(velocity, "40000");
    expect(
      await screen.findByText("velocity must be at most 10000 m/s (32808 ft/s)"),
    ).toBeVisible();
  });

  it("explains a bad value inline, naming the field, and holds the analysis", async () => {
    open();
    await upToDate();
    const velocity = screen.getByLabelText("Layer 2 velocity (m/s)");
    await userEvent.clear(velocity);
    expect(await screen.findByText("velocity is required")).toBeVisible();
    expect(velocity).toHaveAttribute("aria-invalid", "true");
    await userEvent.type(velocity, "-5");
    expect(await screen.findByText("velocity must be > 0")).toBeVisible();
    expect(await screen.findByText(/Fix 1 marked field to update the analysis/)).toBeVisible();
  });

  it("adds a layer above the half-space, marks its empty boxes, and removes it again", async () => {
    open();
    await upToDate();
    expect(screen.queryByLabelText("Layer 4 velocity (m/s)")).toBeNull();
    await userEvent.click(screen.getByRole("button", { name: "Add layer above the half-space" }));
    const added = screen.getByLabelText("Layer 3 velocity (m/s)");
    expect(added).toHaveValue("");
    expect(screen.getByLabelText("Layer 4 velocity (m/s)")).toHaveValue("3000");
    // an empty box is "required", not "not a number"
    expect(await screen.findByText("velocity is required")).toBeVisible();
    expect(screen.queryByText("velocity must be a number")).toBeNull();
    await userEvent.type(added, "900");
    expect(
      await screen.findByText("layer 3 needs a thickness (only the last layer is a half-space)"),
    ).toBeVisible();
    await userEvent.click(screen.getByRole("button", { name: "Remove layer 3" }));
    expect(screen.queryByLabelText("Layer 4 velocity (m/s)")).toBeNull();
    expect(screen.getByLabelText("Layer 3 velocity (m/s)")).toHaveValue("3000");
    await upToDate();
  });

  it("saves with Ctrl+S carrying the base revision and an SI document", async () => {
    const saved = planDetail({ revision: 4 });
    const { calls } = open(planDetail(), testMe({ preferences: { units: "imperial" } }), {
      [`PUT /api/plans/${PLAN_ID}`]: () => ({ status: 200, body: saved }),
    });
    const thickness = await screen.findByLabelText("Layer 1 thickness (ft)");
    await userEvent.clear(thickness);
    await userEvent.type(thickness, "10");
    expect(await screen.findByText("● Unsaved changes")).toBeVisible();
    await userEvent.keyboard("{Control>}s{/Control}");
    await waitFor(() => expect(calls.filter((c) => c.method === "PUT")).toHaveLength(1));
    const body = calls.find((c) => c.method === "PUT")?.body as {
      baseRevision: number;
      document: { models: Array<{ layers: Array<{ thickness?: number }> }> };
    };
    expect(body.baseRevision).toBe(3);
    expect(body.document.models[0].layers[0].thickness).toBeCloseTo(3.048, 9);
    expect(await screen.findByText(/revision 4/)).toBeVisible();
    expect(screen.queryByText("● Unsaved changes")).toBeNull();
  });

  it("offers reload or a copy when someone saved meanwhile, keeping the edits", async () => {
    open(planDetail(), testMe(), {
      [`PUT /api/plans/${PLAN_ID}`]: () => ({
        status: 409,
        body: { error: { code: "revision_conflict", message: "The plan changed." } },
      }),
    });
    const velocity = await screen.findByLabelText("Layer 2 velocity (m/s)");
    await userEvent.clear(velocity);
    await userEvent.type(velocity, "1700");
    await userEvent.click(screen.getByRole("button", { name: "Save" }));
    expect(await screen.findByText(/Someone saved a newer revision of this plan/)).toBeVisible();
    expect(screen.getByRole("button", { name: "Reload their version" })).toBeVisible();
    expect(screen.getByRole("button", { name: "Save as a copy" })).toBeVisible();
    expect(screen.getByLabelText("Layer 2 velocity (m/s)")).toHaveValue("1700");
  });

  it("is read only for a user who may not edit", async () => {
    open(
      planDetail({ permissions: { ...planDetail().permissions, edit: false } }),
      testMe({ role: "reviewer" }),
    );
    expect(await screen.findByLabelText("Layer 2 velocity (m/s)")).toBeDisabled();
    expect(screen.queryByRole("button", { name: "Save" })).toBeNull();
    expect(screen.queryByRole("button", { name: "Add layer above the half-space" })).toBeNull();
    expect(screen.getByText("· read only")).toBeVisible();
  });

  it("applies the recommendation to the spread in one click", async () => {
    open();
    await upToDate();
    await userEvent.click(screen.getByRole("tab", { name: "Resolvability" }));
    const apply = await screen.findByRole("button", { name: /^Keep spread length: / });
    const [, spacing, channels] = /: ([\d.]+) m × (\d+)/.exec(apply.textContent ?? "")!;
    await userEvent.click(apply);
    await userEvent.click(screen.getByRole("tab", { name: "Spread" }));
    expect(screen.getByLabelText("Spacing (m)")).toHaveValue(String(Number(spacing)));
    expect(screen.getByLabelText("Channels")).toHaveValue(channels);
    expect(screen.getByText("● Unsaved changes")).toBeVisible();
  });

  it("adds no second shot where one already stands, also for an imperial user", async () => {
    // the fixture's spread already has end shots half a spacing beyond each end geophone
    open(planDetail(), testMe({ preferences: { units: "imperial" } }));
    await upToDate();
    await userEvent.click(screen.getByRole("tab", { name: "Spread" }));
    const positions = () => screen.getAllByLabelText(/^Shot \d+ placed$/);
    expect(positions()).toHaveLength(2);
    await userEvent.click(screen.getByRole("button", { name: "+ End shots" }));
    expect(positions()).toHaveLength(2);
    await userEvent.click(screen.getByRole("button", { name: "+ Centre shot" }));
    expect(positions()).toHaveLength(3);
    await userEvent.click(screen.getByRole("button", { name: "+ Centre shot" }));
    expect(positions()).toHaveLength(3);
  });

  it("states the pick-error limit in ms, the unit of its box", async () => {
    open();
    await upToDate();
    await userEvent.click(screen.getByRole("tab", { name: "Spread" }));
    const pickError = screen.getByLabelText("Pick error (ms)");
    await userEvent.clear(pickError);
    await userEvent.type(pickError, "500");
    expect(
      await screen.findByText("pick error must be between 0 and 0.1 s (100 ms)"),
    ).toBeVisible();
  });
});

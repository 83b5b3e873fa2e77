/**
 * The designer with the comment threads the app lends it (router wiring): the Review feature's
 * counts and threads beside a shot and a layer, on a read-only plan a reviewer comments on.
 */
import { describe, expect, it } from "vitest";
import { fireEvent, screen, waitFor, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import type { CommentCreateInput, CommentView } from "@/contracts/plans";
import { PlanDesignerPage } from "@/features/plans/components/designer/plan-designer-page";
import { DesignerSlotsProvider } from "@/features/plans/designer-slots";
import { PLAN_ID, planDetail } from "@/features/plans/__tests__/fixtures";
import { comment, members, reviewerId } from "@/features/review/testing/fixtures";
import { designerSlots } from "../designer-route";

const base = `/api/plans/${PLAN_ID}`;
const reviewer = testMe({
  role: "reviewer",
  user: { id: reviewerId, email: "oskar@example.test", name: "Oskar Bellweather" },
});
const inReview = planDetail({
  status: "in-review",
  permissions: { ...planDetail().permissions, edit: false, duplicate: false, comment: true },
});

function serve(initial: CommentView[]) {
  let list = [...initial];
  const calls = stubFetch({
    [`GET ${base}`]: () => ({ status: 200, body: inReview }),
    [`GET ${base}/comments`]: () => ({ status: 200, body: list }),
    "GET /api/team/members": () => ({ status: 200, body: members }),
    [`POST ${base}/comments`]: (body) => {
      const input = body as CommentCreateInput;
      const created = comment({
        body: input.body,
        anchor: input.anchor ? { ...input.anchor, model: input.anchor.model ?? 0 } : null,
        createdAt: "2026-11-21T08:00:00.000Z",
      });
      list = [...list, created];
      return { status: 201, body: created };
    },
  });
  return calls;
}

function open(edit: "models" | "spread") {
  renderWithApp(
    <DesignerSlotsProvider slots={designerSlots}>
      <PlanDesignerPage />
    </DesignerSlotsProvider>,
    { path: "/plans/:planId", route: `/plans/${PLAN_ID}?edit=${edit}`, me: reviewer },
  );
}

// user-event treats everything inside the read-only plan's disabled fieldset as disabled, which
// browsers do not for a non-control (the e2e test clicks the chip for real); click it directly.
const press = (element: HTMLElement) => fireEvent.click(element);

describe("comments in the designer, lent by the Review feature", () => {
  it("counts a shot's open threads on its chip and opens them with a reply beside the shot", async () => {
    const root = comment({
      body: "Move the far shot off the road verge.",
      anchor: { kind: "shot", model: 0, index: 1 },
    });
    const reply = comment({ parentId: root.id, body: "It can go 2 m further out." });
    const resolved = comment({
      body: "Old question on the far shot.",
      anchor: { kind: "shot", model: 0, index: 1 },
      resolved: true,
    });
    const whole = comment({ body: "Looks good overall." });
    const layer = comment({
      body: "Clay thickness?",
      anchor: { kind: "layer", model: 0, index: 1 },
    });
    serve([root, reply, resolved, whole, layer]);
    open("spread");

    const chip = await screen.findByRole("button", {
      name: "Comments on shot 2 (1 open, 1 resolved)",
    });
    expect(chip).toHaveTextContent("1");
    expect(screen.getByRole("button", { name: "Comments on shot 1" })).not.toHaveTextContent(/\d/);

    press(chip);
    const panel = screen.getByRole("dialog", { name: "Comments on shot 2" });
    const threads = await within(panel).findAllByRole("article");
    expect(threads).toHaveLength(1);
    expect(within(threads[0]).getByText("Move the far shot off the road verge.")).toBeVisible();
    expect(within(threads[0]).getByText("It can go 2 m further out.")).toBeVisible();
    expect(within(panel).queryByText("Looks good overall.")).toBeNull();
    expect(within(panel).queryByText("Clay thickness?")).toBeNull();
  });

  it("posts a new comment anchored at the layer whose chip was opened, and counts it", async () => {
    const calls = serve([]);
    open("models");
    const chip = await screen.findByRole("button", { name: "Comments on layer 2" });
    press(chip);
    const panel = screen.getByRole("dialog", { name: "Comments on layer 2" });
    const box = await within(panel).findByRole("combobox", {
      name: "New note on Layer 2 · stiff clay",
    });
    await userEvent.type(box, "Is the clay really 6 m thick here?");
    await userEvent.click(within(panel).getByRole("button", { name: "Post note" }));

    await within(panel).findByText("Is the clay really 6 m thick here?");
    const posts = calls.filter((c) => c.method === "POST");
    expect(posts).toEqual([
      {
        method: "POST",
        url: `${base}/comments`,
        body: {
          body: "Is the clay really 6 m thick here?",
          anchor: { kind: "layer", model: 0, index: 1 },
        },
      },
    ]);
    await waitFor(() =>
      expect(screen.getByRole("button", { name: "Comments on layer 2 (1 open)" })).toBeVisible(),
    );
    expect(calls.some((c) => c.method === "PUT")).toBe(false);
  });
});

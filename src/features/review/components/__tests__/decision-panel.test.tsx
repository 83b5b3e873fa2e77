import { describe, expect, it } from "vitest";
import { screen, waitFor } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import type { PlanDetail } from "@/contracts/plans";
import { DecisionPanel } from "../decision-panel";
import { noPermissions, PLAN_ID, planDetail } from "../../testing/fixtures";

const base = `/api/plans/${PLAN_ID}`;
const buttonNames = () => screen.queryAllByRole("button").map((b) => b.textContent?.trim());

describe("DecisionPanel", () => {
  const cases: Array<{
    who: string;
    permissions: Partial<PlanDetail["permissions"]>;
    status: PlanDetail["status"];
    buttons: string[];
  }> = [
    {
      who: "a reviewer on a plan in review",
      permissions: { decide: true, comment: true },
      status: "in-review",
      buttons: ["✓ Sign off for mobilisation", "↺ Return to lead with notes"],
    },
    {
      who: "a lead on a draft",
      permissions: { submit: true, edit: true, comment: true },
      status: "draft",
      buttons: ["Submit for review"],
    },
    {
      who: "a lead on an approved plan",
      permissions: { reopen: true, comment: true },
      status: "approved",
      buttons: ["Start a new revision"],
    },
    { who: "a trainee", permissions: {}, status: "in-review", buttons: [] },
  ];
  for (const c of cases) {
    it(`offers ${c.who} exactly ${c.buttons.length ? c.buttons.join(" and ") : "no buttons"}`, () => {
      renderWithApp(
        <DecisionPanel
          plan={planDetail({
            status: c.status,
            permissions: { ...noPermissions, ...c.permissions },
          })}
        />,
        { me: testMe({ role: "reviewer" }) },
      );
      expect(buttonNames()).toEqual(c.buttons);
    });
  }

  it("tells a user without buttons what happens next", () => {
    renderWithApp(
      <DecisionPanel plan={planDetail({ status: "in-review", permissions: noPermissions })} />,
    );
    expect(
      screen.getByText(
        /A reviewer signs it off for mobilisation or returns it to the lead with notes/,
      ),
    ).toBeInTheDocument();
  });

  it("tells the author of a sandbox scenario that it never goes to review, not that a lead submits it", () => {
    renderWithApp(
      <DecisionPanel
        plan={planDetail({
          status: "draft",
          sandbox: true,
          permissions: { ...noPermissions, edit: true, duplicate: true },
        })}
      />,
      { me: testMe({ role: "trainee" }) },
    );
    expect(screen.getByText(/sandbox scenario/)).toHaveTextContent("is never submitted for review");
    expect(screen.queryByText(/A survey lead submits it/)).toBeNull();
    expect(buttonNames()).toEqual([]);
  });

  it("refuses to request changes without a note, inline, and sends nothing", async () => {
    const calls = stubFetch({});
    renderWithApp(
      <DecisionPanel plan={planDetail({ permissions: { ...noPermissions, decide: true } })} />,
    );
    await userEvent.click(screen.getByRole("button", { name: "↺ Return to lead with notes" }));
    const note = screen.getByLabelText("Note for the survey lead");
    expect(await screen.findByText("say what needs to change")).toBeInTheDocument();
    expect(note).toHaveAttribute("aria-invalid", "true");
    expect(calls).toHaveLength(0);
  });

  it("requests changes with the note and shows the new status", async () => {
    let status: PlanDetail["status"] = "in-review";
    const calls = stubFetch({
      [`POST ${base}/request-changes`]: () => {
        status = "changes-requested";
        return { status: 200, body: planDetail({ status, permissions: noPermissions }) };
      },
      [`GET ${base}`]: () => ({ status: 200, body: planDetail({ status }) }),
    });
    renderWithApp(
      <DecisionPanel plan={planDetail({ permissions: { ...noPermissions, decide: true } })} />,
    );
    await userEvent.type(
      screen.getByLabelText("Note for the survey lead"),
      "Halve the spacing near the lens.",
    );
    await userEvent.click(screen.getByRole("button", { name: "↺ Return to lead with notes" }));
    await waitFor(() =>
      expect(calls.find((c) => c.method === "POST")).toMatchObject({
        url: `${base}/request-changes`,
        body: { note: "Halve the spacing near the lens." },
      }),
    );
    expect(screen.queryByText("say what needs to change")).toBeNull();
  });

  it("approves without a note, sending an empty body", async () => {
    const calls = stubFetch({
      [`POST ${base}/approve`]: () => ({
        status: 200,
        body: planDetail({ status: "approved", permissions: noPermissions }),
      }),
    });
    renderWithApp(
      <DecisionPanel plan={planDetail({ permissions: { ...noPermissions, decide: true } })} />,
    );
    await userEvent.click(screen.getByRole("button", { name: "✓ Sign off for mobilisation" }));
    await waitFor(() => expect(calls.find((c) => c.method === "POST")?.body).toEqual({}));
    expect(calls[0].url).toBe(`${base}/approve`);
  });

  it("says in our words when a step no longer applies", async () => {
    const calls = stubFetch({
      [`POST ${base}/approve`]: () => ({
        status: 409,
        body: {
          error: {
            code: "illegal_transition",
            message: "cannot approve a plan that is signed off (only from in review)",
          },
        },
      }),
      [`GET ${base}`]: () => ({ status: 200, body: planDetail({ status: "approved" }) }),
    });
    renderWithApp(
      <DecisionPanel plan={planDetail({ permissions: { ...noPermissions, decide: true } })} />,
    );
    await userEvent.click(screen.getByRole("button", { name: "✓ Sign off for mobilisation" }));
    expect(
      await screen.findByText(/This step no longer applies: someone moved the plan on meanwhile/),
    ).toBeInTheDocument();
    // The API's own words ("approve") never reach the reviewer.
    expect(screen.queryByText(/cannot approve/)).toBeNull();
    expect(calls.filter((c) => c.method === "POST")).toHaveLength(1);
  });

  it("shows the server's message for any other refusal", async () => {
    stubFetch({
      [`POST ${base}/submit`]: () => ({
        status: 403,
        body: { error: { code: "forbidden", message: "only a survey lead may submit" } },
      }),
    });
    renderWithApp(
      <DecisionPanel
        plan={planDetail({ status: "draft", permissions: { ...noPermissions, submit: true } })}
      />,
    );
    await userEvent.click(screen.getByRole("button", { name: "Submit for review" }));
    expect(await screen.findByText("only a survey lead may submit")).toBeInTheDocument();
  });
});

import { describe, expect, it } from "vitest";
import { screen, waitFor, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import type { RevisionAnalysisSummary, RevisionDetail, RevisionSummary } from "@/contracts/plans";
import { ReviewPage } from "../review-page";
import {
  leadId,
  members,
  noPermissions,
  PLAN_ID,
  planDetail,
  planDocument,
} from "../../testing/fixtures";

const base = `/api/plans/${PLAN_ID}`;

const stored: RevisionAnalysisSummary = {
  format: "spreadsight-revision-summary/1",
  worstVerdict: "blind",
  models: [
    {
      name: "Lens present",
      worstStatus: "blind",
      direct: "resolved",
      recommendation: "Layer 2 is in the blind zone.",
      refractors: [
        {
          layer: 2,
          name: "clay lens",
          status: "blind",
          trueDepth: 2,
          interpretedDepth: null,
          error: null,
          exceedsTolerance: false,
          minimumThickness: 3.1,
        },
        {
          layer: 3,
          name: "weathered sandstone",
          status: "resolved",
          trueDepth: 3.5,
          interpretedDepth: 2.1,
          error: -1.4,
          exceedsTolerance: true,
          minimumThickness: null,
        },
      ],
    },
  ],
  recommendation: {
    maxSpacing: 1,
    spreadLength: 40,
    channels: 41,
    text: "Use spacing at most 1 m.",
  },
};

const revisions: RevisionSummary[] = [
  {
    number: 1,
    author: { id: leadId, name: "Tamsin Orchard" },
    createdAt: "2026-11-18T08:00:00Z",
    message: null,
    worstVerdict: "blind",
  },
  {
    number: 2,
    author: { id: leadId, name: "Tamsin Orchard" },
    createdAt: "2026-11-20T09:30:00Z",
    message: "added a shot",
    worstVerdict: "blind",
  },
];

function serve(summary: RevisionAnalysisSummary | null) {
  const revision: RevisionDetail = { ...revisions[1], document: planDocument, summary };
  return stubFetch({
    [`GET ${base}`]: () => ({
      status: 200,
      body: planDetail({ permissions: { ...noPermissions, decide: true, comment: true } }),
    }),
    [`GET ${base}/revisions/2`]: () => ({ status: 200, body: revision }),
    [`GET ${base}/revisions`]: () => ({ status: 200, body: revisions }),
    [`GET ${base}/comments`]: () => ({ status: 200, body: [] }),
    [`GET ${base}/activity`]: () => ({
      status: 200,
      body: [
        {
          id: "a2",
          actorName: "Oskar Bellweather",
          action: "plan.request_changes",
          targetType: "plan",
          targetId: PLAN_ID,
          detail: { note: "Add a centre shot." },
          createdAt: "2026-11-19T10:00:00Z",
        },
        {
          id: "a1",
          actorName: "Tamsin Orchard",
          action: "plan.submit",
          targetType: "plan",
          targetId: PLAN_ID,
          detail: null,
          createdAt: "2026-11-18T10:00:00Z",
        },
      ],
    }),
    [`GET ${base}/diff?from=1&to=2`]: () => ({
      status: 200,
      body: {
        planId: PLAN_ID,
        from: 1,
        to: 2,
        name: null,
        models: [],
        spread: [],
        shots: { added: [{ position: 23 }], removed: [] },
        criteria: [],
        worstVerdict: null,
        verdicts: [],
        identical: false,
      },
    }),
    "GET /api/team/members": () => ({ status: 200, body: members }),
  });
}

const renderPage = () =>
  renderWithApp(<ReviewPage />, {
    me: testMe({ role: "reviewer" }),
    path: "/plans/:planId/review",
    route: `/plans/${PLAN_ID}/review`,
  });

describe("ReviewPage", () => {
  it("shows the status in our words, the stored verdicts with depth errors, and the decision buttons", async () => {
    serve(stored);
    renderPage();
    expect(
      await screen.findByRole("heading", { name: "Review: Tollbar cutting, line A" }),
    ).toBeInTheDocument();
    expect(screen.getByText("In review")).toBeInTheDocument();
    // Author and time read as one phrase: no piece of the wrapping line starts with "·".
    expect(screen.getByTestId("review-byline").textContent).toMatch(/^by .+, updated /);
    const title = screen.getByRole("heading", { name: /^Review:/ });
    for (const piece of Array.from(title.nextElementSibling?.children ?? []))
      expect(piece.textContent?.trim()).not.toMatch(/^·/);
    const table = await screen.findByRole("table", { name: "Resolvability of Lens present" });
    const rows = within(table).getAllByRole("row");
    expect(within(rows[1]).getByText("Blind")).toBeInTheDocument();
    expect(within(rows[1]).getByText("not seen")).toBeInTheDocument();
    expect(within(rows[2]).getByText("-1.40 m")).toHaveClass("text-brick");
    expect(
      screen.getByText("From the analysis saved with this revision.", { exact: false }),
    ).toBeInTheDocument();
    expect(screen.getByRole("button", { name: "✓ Sign off for mobilisation" })).toBeInTheDocument();
    expect(screen.getByRole("button", { name: "↺ Return to lead with notes" })).toBeInTheDocument();
    const note = await screen.findByLabelText("Latest note");
    expect(note).toHaveTextContent("Returned with notes by Oskar Bellweather");
    expect(note).toHaveTextContent("Add a centre shot.");
  });

  it("gives the stored recommendation sentence in the reader's units, like the table beside it", async () => {
    serve(stored);
    renderWithApp(<ReviewPage />, {
      me: testMe({ role: "reviewer", preferences: { units: "imperial" } }),
      path: "/plans/:planId/review",
      route: `/plans/${PLAN_ID}/review`,
    });
    const sentence = await screen.findByText("Recommendation at this revision:", { exact: false });
    // 1 m = 3.28 ft (1 ft = 0.3048 m exactly); the engine wrote "1 m".
    expect(sentence.parentElement).toHaveTextContent("Use spacing at most 3.3 ft.");
    expect(sentence.parentElement).not.toHaveTextContent(/\d m\b/);
  });

  it("analyses the revision in the browser when it carries no stored summary", async () => {
    serve(null);
    renderPage();
    const table = await screen.findByRole("table", { name: "Resolvability of Lens present" });
    expect(within(table).getAllByRole("row")).toHaveLength(3);
    expect(screen.getByText(/Analysed in your browser/)).toBeInTheDocument();
  });

  it("lists the revisions and shows what changed between the last two", async () => {
    const calls = serve(stored);
    renderPage();
    await userEvent.click(await screen.findByRole("tab", { name: "History" }));
    const list = await screen.findByRole("list", { name: "Revisions" });
    const items = within(list).getAllByRole("listitem");
    expect(items[0]).toHaveTextContent("Revision 2(latest)");
    expect(items[0]).toHaveTextContent("“added a shot”");
    expect((await screen.findByText("23.0 m")).tagName).toBe("INS");
    expect(calls.some((c) => c.url === `${base}/diff?from=1&to=2`)).toBe(true);
  });

  it("shows the plan's activity with a CSV download link", async () => {
    serve(stored);
    renderPage();
    await userEvent.click(await screen.findByRole("tab", { name: "Activity" }));
    const list = await screen.findByRole("list", { name: "Activity" });
    expect(within(list).getAllByRole("listitem")[0]).toHaveTextContent(
      "Oskar Bellweatherreturned the plan to the lead with notes— note: Add a centre shot.",
    );
    expect(screen.getByRole("link", { name: "Download CSV" })).toHaveAttribute(
      "href",
      `${base}/activity.csv`,
    );
  });

  it("says plainly when the plan cannot be opened", async () => {
    stubFetch({
      [`GET ${base}`]: () => ({
        status: 404,
        body: { error: { code: "not_found", message: "plan not found" } },
      }),
    });
    renderPage();
    expect(await screen.findByText("Cannot open this plan for review")).toBeInTheDocument();
    await waitFor(() =>
      expect(screen.getByText(/does not exist, or you cannot see it/)).toBeInTheDocument(),
    );
    // Trying again cannot help with a plan that is not there; the way back is offered instead.
    expect(screen.queryByRole("button", { name: "Try again" })).toBeNull();
    expect(screen.getByRole("link", { name: "Back to Sites" })).toHaveAttribute("href", "/sites");
  });

  it("says the same, not the server's path check, for a mistyped plan address", async () => {
    stubFetch({
      "GET /api/plans/not-a-uuid": () => ({
        status: 400,
        body: {
          error: {
            code: "invalid_input",
            message: "invalid path: id: id must be a UUID",
            fields: { id: ["id must be a UUID"] },
          },
        },
      }),
    });
    renderWithApp(<ReviewPage />, {
      me: testMe({ role: "reviewer" }),
      path: "/plans/:planId/review",
      route: "/plans/not-a-uuid/review",
    });
    expect(await screen.findByText(/does not exist, or you cannot see it/)).toBeInTheDocument();
    expect(screen.queryByText(/invalid path/)).toBeNull();
  });

  it("moves between Plan, History and Activity with the arrow keys, Home and End", async () => {
    serve(stored);
    renderPage();
    const plan = await screen.findByRole("tab", { name: "Plan" });
    expect(plan).toHaveAttribute("tabindex", "0");
    expect(screen.getByRole("tab", { name: "History" })).toHaveAttribute("tabindex", "-1");
    plan.focus();
    await userEvent.keyboard("{ArrowRight}");
    const history = screen.getByRole("tab", { name: "History" });
    expect(history).toHaveFocus();
    expect(history).toHaveAttribute("aria-selected", "true");
    expect(await screen.findByRole("list", { name: "Revisions" })).toBeInTheDocument();
    await userEvent.keyboard("{End}");
    expect(screen.getByRole("tab", { name: "Activity" })).toHaveFocus();
    expect(screen.getByRole("tab", { name: "Activity" })).toHaveAttribute("aria-selected", "true");
    await userEvent.keyboard("{ArrowRight}");
    expect(screen.getByRole("tab", { name: "Plan" })).toHaveFocus();
    await userEvent.keyboard("{ArrowLeft}{Home}");
    expect(screen.getByRole("tab", { name: "Plan" })).toHaveAttribute("aria-selected", "true");
  });
});

import { describe, expect, it } from "vitest";
import { screen, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import type { AuditEventSummary } from "@/contracts/audit";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import { TeamActivityPage } from "../team-activity-page";

const tamsin = { id: "00000000-0000-4000-8000-000000000001", name: "Tamsin Orchard" };
const oskar = { id: "00000000-0000-4000-8000-000000000002", name: "Oskar Bellweather" };
const planId = "5a1e0000-0000-4000-8000-000000000001";

let n = 0;
const event = (overrides: Partial<AuditEventSummary>): AuditEventSummary => ({
  id: `e${++n}`,
  action: "auth.sign_in",
  actor: tamsin,
  targetType: "user",
  targetId: tamsin.id,
  targetName: null,
  detail: {},
  createdAt: `2026-11-20T10:${String(60 - n).padStart(2, "0")}:00Z`,
  ...overrides,
});

const trail: AuditEventSummary[] = [
  event({
    action: "attachment.upload",
    targetType: "plan",
    targetId: planId,
    targetName: "Tollbar cutting, line A",
    detail: { attachment: "a1", kind: "seg2", fileName: "shot-12.sg2", size: 1000, revision: 2 },
  }),
  event({}),
  event({}),
  event({}),
  event({ actor: oskar, targetId: oskar.id }),
  event({
    action: "comment.create",
    actor: oskar,
    targetType: "plan",
    targetId: planId,
    targetName: "Tollbar cutting, line A",
    detail: { name: "Tollbar cutting, line A", comment: "c1", revision: 2 },
  }),
];

function show() {
  stubFetch({ "GET /api/audit?limit=200": () => ({ status: 200, body: trail }) });
  renderWithApp(<TeamActivityPage />, { me: testMe({ role: "admin" }) });
}

describe("Team activity", () => {
  it("reads in plain words, names the plan and the file, and folds repeated sign-ins", async () => {
    show();
    const list = await screen.findByRole("list", { name: "Team activity" });
    const rows = within(list).getAllByRole("listitem");
    expect(rows[0]).toHaveTextContent(
      "Tamsin Orchard uploaded a file · shot-12.sg2 on plan “Tollbar cutting, line A”",
    );
    expect(rows[0]).not.toHaveTextContent("attachment: upload");
    expect(within(rows[0]).getByRole("link")).toHaveAttribute("href", `/plans/${planId}/review`);
    // Three sign-ins by Tamsin in a row are one row; Oskar's sign-in stays its own.
    expect(rows[1]).toHaveTextContent("Tamsin Orchard signed in 3 times");
    expect(rows[2]).toHaveTextContent("Oskar Bellweather signed in");
    expect(rows[3]).toHaveTextContent("Oskar Bellweather wrote a review note · plan “Tollbar");
    expect(rows).toHaveLength(4);
  });

  it("filters by kind and by person", async () => {
    show();
    await screen.findByRole("list", { name: "Team activity" });
    await userEvent.selectOptions(screen.getByLabelText("Kind"), "Sign-ins");
    let rows = within(screen.getByRole("list", { name: "Team activity" })).getAllByRole("listitem");
    expect(rows.map((r) => r.textContent)).toEqual([
      expect.stringContaining("Tamsin Orchard signed in 3 times"),
      expect.stringContaining("Oskar Bellweather signed in"),
    ]);
    await userEvent.selectOptions(screen.getByLabelText("Person"), "Oskar Bellweather");
    rows = within(screen.getByRole("list", { name: "Team activity" })).getAllByRole("listitem");
    expect(rows).toHaveLength(1);
    await userEvent.selectOptions(screen.getByLabelText("Kind"), "Field files and picks");
    expect(screen.getByText("Nothing of this kind by this person")).toBeInTheDocument();
  });
});

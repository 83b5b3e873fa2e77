import { describe, expect, it } from "vitest";
import { screen, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import { TeamPage } from "../team-page";

const admin = testMe({
  role: "admin",
  user: {
    id: "00000000-0000-4000-8000-000000000009",
    email: "admin@example.test",
    name: "Ada Admin",
  },
});

describe("TeamPage", () => {
  it("shows members, marks the current user and offers no removal of oneself", async () => {
    stubFetch({
      "GET /api/team/members": () => ({
        status: 200,
        body: [
          {
            userId: admin.user.id,
            name: "Ada Admin",
            email: "admin@example.test",
            role: "admin",
            joinedAt: "2026-10-01T00:00:00Z",
          },
          {
            userId: "00000000-0000-4000-8000-000000000002",
            name: "Rhys Reviewer",
            email: "r@example.test",
            role: "reviewer",
            joinedAt: "2026-10-02T00:00:00Z",
          },
        ],
      }),
      "GET /api/invitations": () => ({ status: 200, body: [] }),
      "GET /api/team/settings": () => ({ status: 200, body: { seismographChannels: 48 } }),
    });
    renderWithApp(<TeamPage />, { me: admin });
    const row = (await screen.findByText("Ada Admin")).closest("tr")!;
    expect(within(row).getByText("(you)")).toBeInTheDocument();
    expect(within(row).queryByRole("button", { name: /Remove/ })).toBeNull();
    expect(screen.getByRole("button", { name: "Remove Rhys Reviewer" })).toBeInTheDocument();
    expect(screen.getByLabelText("Role of Rhys Reviewer")).toHaveValue("reviewer");
    // The team's recording equipment sits beside the members (issue 14).
    expect(await screen.findByLabelText("Seismograph channels")).toHaveValue(48);
  });

  it("validates the invitation address inline and then sends the invitation", async () => {
    const calls = stubFetch({
      "GET /api/team/members": () => ({ status: 200, body: [] }),
      "GET /api/invitations": () => ({ status: 200, body: [] }),
      "GET /api/team/settings": () => ({ status: 200, body: { seismographChannels: 48 } }),
      "POST /api/invitations": (body) => ({
        status: 201,
        body: {
          id: "x",
          ...(body as object),
          invitedBy: "Ada",
          createdAt: "2026-12-01T00:00:00Z",
          expiresAt: "2026-12-08T00:00:00Z",
        },
      }),
    });
    renderWithApp(<TeamPage />, { me: admin });
    const email = await screen.findByLabelText("E-mail");
    await userEvent.type(email, "nobody");
    await userEvent.click(screen.getByRole("button", { name: "Send invitation" }));
    expect(await screen.findByText("enter a valid e-mail address")).toBeInTheDocument();
    await userEvent.clear(email);
    await userEvent.type(email, "new.member@example.test");
    await userEvent.selectOptions(screen.getByLabelText("Role"), "reviewer");
    await userEvent.click(screen.getByRole("button", { name: "Send invitation" }));
    expect(
      await screen.findByText("Invitation sent to new.member@example.test."),
    ).toBeInTheDocument();
    expect(calls.find((c) => c.method === "POST")?.body).toEqual({
      email: "new.member@example.test",
      role: "reviewer",
    });
  });
  it("asks before changing a role, says what happened, and keeps the role on Keep", async () => {
    const rhys = {
      userId: "00000000-0000-4000-8000-000000000002",
      name: "Rhys Reviewer",
      email: "r@example.test",
      role: "reviewer",
      joinedAt: "2026-10-02T00:00:00Z",
    };
    let role = "reviewer";
    const calls = stubFetch({
      "GET /api/team/members": () => ({ status: 200, body: [{ ...rhys, role }] }),
      "GET /api/invitations": () => ({ status: 200, body: [] }),
      "GET /api/team/settings": () => ({ status: 200, body: { seismographChannels: 48 } }),
      [`PATCH /api/team/members/${rhys.userId}`]: (body) => {
        role = (body as { role: string }).role;
        return { status: 200, body: { ...rhys, role } };
      },
    });
    renderWithApp(<TeamPage />, { me: admin });
    const select = await screen.findByLabelText("Role of Rhys Reviewer");
    await userEvent.selectOptions(select, "lead");
    const confirm = screen.getByRole("group", { name: "Confirm the role change" });
    expect(confirm).toHaveTextContent("Change Rhys Reviewer’s role from Reviewer to Survey lead?");
    // A whole sentence naming the member ("As survey lead they creates…" read wrongly).
    expect(confirm).toHaveTextContent(
      "As survey lead, Rhys Reviewer creates sites and plans and submits them for review.",
    );
    expect(calls.some((c) => c.method === "PATCH")).toBe(false);
    await userEvent.click(within(confirm).getByRole("button", { name: "Keep Reviewer" }));
    expect(screen.queryByRole("group", { name: "Confirm the role change" })).toBeNull();
    expect(select).toHaveValue("reviewer");
    expect(calls.some((c) => c.method === "PATCH")).toBe(false);

    await userEvent.selectOptions(select, "lead");
    await userEvent.click(screen.getByRole("button", { name: "Change role" }));
    expect(await screen.findByText(/Rhys Reviewer is now survey lead/)).toBeInTheDocument();
    expect(calls.find((c) => c.method === "PATCH")?.body).toEqual({ role: "lead" });
  });
});

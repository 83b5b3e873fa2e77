import { describe, expect, it } from "vitest";
import { screen, waitFor, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import type { NotificationView } from "@/contracts/plans";
import { InboxLink } from "../inbox-link";
import { InboxPage } from "../inbox-page";
import { NotificationSettingsCard } from "../notification-settings-card";

const planId = "5a1e0000-0000-4000-8000-000000000001";

const notice = (id: string, read: boolean, text: string): NotificationView => ({
  id: `0000000${id}-0000-4000-8000-000000000000`,
  kind: "submitted",
  planId,
  planName: "Tollbar cutting, line A",
  actorName: "Tamsin Orchard",
  text,
  link: `/plans/${planId}/review`,
  read,
  createdAt: "2026-11-20T10:00:00Z",
});

describe("InboxLink", () => {
  it("shows the number of unread notices and names it for screen readers", async () => {
    stubFetch({
      "GET /api/notifications?unread=true&limit=500": () => ({
        status: 200,
        body: [notice("1", false, "a"), notice("2", false, "b"), notice("3", false, "c")],
      }),
    });
    renderWithApp(<InboxLink />);
    const link = await screen.findByRole("link", { name: "Inbox, 3 new" });
    expect(within(link).getByTestId("unread-badge")).toHaveTextContent("3");
  });

  it("shows no badge when everything is read", async () => {
    const calls = stubFetch({
      "GET /api/notifications?unread=true&limit=500": () => ({ status: 200, body: [] }),
    });
    renderWithApp(<InboxLink />);
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(screen.getByRole("link", { name: "Inbox" })).toBeInTheDocument();
    expect(screen.queryByTestId("unread-badge")).toBeNull();
  });
});

describe("InboxPage", () => {
  function serve() {
    let list = [
      notice("1", false, "Tamsin Orchard submitted Tollbar cutting, line A for review"),
      notice("2", true, "Older, already read"),
    ];
    const calls = stubFetch({
      "GET /api/notifications?limit=200": () => ({ status: 200, body: list }),
      "GET /api/notifications?unread=true&limit=500": () => ({
        status: 200,
        body: list.filter((n) => !n.read),
      }),
      [`POST /api/notifications/${list[0].id}/read`]: () => {
        list = list.map((n) => ({ ...n, read: true }));
        return { status: 204 };
      },
      "POST /api/notifications/read-all": () => {
        list = list.map((n) => ({ ...n, read: true }));
        return { status: 204 };
      },
    });
    return calls;
  }

  it("marks every notice read at once and the header count drops to nothing", async () => {
    const calls = serve();
    renderWithApp(
      <>
        <InboxLink />
        <InboxPage />
      </>,
    );
    expect(await screen.findByRole("link", { name: "Inbox, 1 new" })).toBeInTheDocument();
    expect(screen.getByText(/1 not yet seen/)).toBeInTheDocument();
    await userEvent.click(screen.getByRole("button", { name: "Mark all seen" }));
    await waitFor(() =>
      expect(calls.some((c) => c.url === "/api/notifications/read-all")).toBe(true),
    );
    expect(await screen.findByRole("link", { name: "Inbox" })).toBeInTheDocument();
    expect(screen.getByRole("button", { name: "Mark all seen" })).toBeDisabled();
  });

  it("opens the plan's Review screen from a notice and marks it read", async () => {
    const calls = serve();
    renderWithApp(<InboxPage />, {
      extraRoutes: [{ path: "/plans/:planId/review", element: <p>Review screen</p> }],
    });
    await userEvent.click(
      await screen.findByRole("button", {
        name: "New: Tamsin Orchard submitted Tollbar cutting, line A for review",
      }),
    );
    expect(await screen.findByText("Review screen")).toBeInTheDocument();
    expect(calls.some((c) => c.method === "POST" && c.url.endsWith("/read"))).toBe(true);
  });

  it("filters to unread notices", async () => {
    serve();
    renderWithApp(<InboxPage />);
    await screen.findByText("Older, already read");
    await userEvent.click(screen.getByLabelText("Not yet seen only"));
    expect(screen.queryByText("Older, already read")).toBeNull();
    expect(
      screen.getByText("Tamsin Orchard submitted Tollbar cutting, line A for review"),
    ).toBeInTheDocument();
  });

  it("links to the team activity except for trainees", async () => {
    serve();
    const { unmount } = renderWithApp(<InboxPage />, { me: testMe({ role: "reviewer" }) });
    expect(await screen.findByRole("link", { name: "Team activity" })).toBeInTheDocument();
    unmount();
    serve();
    renderWithApp(<InboxPage />, { me: testMe({ role: "trainee" }) });
    await screen.findByText("Older, already read");
    expect(screen.queryByRole("link", { name: "Team activity" })).toBeNull();
  });
});

describe("NotificationSettingsCard", () => {
  it("turns one kind of e-mail off and sends the whole set", async () => {
    const calls = stubFetch({
      "GET /api/me/notification-settings": () => ({
        status: 200,
        body: { submitted: true, decision: true, mention: true, reply: true },
      }),
      "PUT /api/me/notification-settings": (body) => ({ status: 200, body }),
    });
    renderWithApp(<NotificationSettingsCard />);
    const mention = await screen.findByRole("checkbox", { name: /Someone mentions me/ });
    expect(mention).toBeChecked();
    await userEvent.click(mention);
    await waitFor(() =>
      expect(calls.find((c) => c.method === "PUT")?.body).toEqual({
        submitted: true,
        decision: true,
        mention: false,
        reply: true,
      }),
    );
    expect(await screen.findByText("Saved.")).toBeInTheDocument();
    expect(screen.getByRole("checkbox", { name: /Someone mentions me/ })).not.toBeChecked();
  });
});

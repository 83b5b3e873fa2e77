import { describe, expect, it } from "vitest";
import { screen, waitFor, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import type { CommentView } from "@/contracts/plans";
import { AnchorComments, CommentThreads } from "../comment-threads";
import {
  comment,
  leadId,
  members,
  noPermissions,
  PLAN_ID,
  planDetail,
  reviewerId,
} from "../../testing/fixtures";

const base = `/api/plans/${PLAN_ID}`;
const lead = testMe({
  role: "lead",
  user: { id: leadId, email: "tamsin@example.test", name: "Tamsin Orchard" },
});

/** A small in-memory comments API for one plan. */
function serve(initial: CommentView[], canComment = true) {
  let list = [...initial];
  const calls = stubFetch({
    [`GET ${base}`]: () => ({
      status: 200,
      body: planDetail({ permissions: { ...noPermissions, comment: canComment } }),
    }),
    [`GET ${base}/comments`]: () => ({ status: 200, body: list }),
    [`GET ${base}/activity`]: () => ({ status: 200, body: [] }),
    "GET /api/team/members": () => ({ status: 200, body: members }),
    [`POST ${base}/comments`]: (body) => {
      const input = body as { body: string; parentId?: string };
      const created = comment({
        body: input.body,
        parentId: input.parentId ?? null,
        author: { id: leadId, name: "Tamsin Orchard", role: "lead" },
        createdAt: "2026-11-21T08:00:00.000Z",
      });
      list = [...list, created];
      return { status: 201, body: created };
    },
    ...Object.fromEntries(
      initial.map((c) => [
        `PATCH /api/comments/${c.id}`,
        (body: unknown) => {
          const { resolved } = body as { resolved: boolean };
          list = list.map((x) => (x.id === c.id ? { ...x, resolved } : x));
          return { status: 200, body: list.find((x) => x.id === c.id) };
        },
      ]),
    ),
  });
  return { calls };
}

describe("CommentThreads", () => {
  it("groups replies under their first comment and shows the anchor as a chip", async () => {
    const root = comment({
      body: "Is the lens thick enough to show?",
      anchor: { kind: "layer", model: 0, index: 1 },
    });
    const reply = comment({
      parentId: root.id,
      body: "It would need to be thicker; see the sweep.",
      author: { id: leadId, name: "Tamsin Orchard", role: "lead" },
    });
    const other = comment({ body: "Shot spacing looks fine." });
    serve([reply, root, other]);
    renderWithApp(<CommentThreads planId={PLAN_ID} />, { me: lead });
    const threads = await screen.findAllByRole("article");
    expect(threads).toHaveLength(2);
    const first = threads[0];
    expect(within(first).getByText("Is the lens thick enough to show?")).toBeInTheDocument();
    expect(within(first).getByText("Layer 2 · clay lens")).toBeInTheDocument();
    const replies = within(first).getByRole("list", { name: "Replies" });
    expect(
      within(replies).getByText("It would need to be thicker; see the sweep."),
    ).toBeInTheDocument();
    expect(within(threads[1]).queryByRole("list", { name: "Replies" })).toBeNull();
  });

  it("posts a reply to the thread's first comment and shows it in the thread", async () => {
    const root = comment({ body: "Why two shots only?" });
    const { calls } = serve([root]);
    renderWithApp(<CommentThreads planId={PLAN_ID} />, { me: lead });
    const thread = await screen.findByRole("article");
    await userEvent.click(within(thread).getByRole("button", { name: "Reply" }));
    const box = within(thread).getByLabelText("Reply to Oskar Bellweather");
    await userEvent.type(box, "A centre shot is added in revision 3.");
    await userEvent.click(within(thread).getByRole("button", { name: "Post reply" }));
    await waitFor(() =>
      expect(calls.find((c) => c.method === "POST")?.body).toEqual({
        body: "A centre shot is added in revision 3.",
        parentId: root.id,
      }),
    );
    const replies = await within(thread).findByRole("list", { name: "Replies" });
    expect(within(replies).getByText("A centre shot is added in revision 3.")).toBeInTheDocument();
  });

  it("refuses an empty comment inline", async () => {
    const { calls } = serve([]);
    renderWithApp(<CommentThreads planId={PLAN_ID} />, { me: lead });
    await userEvent.click(await screen.findByRole("button", { name: "Post note" }));
    expect(await screen.findByText("write a comment")).toBeInTheDocument();
    expect(calls.filter((c) => c.method === "POST")).toHaveLength(0);
  });

  it("starts a thread anchored to the chosen shot", async () => {
    const { calls } = serve([]);
    renderWithApp(<CommentThreads planId={PLAN_ID} />, { me: lead });
    await userEvent.type(await screen.findByLabelText("New note"), "Move this shot off-end.");
    await userEvent.selectOptions(screen.getByLabelText("Points at"), "Shot 1 · west end (-1.0 m)");
    await userEvent.click(screen.getByRole("button", { name: "Post note" }));
    await waitFor(() =>
      expect(calls.find((c) => c.method === "POST")?.body).toEqual({
        body: "Move this shot off-end.",
        anchor: { kind: "shot", model: 0, index: 0 },
      }),
    );
  });

  it("resolves an open thread, which then moves to the resolved filter, and reopens it", async () => {
    const root = comment({ body: "Depth tolerance of 1 m is tight." });
    const { calls } = serve([root]);
    renderWithApp(<CommentThreads planId={PLAN_ID} />, { me: lead });
    const thread = await screen.findByRole("article");
    await userEvent.click(within(thread).getByRole("button", { name: "Close note" }));
    await waitFor(() =>
      expect(calls.find((c) => c.method === "PATCH")?.body).toEqual({ resolved: true }),
    );
    expect(await screen.findByText("No open notes")).toBeInTheDocument();
    await userEvent.click(screen.getByRole("button", { name: "Closed notes (1)" }));
    const resolved = await screen.findByRole("article");
    expect(within(resolved).getByText("✓ Closed")).toBeInTheDocument();
    await userEvent.click(within(resolved).getByRole("button", { name: "Reopen note" }));
    await waitFor(() =>
      expect(calls.filter((c) => c.method === "PATCH").at(-1)?.body).toEqual({ resolved: false }),
    );
    expect(await screen.findByText("No closed notes")).toBeInTheDocument();
  });

  it("offers resolving only to those the server allows: not another lead's thread on someone else's plan", async () => {
    serve([comment({ body: "Reviewer's point." })]);
    const otherLead = testMe({
      role: "lead",
      user: {
        id: "00000000-0000-4000-8000-000000000077",
        email: "x@example.test",
        name: "Other Lead",
      },
    });
    renderWithApp(<CommentThreads planId={PLAN_ID} />, { me: otherLead });
    const thread = await screen.findByRole("article");
    expect(within(thread).getByRole("button", { name: "Reply" })).toBeInTheDocument();
    expect(within(thread).queryByRole("button", { name: "Close note" })).toBeNull();
  });

  it("lets a trainee ask a question on their own sandbox scenario (the server grants comment)", async () => {
    const { calls } = serve([]);
    const trainee = testMe({ role: "trainee" });
    renderWithApp(<CommentThreads planId={PLAN_ID} />, { me: trainee });
    await userEvent.type(await screen.findByLabelText("New note"), "Is 3 m fine enough here?");
    await userEvent.click(screen.getByRole("button", { name: "Post note" }));
    expect(await screen.findByText("Is 3 m fine enough here?")).toBeInTheDocument();
    expect(calls.find((c) => c.method === "POST")?.body).toMatchObject({
      body: "Is 3 m fine enough here?",
    });
  });

  it("lets a role without the comment permission read but not write", async () => {
    serve([comment({ body: "Looks good to me." })], false);
    renderWithApp(<CommentThreads planId={PLAN_ID} />, { me: testMe({ role: "trainee" }) });
    expect(await screen.findByText("Looks good to me.")).toBeInTheDocument();
    expect(screen.queryByRole("button", { name: "Reply" })).toBeNull();
    expect(screen.queryByRole("button", { name: "Post note" })).toBeNull();
    expect(screen.getByText(/on team plans you read them/)).toBeInTheDocument();
  });

  it("shows beside a refractor only the threads anchored there, and anchors new ones there", async () => {
    const here = comment({
      body: "Refractor at the lens base.",
      anchor: { kind: "refractor", model: 0, index: 2 },
    });
    const elsewhere = comment({
      body: "About the first layer.",
      anchor: { kind: "layer", model: 0, index: 0 },
    });
    const { calls } = serve([here, elsewhere]);
    renderWithApp(
      <AnchorComments planId={PLAN_ID} anchor={{ kind: "refractor", model: 0, index: 2 }} />,
      { me: lead },
    );
    expect(await screen.findByText("Refractor at the lens base.")).toBeInTheDocument();
    expect(screen.queryByText("About the first layer.")).toBeNull();
    const box = screen.getByLabelText(/New note on Refractor · top of layer 3/);
    await userEvent.type(box, "Agreed.");
    await userEvent.click(screen.getByRole("button", { name: "Post note" }));
    await waitFor(() =>
      expect(calls.find((c) => c.method === "POST")?.body).toEqual({
        body: "Agreed.",
        anchor: { kind: "refractor", model: 0, index: 2 },
      }),
    );
  });

  it("highlights mentions of team members in a comment", async () => {
    serve([comment({ body: "@Tamsin Orchard please check shot 2.", mentions: [leadId] })]);
    renderWithApp(<CommentThreads planId={PLAN_ID} />, {
      me: testMe({
        role: "reviewer",
        user: { id: reviewerId, email: "oskar@example.test", name: "Oskar Bellweather" },
      }),
    });
    const mention = await screen.findByText("@Tamsin Orchard");
    expect(mention.tagName).toBe("SPAN");
    expect(mention).toHaveClass("bg-ochre-soft");
  });

  it("offers only members who can see a sandbox scenario when mentioning (its author, reviewers, admins)", async () => {
    const trainee = members.find((m) => m.role === "trainee")!;
    stubFetch({
      [`GET ${base}`]: () => ({
        status: 200,
        body: planDetail({
          sandbox: true,
          status: "draft",
          author: { id: trainee.userId, name: trainee.name },
          permissions: { ...noPermissions, comment: true },
        }),
      }),
      [`GET ${base}/comments`]: () => ({ status: 200, body: [] }),
      "GET /api/team/members": () => ({ status: 200, body: members }),
    });
    const reviewer = testMe({
      role: "reviewer",
      user: { id: reviewerId, email: "oskar@example.test", name: "Oskar Bellweather" },
    });
    renderWithApp(<CommentThreads planId={PLAN_ID} />, { me: reviewer });
    const box = await screen.findByRole("combobox", { name: "New note" });
    await userEvent.type(box, "@");
    const list = await screen.findByRole("listbox", { name: "Mention a team member" });
    const offered = within(list)
      .getAllByRole("option")
      .map((o) => o.textContent);
    expect(offered.some((t) => t?.includes(trainee.name))).toBe(true);
    // The lead cannot see the scenario, so a mention would reach nobody.
    expect(offered.some((t) => t?.includes("Tamsin Orchard"))).toBe(false);
  });
});

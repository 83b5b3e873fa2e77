import { describe, expect, it } from "vitest";
import { screen, waitFor, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import { PlansList } from "../plans-list";
import { planDetail, planSummary, SITE_ID } from "../../__tests__/fixtures";

const list = `GET /api/sites/${SITE_ID}/plans?archived=all`;
const route = { path: "/sites/:siteId", route: `/sites/${SITE_ID}` };

const sandbox = planSummary({
  id: "33333333-3333-4333-8333-333333333333",
  name: "What if the lens is thicker",
  sandbox: true,
  author: { id: "00000000-0000-4000-8000-000000000009", name: "Tess Trainee" },
  worstVerdict: "blind",
});

describe("PlansList", () => {
  it("lists name, author, status, worst verdict and last change, marking sandbox plans", async () => {
    stubFetch({ [list]: () => ({ status: 200, body: [planSummary(), sandbox] }) });
    renderWithApp(<PlansList />, route);
    const row = (await screen.findByRole("link", { name: "What if the lens is thicker" })).closest(
      "tr",
    )!;
    expect(within(row).getByText("Sandbox")).toBeVisible();
    expect(within(row).getByText("Tess Trainee")).toBeVisible();
    expect(within(row).getByText("Blind")).toBeVisible();
    expect(within(row).getByText(/rev 3/)).toBeVisible();
    const lead = screen.getByRole("link", { name: "Culvert crossing, line 2" }).closest("tr")!;
    expect(within(lead).getByText("Draft")).toBeVisible();
    expect(within(lead).getByText("Resolved")).toBeVisible();
  });

  it("offers no new, imported or copied plan on an archived site, and says how to plan there again", async () => {
    stubFetch({
      [list]: () => ({ status: 200, body: [planSummary()] }),
      [`GET /api/sites/${SITE_ID}`]: () => ({
        status: 200,
        body: {
          id: SITE_ID,
          name: "Old quarry",
          description: "",
          archived: true,
          createdBy: "Lee Lead",
          createdAt: "2026-11-01T10:00:00.000Z",
          updatedAt: "2026-11-01T10:00:00.000Z",
          planCount: 1,
        },
      }),
    });
    renderWithApp(<PlansList extraActions={<button type="button">Import plan</button>} />, route);
    expect(await screen.findByText(/This site is archived/)).toBeVisible();
    expect(screen.queryByRole("button", { name: "New plan" })).toBeNull();
    expect(screen.queryByRole("button", { name: "Import plan" })).toBeNull();
    expect(screen.queryByRole("button", { name: /^Duplicate/ })).toBeNull();
    // the plans themselves stay readable and can still be renamed or archived
    expect(screen.getByRole("link", { name: "Culvert crossing, line 2" })).toBeVisible();
    expect(screen.getByRole("button", { name: "Rename Culvert crossing, line 2" })).toBeVisible();
  });

  it("gives a reviewer no way to create or change plans", async () => {
    stubFetch({ [list]: () => ({ status: 200, body: [planSummary()] }) });
    renderWithApp(<PlansList />, { ...route, me: testMe({ role: "reviewer" }) });
    await screen.findByRole("link", { name: "Culvert crossing, line 2" });
    expect(screen.queryByRole("button", { name: /New/ })).toBeNull();
    expect(screen.queryByRole("button", { name: /Rename|Archive|Duplicate/ })).toBeNull();
  });

  it("lets a trainee start a sandbox scenario and change only their own", async () => {
    stubFetch({ [list]: () => ({ status: 200, body: [planSummary(), sandbox] }) });
    renderWithApp(<PlansList />, {
      ...route,
      me: testMe({
        role: "trainee",
        user: { id: sandbox.author.id, email: "t@example.test", name: "Tess Trainee" },
      }),
    });
    await screen.findByRole("link", { name: "What if the lens is thicker" });
    expect(screen.getByRole("button", { name: "New sandbox scenario" })).toBeVisible();
    expect(
      screen.getByRole("button", { name: "Rename What if the lens is thicker" }),
    ).toBeVisible();
    expect(screen.queryByRole("button", { name: "Rename Culvert crossing, line 2" })).toBeNull();
    expect(
      screen.getByRole("button", { name: "Duplicate Culvert crossing, line 2" }),
    ).toBeVisible();
  });

  it("refuses an empty name and creates a plan, then opens it", async () => {
    let plans = [planSummary()];
    const created = planDetail({ id: "44444444-4444-4444-8444-444444444444", name: "Line B" });
    const calls = stubFetch({
      [list]: () => ({ status: 200, body: plans }),
      [`POST /api/sites/${SITE_ID}/plans`]: () => {
        plans = [...plans, created];
        return { status: 201, body: created };
      },
    });
    const { router } = renderWithApp(<PlansList />, {
      ...route,
      extraRoutes: [{ path: "/plans/:planId", element: <p>designer opened</p> }],
    });
    await userEvent.click(await screen.findByRole("button", { name: "New plan" }));
    await userEvent.click(screen.getByRole("button", { name: "Create plan" }));
    expect(await screen.findByText("name is required")).toBeVisible();
    await userEvent.type(screen.getByLabelText("Plan name"), "Line B");
    await userEvent.click(screen.getByRole("button", { name: "Create plan" }));
    expect(await screen.findByText("designer opened")).toBeVisible();
    expect(router.state.location.pathname).toBe(`/plans/${created.id}`);
    expect(calls.find((c) => c.method === "POST")?.body).toEqual({ name: "Line B" });
  });

  it("renames and archives through PATCH, hiding archived plans until asked", async () => {
    let current = planSummary();
    const calls = stubFetch({
      [list]: () => ({ status: 200, body: [current] }),
      [`PATCH /api/plans/${current.id}`]: (body) => {
        const b = body as { name?: string; archived?: boolean };
        current = {
          ...current,
          ...(b.name ? { name: b.name } : {}),
          ...(b.archived !== undefined ? { status: b.archived ? "archived" : "draft" } : {}),
        };
        return { status: 200, body: planDetail(current) };
      },
    });
    renderWithApp(<PlansList />, route);
    await userEvent.click(
      await screen.findByRole("button", { name: "Rename Culvert crossing, line 2" }),
    );
    const box = screen.getByLabelText("New name for Culvert crossing, line 2");
    await userEvent.clear(box);
    await userEvent.type(box, "Culvert line 2 (final)");
    await userEvent.click(screen.getByRole("button", { name: "Rename" }));
    await screen.findByRole("link", { name: "Culvert line 2 (final)" });
    await userEvent.click(screen.getByRole("button", { name: "Archive Culvert line 2 (final)" }));
    await waitFor(() =>
      expect(screen.queryByRole("link", { name: "Culvert line 2 (final)" })).toBeNull(),
    );
    await userEvent.click(screen.getByLabelText(/Show 1 archived plan/));
    expect(screen.getByRole("link", { name: "Culvert line 2 (final)" })).toBeVisible();
    expect(calls.filter((c) => c.method === "PATCH").map((c) => c.body)).toEqual([
      { name: "Culvert line 2 (final)" },
      { archived: true },
    ]);
  });
});

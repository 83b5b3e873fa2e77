import { describe, expect, it } from "vitest";
import { screen, waitFor } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import type { SiteSummary } from "@/contracts/sites";
import { SitesPage } from "../sites-page";

const site: SiteSummary = {
  id: "11111111-1111-4111-8111-111111111111",
  name: "Quarry Lane cut",
  description: "Weathered sandstone under clayey fill.",
  archived: false,
  createdBy: "Test Lead",
  createdAt: "2026-11-02T10:00:00.000Z",
  updatedAt: "2026-11-02T10:00:00.000Z",
  planCount: 2,
};

describe("SitesPage", () => {
  it("lists sites with their plan counts", async () => {
    stubFetch({ "GET /api/sites?archived=false": () => ({ status: 200, body: [site] }) });
    renderWithApp(<SitesPage />);
    expect(await screen.findByRole("link", { name: "Quarry Lane cut" })).toBeInTheDocument();
    expect(screen.getByText(/2 plans/)).toBeInTheDocument();
  });

  it("hides the editing controls from a reviewer", async () => {
    stubFetch({ "GET /api/sites?archived=false": () => ({ status: 200, body: [site] }) });
    renderWithApp(<SitesPage />, { me: testMe({ role: "reviewer" }) });
    await screen.findByRole("link", { name: "Quarry Lane cut" });
    expect(screen.queryByRole("button", { name: "New site" })).toBeNull();
    expect(screen.queryByRole("button", { name: /Rename/ })).toBeNull();
  });

  it("refuses an empty name inline and creates a site with a valid one", async () => {
    let listed: SiteSummary[] = [];
    const calls = stubFetch({
      "GET /api/sites?archived=false": () => ({ status: 200, body: listed }),
      "POST /api/sites": (body) => {
        const created = {
          ...site,
          ...(body as object),
          id: "22222222-2222-4222-8222-222222222222",
          planCount: 0,
        };
        listed = [created];
        return { status: 201, body: created };
      },
    });
    const { router } = renderWithApp(<SitesPage />, {
      path: "/sites",
      route: "/sites",
      extraRoutes: [{ path: "/sites/:siteId", element: <p>the new site's plans</p> }],
    });
    await screen.findByText("No sites yet");
    await userEvent.click(screen.getByRole("button", { name: "New site" }));
    await userEvent.click(screen.getByRole("button", { name: "Create site" }));
    expect(await screen.findByText("name is required")).toBeInTheDocument();
    await userEvent.type(screen.getByLabelText("Site name"), "Mill Brook landfill cell");
    await userEvent.click(screen.getByRole("button", { name: "Create site" }));
    // After "Create site" the user lands on the new site's plans (issue 14, item 11).
    expect(await screen.findByText("the new site's plans")).toBeInTheDocument();
    expect(router.state.location.pathname).toBe("/sites/22222222-2222-4222-8222-222222222222");
    await waitFor(() => expect(calls.filter((c) => c.method === "POST")).toHaveLength(1));
    expect(calls.find((c) => c.method === "POST")?.body).toEqual({
      name: "Mill Brook landfill cell",
      description: "",
    });
  });

  it("explains the empty archived list instead of inviting a new site there", async () => {
    stubFetch({
      "GET /api/sites?archived=false": () => ({ status: 200, body: [site] }),
      "GET /api/sites?archived=true": () => ({ status: 200, body: [] }),
    });
    renderWithApp(<SitesPage />);
    await screen.findByRole("link", { name: "Quarry Lane cut" });
    await userEvent.click(screen.getByRole("radio", { name: "Archived" }));
    expect(await screen.findByText("No archived sites")).toBeInTheDocument();
    expect(screen.getByText(/waits here until it is restored/)).toBeInTheDocument();
    expect(screen.queryByText(/Create one to start planning/)).toBeNull();
  });

  it("says so when archiving a site fails, naming the site on its button", async () => {
    stubFetch({
      "GET /api/sites?archived=false": () => ({ status: 200, body: [site] }),
      [`PATCH /api/sites/${site.id}`]: () => ({
        status: 403,
        body: { error: { code: "forbidden", message: "your role may not change sites" } },
      }),
    });
    renderWithApp(<SitesPage />);
    await userEvent.click(await screen.findByRole("button", { name: "Archive Quarry Lane cut" }));
    expect(await screen.findByText("Could not change the site")).toBeInTheDocument();
    expect(screen.getByText("your role may not change sites")).toBeInTheDocument();
  });
});

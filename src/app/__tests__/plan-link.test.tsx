import { describe, expect, it } from "vitest";
import { render, screen } from "@testing-library/react";
import { MemoryRouter, Route, Routes } from "react-router-dom";
import { PlanLinkGuard, SiteLinkGuard, isPlanId } from "../plan-link";

function at(url: string) {
  render(
    <MemoryRouter initialEntries={[url]}>
      <Routes>
        <Route
          path="/plans/:planId/review"
          element={
            <PlanLinkGuard>
              <p>the plan page</p>
            </PlanLinkGuard>
          }
        />
      </Routes>
    </MemoryRouter>,
  );
}

describe("a plan link", () => {
  it("says a mistyped plan link is not valid, with the way back and no Try again", () => {
    at("/plans/not-a-plan/review");
    expect(screen.getByRole("alert")).toHaveTextContent("This plan link is not valid");
    expect(screen.queryByText(/UUID/)).toBeNull();
    expect(screen.queryByRole("button", { name: "Try again" })).toBeNull();
    expect(screen.getByRole("link", { name: "Back to Sites" })).toHaveAttribute("href", "/sites");
    expect(screen.queryByText("the plan page")).toBeNull();
  });

  it("lets a link with a plan id through", () => {
    at("/plans/5b1c0a3e-8f2d-4c61-9a7e-2d3f4b5c6d7e/review");
    expect(screen.getByText("the plan page")).toBeInTheDocument();
    expect(isPlanId("5B1C0A3E-8F2D-4C61-9A7E-2D3F4B5C6D7E")).toBe(true);
    expect(isPlanId("5b1c0a3e-8f2d-4c61-9a7e")).toBe(false);
  });
});

describe("a site link", () => {
  it("says a mistyped site link is not valid instead of the server's 'id must be a UUID'", () => {
    render(
      <MemoryRouter initialEntries={["/sites/not-a-site"]}>
        <Routes>
          <Route
            path="/sites/:siteId"
            element={
              <SiteLinkGuard>
                <p>the site page</p>
              </SiteLinkGuard>
            }
          />
        </Routes>
      </MemoryRouter>,
    );
    expect(screen.getByRole("alert")).toHaveTextContent("This site link is not valid");
    expect(screen.queryByText(/UUID/)).toBeNull();
    expect(screen.getByRole("link", { name: "Back to Sites" })).toHaveAttribute("href", "/sites");
    expect(screen.queryByText("the site page")).toBeNull();
  });
});

import { describe, expect, it } from "vitest";
import { fireEvent, screen, within } from "@testing-library/react";
import { renderWithApp, testMe } from "@/testing/render";
import type { Role } from "@/contracts/common";
import { AppLayout } from "../layout";

const expectedNav: Record<Role, string[]> = {
  admin: ["Sites", "Activity", "Team", "Mailbox", "Settings"],
  lead: ["Sites", "Activity", "Settings"],
  reviewer: ["Sites", "Activity", "Settings"],
  trainee: ["Sites", "Settings"],
};

describe("AppLayout navigation", () => {
  for (const role of Object.keys(expectedNav) as Role[]) {
    it(`shows a ${role} only what the role may use`, () => {
      renderWithApp(<AppLayout />, { me: testMe({ role }) });
      const nav = screen.getByRole("navigation", { name: "Main" });
      const labels = within(nav)
        .getAllByRole("link")
        .map((link) => link.textContent);
      expect(labels).toEqual(expectedNav[role]);
    });
  }

  it("hides the mailbox from an admin when the server is not in demo mode", () => {
    renderWithApp(<AppLayout />, { me: testMe({ role: "admin", demo: false }) });
    expect(screen.queryByRole("link", { name: "Mailbox" })).toBeNull();
  });

  it("gathers the name, role and Sign out behind an account button a phone can open and close", () => {
    renderWithApp(<AppLayout />, { me: testMe({ role: "lead" }) });
    const account = screen.getByRole("button", { name: "Account: Test Lead" });
    expect(account).toHaveTextContent("TL");
    expect(account).toHaveAttribute("aria-expanded", "false");
    const menu = document.getElementById(account.getAttribute("aria-controls") ?? "");
    expect(menu).toHaveClass("hidden");
    expect(within(menu!).getByRole("button", { name: "Sign out" })).toBeInTheDocument();
    fireEvent.click(account);
    expect(account).toHaveAttribute("aria-expanded", "true");
    expect(menu).not.toHaveClass("hidden");
    fireEvent.keyDown(document, { key: "Escape" });
    expect(account).toHaveAttribute("aria-expanded", "false");
    expect(menu).toHaveClass("hidden");
  });
});

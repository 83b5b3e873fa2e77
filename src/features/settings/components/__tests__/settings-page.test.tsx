import { describe, expect, it } from "vitest";
import { screen } from "@testing-library/react";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import { DEFAULT_NOTIFICATION_SETTINGS } from "@/contracts/plans";
import { SettingsPage } from "../settings-page";

const routes = {
  "GET /api/team/settings": () => ({ status: 200, body: { seismographChannels: 24 } }),
  "GET /api/me/notification-settings": () => ({
    status: 200,
    body: DEFAULT_NOTIFICATION_SETTINGS,
  }),
};

describe("SettingsPage", () => {
  it("shows a survey lead the team's seismograph channel count, read-only", async () => {
    stubFetch(routes);
    renderWithApp(<SettingsPage />, { me: testMe({ role: "lead" }) });
    expect(await screen.findByRole("heading", { name: "Recording equipment" })).toBeVisible();
    expect(await screen.findByText("24")).toBeInTheDocument();
    expect(screen.getByText(/Only an admin changes it/)).toBeInTheDocument();
    expect(screen.queryByRole("button", { name: "Save channel count" })).toBeNull();
  });

  it("points an admin to the Team page, where the count is edited", async () => {
    stubFetch(routes);
    renderWithApp(<SettingsPage />, { me: testMe({ role: "admin" }) });
    expect(await screen.findByRole("heading", { name: "Recording equipment" })).toBeVisible();
    expect(screen.getByRole("link", { name: "Team page" })).toHaveAttribute("href", "/team");
    expect(screen.queryByRole("spinbutton")).toBeNull();
  });
});

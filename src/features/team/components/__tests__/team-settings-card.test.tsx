import { describe, expect, it } from "vitest";
import { fireEvent, screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import { TeamSettingsCard } from "../team-settings-card";

const settingsRoutes = (channels: number) => ({
  "GET /api/team/settings": () => ({ status: 200, body: { seismographChannels: channels } }),
  "PATCH /api/team/settings": (body: unknown) => ({ status: 200, body }),
});

describe("TeamSettingsCard", () => {
  it("refuses a count over 1024 inline, naming the field, and sends nothing", async () => {
    const calls = stubFetch(settingsRoutes(48));
    renderWithApp(<TeamSettingsCard role="admin" />, { me: testMe({ role: "admin" }) });
    const box = await screen.findByLabelText("Seismograph channels");
    expect(box).toHaveValue(48);
    fireEvent.change(box, { target: { value: "2000" } });
    fireEvent.click(screen.getByRole("button", { name: "Save channel count" }));
    expect(
      await screen.findByText("Seismograph channels must be a whole number from 2 to 1024"),
    ).toBeInTheDocument();
    expect(calls.filter((c) => c.method === "PATCH")).toHaveLength(0);
  });

  it("lets an admin save a new count and confirms it", async () => {
    const calls = stubFetch(settingsRoutes(48));
    renderWithApp(<TeamSettingsCard role="admin" />, { me: testMe({ role: "admin" }) });
    const box = await screen.findByLabelText("Seismograph channels");
    await userEvent.clear(box);
    await userEvent.type(box, "24");
    await userEvent.click(screen.getByRole("button", { name: "Save channel count" }));
    expect(
      await screen.findByText(/Saved: the team’s seismograph records 24 channels/),
    ).toBeVisible();
    expect(calls.find((c) => c.method === "PATCH")?.body).toEqual({ seismographChannels: 24 });
  });

  it("shows the count read-only to a reviewer, with who may change it", async () => {
    stubFetch(settingsRoutes(24));
    renderWithApp(<TeamSettingsCard role="reviewer" />, { me: testMe({ role: "reviewer" }) });
    expect(await screen.findByText("24")).toBeInTheDocument();
    expect(screen.getByText(/Only an admin changes it/)).toBeInTheDocument();
    expect(screen.queryByRole("spinbutton")).toBeNull();
    expect(screen.queryByRole("button", { name: "Save channel count" })).toBeNull();
  });

  it("says why a save was refused", async () => {
    stubFetch({
      ...settingsRoutes(48),
      "PATCH /api/team/settings": () => ({
        status: 403,
        body: { error: { code: "forbidden", message: "your role may not do this" } },
      }),
    });
    renderWithApp(<TeamSettingsCard role="admin" />, { me: testMe({ role: "admin" }) });
    await userEvent.click(await screen.findByRole("button", { name: "Save channel count" }));
    expect(await screen.findByText("Could not save the channel count")).toBeInTheDocument();
    expect(screen.getByText("your role may not do this")).toBeInTheDocument();
  });
});

/**
 * The seismograph channel count as a team setting (issue 14): an admin changes it on the Team
 * page, the activity list says so in words, and a lead's designer flags a spread that needs more
 * channels than the team's seismograph records, without letting the lead change the setting.
 * Screenshots go to tests/e2e/screenshots/team-settings-*.png.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoAccounts, openBrowser, screenshot, signIn, startApp, type E2eApp } from "./harness";

let app: E2eApp;

beforeAll(async () => {
  app = await startApp();
});

afterAll(async () => {
  await app?.close();
});

describe("team settings", () => {
  it("an admin sets 24 channels and a lead's Apply choices flag a 48-channel spread", async () => {
    const admin = await openBrowser();
    try {
      const { page } = admin;
      await signIn(page, app.url, demoAccounts.admin);
      await page
        .getByRole("navigation", { name: "Main" })
        .getByRole("link", { name: "Team" })
        .click();
      await page.getByRole("heading", { name: "Recording equipment" }).waitFor();
      const box = page.getByLabel("Seismograph channels");
      // The demo team records on 48 channels (server/data/seed-demo.ts).
      expect(await box.inputValue()).toBe("48");
      await box.fill("2000");
      await page.getByRole("button", { name: "Save channel count" }).click();
      await page.getByText("Seismograph channels must be a whole number from 2 to 1024").waitFor();
      await box.fill("24");
      await page.getByRole("button", { name: "Save channel count" }).click();
      await page.getByText(/Saved: the team’s seismograph records 24 channels/).waitFor();
      await screenshot(page, "team-settings-admin");

      await page
        .getByRole("navigation", { name: "Main" })
        .getByRole("link", { name: "Activity" })
        .click();
      const line = page.getByText("set the team's seismograph channel count").first();
      await line.waitFor();
      await screenshot(page, "team-settings-activity");
    } finally {
      await admin.close();
    }

    const lead = await openBrowser();
    try {
      const { page } = lead;
      await signIn(page, app.url, demoAccounts.lead);
      // A lead has no Team page: the setting is the admin's.
      expect(
        await page
          .getByRole("navigation", { name: "Main" })
          .getByRole("link", { name: "Team" })
          .count(),
      ).toBe(0);
      await page.getByRole("link", { name: "Scarrowfield road cutting" }).click();
      await page.getByRole("heading", { name: "Plans" }).waitFor();
      await page.getByRole("button", { name: "New plan" }).click();
      await page.getByLabel("Plan name").fill("Channel count check");
      await page.getByRole("button", { name: "Create plan" }).click();
      await page.getByRole("heading", { name: "Channel count check" }).waitFor();
      await page.getByText("Analysis up to date").waitFor({ timeout: 30_000 });
      await page.getByRole("tab", { name: "Spread" }).click();
      await page.getByLabel("Channels", { exact: true }).fill("48");
      await page.getByText("Analysis up to date").waitFor({ timeout: 30_000 });
      await page.getByRole("tab", { name: "Resolvability" }).click();
      const ways = page.getByRole("list", { name: "Ways to apply" });
      await ways.waitFor();
      // The team's 24, not the old per-browser default of 48.
      await page
        .getByText(/channels is more than the seismograph's 24/)
        .first()
        .waitFor();
      await screenshot(page, "team-settings-lead-apply");

      // The lead reads the team's count; only an admin gets a box to change it.
      await page.getByText(/The team’s seismograph records 24 channels/).waitFor();
      expect(await page.getByLabel(/^Seismograph channels/).count()).toBe(0);
    } finally {
      await lead.close();
    }
  });
});

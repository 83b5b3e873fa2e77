import { writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  demoAccounts,
  openBrowser,
  screenshot,
  signIn,
  signOut,
  startApp,
  type E2eApp,
} from "./harness";

let app: E2eApp;
let browser: Awaited<ReturnType<typeof openBrowser>>;

beforeAll(async () => {
  app = await startApp();
  browser = await openBrowser();
});

afterAll(async () => {
  await browser?.close();
  await app?.close();
});

const navFor = {
  admin: ["Sites", "Activity", "Team", "Mailbox", "Settings"],
  lead: ["Sites", "Activity", "Settings"],
  reviewer: ["Sites", "Activity", "Settings"],
  trainee: ["Sites", "Settings"],
} as const;

describe("foundation in the browser", () => {
  it("sends a visitor to the sign-in page and shows its form", async () => {
    const { page } = browser;
    await page.goto(`${app.url}/sites`);
    await page.getByRole("heading", { name: "Sign in" }).waitFor();
    expect(page.url()).toContain("/sign-in?next=%2Fsites");
    await screenshot(page, "sign-in");
  });

  for (const role of Object.keys(navFor) as Array<keyof typeof navFor>) {
    it(`signs in as the demo ${role} and shows that role's navigation`, async () => {
      const { page } = browser;
      await signIn(page, app.url, demoAccounts[role]);
      const nav = page.getByRole("navigation", { name: "Main" });
      for (const label of navFor[role]) {
        await expect(nav.getByRole("link", { name: label }).isVisible()).resolves.toBe(true);
      }
      const allLinks = await nav.getByRole("link").allTextContents();
      expect(allLinks.filter((l) => l.trim().length > 0).length).toBeGreaterThanOrEqual(
        navFor[role].length,
      );
      if (role !== "admin") {
        expect(await nav.getByRole("link", { name: "Team" }).count()).toBe(0);
      }
      if (role === "trainee") {
        expect(await nav.getByRole("link", { name: "Activity" }).count()).toBe(0);
      }
      await page.getByRole("heading", { name: "Sites" }).waitFor();
      await screenshot(page, `sites-${role}`);
      await signOut(page);
    });
  }

  it("lets a lead create a site that then appears in the list", async () => {
    const { page } = browser;
    await signIn(page, app.url, demoAccounts.lead);
    await page.getByRole("button", { name: "New site" }).click();
    await page.getByRole("button", { name: "Create site" }).click();
    await page.getByText("name is required").waitFor();
    await page.getByLabel("Site name").fill("Copperfield bypass embankment");
    await page
      .getByLabel("Ground conditions")
      .fill("Soft alluvium over gravel; rock expected at 12 to 20 m.");
    await page.getByRole("button", { name: "Create site" }).click();
    // "Create site" opens the new site's plans (issue 14).
    await page.getByRole("heading", { name: "Copperfield bypass embankment" }).waitFor();
    expect(page.url()).toMatch(/\/sites\/[0-9a-f-]{36}$/);
    await page.getByText("Soft alluvium over gravel").waitFor();
    await page.getByRole("heading", { name: "Plans" }).waitFor();
    await screenshot(page, "sites-created");
    await page.getByRole("link", { name: "Sites", exact: true }).first().click();
    await page.getByRole("link", { name: "Copperfield bypass embankment" }).waitFor();
    await screenshot(page, "site-detail");
    await signOut(page);
  });

  it("lets a lead import a plan file on a site page and opens it in the designer", async () => {
    const { page } = browser;
    await signIn(page, app.url, demoAccounts.lead);
    await page.getByRole("link", { name: "Scarrowfield road cutting" }).click();
    await page.getByRole("heading", { name: "Plans" }).waitFor();
    const bad = path.join(os.tmpdir(), "spreadsight-bad-plan.json");
    writeFileSync(bad, JSON.stringify({ name: "Broken", models: [], spread: { spacing: -1 } }));
    await page.getByLabel("Import plan (JSON)").setInputFiles(bad);
    await page.getByText("The plan was not imported").waitFor();
    // The refusal wraps under the button; the button keeps its own width (it stretched to the
    // width of the message, most of the page).
    const button = await page.getByText("Import plan (JSON)", { exact: true }).boundingBox();
    expect(button?.width ?? 0).toBeLessThan(240);
    // Problems read as the screen counts, not as zod paths ("Spread: spacing …").
    await page
      .getByText(/Spread: spacing/)
      .first()
      .waitFor();
    await page
      .getByLabel("Import plan (JSON)")
      .setInputFiles("docs/examples/thin-blind-layer.json");
    await page.getByRole("heading", { name: "Coldwater Lane footbridge, east abutment" }).waitFor();
    expect(page.url()).toMatch(/\/plans\/[0-9a-f-]{36}$/);
    await page.getByText("Analysis up to date").waitFor({ timeout: 20_000 });
    await screenshot(page, "imported-plan");
    await signOut(page);
  });

  it("lets an admin invite a member who accepts from the mailbox link and lands signed in", async () => {
    const { page } = browser;
    await signIn(page, app.url, demoAccounts.admin);
    await page.getByRole("link", { name: "Team" }).click();
    await page.getByRole("heading", { name: "Team" }).waitFor();
    await page.getByLabel("E-mail").fill("new.trainee@spreadsight.test");
    await page.getByLabel("Role", { exact: true }).selectOption("trainee");
    await page.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText("Invitation sent to new.trainee@spreadsight.test.").waitFor();
    await screenshot(page, "team");

    await page.getByRole("link", { name: "Mailbox" }).click();
    await page.getByRole("heading", { name: "Mailbox" }).waitFor();
    const invite = page
      .getByRole("article", { name: "Message" })
      .getByRole("link")
      .filter({ hasText: "/invite/" });
    await invite.first().waitFor({ timeout: 15_000 });
    await screenshot(page, "mailbox");
    const href = await invite.first().getAttribute("href");
    expect(href).toMatch(/\/invite\/[A-Za-z0-9_-]+$/);
    await signOut(page);

    const link = new URL(href!);
    await page.goto(`${app.url}${link.pathname}`);
    await page.getByText("new.trainee@spreadsight.test").waitFor();
    await page.getByLabel("Your name").fill("Tamsin Okafor");
    await page.getByLabel("Password").fill("a-new-strong-password");
    await screenshot(page, "accept-invitation");
    await page.getByRole("button", { name: "Join the team" }).click();
    await page.getByRole("navigation", { name: "Main" }).waitFor();
    await page.getByText("Tamsin Okafor").waitFor();
    expect(await page.getByRole("link", { name: "Team" }).count()).toBe(0);
    await screenshot(page, "invited-trainee-sites");

    // The link works once only.
    await signOut(page);
    await page.goto(`${app.url}${link.pathname}`);
    await page.getByText("This invitation cannot be used").waitFor();
  });

  it("serves JSON 404 for an unknown API route, not the page", async () => {
    const response = await fetch(`${app.url}/api/no-such-route`);
    expect(response.status).toBe(404);
    const body = (await response.json()) as { error: { code: string } };
    expect(body.error.code).toBeTruthy();
  });
});

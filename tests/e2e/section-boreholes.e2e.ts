/**
 * Boreholes kept with a section: the lead imports a borehole file into the demo section,
 * undoes and redoes it, saves, reloads, and the boreholes are still listed and drawn; the
 * Review screen's read-only section draws them too.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { demoAccounts, openBrowser, screenshot, signIn, startApp, type E2eApp } from "./harness";

const PLAN = "Cutting line C — buried channel (2-D)";
/** Invented logs: depths below the ground of the colluvium's and weathered sandstone's bases. */
const LOGS = "borehole,position,depth1,depth2\nBH1,10,2.2,6.1\nBH2,39,2.3,7.3\nBH3,70,2.3,5.9\n";

let app: E2eApp;
let lead: Awaited<ReturnType<typeof openBrowser>>;
let planId = "";

beforeAll(async () => {
  app = await startApp();
  lead = await openBrowser();
  await signIn(lead.page, app.url, demoAccounts.lead);
  const { page } = lead;
  const sites = (await (await page.request.get(`${app.url}/api/sites`)).json()) as Array<{
    id: string;
  }>;
  for (const site of sites) {
    const plans = (await (
      await page.request.get(`${app.url}/api/sites/${site.id}/plans`)
    ).json()) as Array<{ id: string; name: string }>;
    planId = plans.find((p) => p.name === PLAN)?.id ?? planId;
  }
  if (!planId) throw new Error(`the demo data holds no plan "${PLAN}"`);
}, 60_000);

afterAll(async () => {
  await lead?.close();
  await app?.close();
});

const upToDate = (page: Page) => page.getByText("Analysis up to date").waitFor({ timeout: 30_000 });
const drawn = (page: Page) => page.locator('svg g[aria-label="Boreholes"] text').allTextContents();

describe("boreholes kept with a section", () => {
  it("imports a borehole file, keeps it through undo, save and reload", async () => {
    const { page } = lead;
    await page.goto(`${app.url}/plans/${planId}`);
    await upToDate(page);
    await page.getByRole("img", { name: /^Section being edited/ }).waitFor();
    await page.getByText("Import from survey files").click();
    await page.getByLabel(/Layer bases from boreholes/).setInputFiles({
      name: "cutting-c-boreholes.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(LOGS),
    });
    const list = page.getByRole("table", { name: "Stored boreholes" });
    await list.waitFor();
    expect(await drawn(page)).toEqual(["BH1", "BH2", "BH3"]);

    // the import is one step of the edit history
    const history = page.getByRole("group", { name: "Edit history" });
    await history.getByRole("button", { name: /Undo/ }).click();
    await expect.poll(() => list.count()).toBe(0);
    await history.getByRole("button", { name: /Redo/ }).click();
    await list.waitFor();
    await upToDate(page);

    await page.getByRole("button", { name: "Save" }).click();
    await page.getByText(/revision 2/).waitFor({ timeout: 20_000 });
    const stored = await page.evaluate(
      async (id) => (await fetch(`/api/plans/${id}`)).json(),
      planId,
    );
    const doc = stored.document ?? stored.plan?.document;
    expect(doc.models[0].boreholes).toEqual([
      { name: "BH1", position: 10, depths: [2.2, 6.1] },
      { name: "BH2", position: 39, depths: [2.3, 7.3] },
      { name: "BH3", position: 70, depths: [2.3, 5.9] },
    ]);

    await page.reload();
    await upToDate(page);
    await list.waitFor();
    expect(await list.getByRole("row").count()).toBe(4);
    expect(await drawn(page)).toEqual(["BH1", "BH2", "BH3"]);
    await screenshot(page, "section-boreholes-editor");
    await page.getByRole("img", { name: /^Section being edited/ }).screenshot({
      path: "tests/e2e/screenshots/section-boreholes-figure.png",
    });
  }, 120_000);

  it("draws the stored boreholes on the Review screen's read-only section", async () => {
    const { page } = lead;
    await page.goto(`${app.url}/plans/${planId}/review`);
    await page.getByText("Section: stretches sampled by head waves (read-only)").waitFor({
      timeout: 30_000,
    });
    await page.getByRole("img", { name: /stretches sampled by head waves/ }).waitFor();
    await expect.poll(() => drawn(page)).toEqual(["BH1", "BH2", "BH3"]);
    await screenshot(page, "section-boreholes-review");
  }, 90_000);

  it("notes a log the edited model no longer agrees with", async () => {
    const { page } = lead;
    await page.goto(`${app.url}/plans/${planId}`);
    await upToDate(page);
    await page.getByLabel("Polyline shown in the table").selectOption({ index: 2 });
    // BH2 at 39 m logs the weathered sandstone's base 7.3 m down; lower the base there by 3 m
    const row = page.getByRole("table", { name: /^Points of the base of weathered sandstone/ });
    const positions = await row
      .getByLabel(/position \(m\)$/)
      .evaluateAll((els) => els.map((e) => Number((e as HTMLInputElement).value)));
    const n = positions.indexOf(39) + 1;
    expect(n).toBeGreaterThan(0);
    const box = row.getByLabel(new RegExp(`point ${n} elevation \\(m\\)$`));
    await box.fill(String(Number(await box.inputValue()) - 3));
    await page.getByText(/^BH2: top of sandstone logged at/).waitFor();
    await page.getByRole("region", { name: "Boreholes stored with this section" }).screenshot({
      path: "tests/e2e/screenshots/section-boreholes-mismatch.png",
    });
  }, 60_000);
});

/**
 * The designer as a survey lead uses it (issue 14): end shots follow the spread when the
 * channel count grows, Apply offers what to keep with its consequence, Ctrl+Z undoes an edit,
 * and the design sweep says how to read it (feet precision is checked in src/lib units tests). Screenshots go to
 * tests/e2e/screenshots/designer-practice-*.png.
 */
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { demoAccounts, openBrowser, screenshot, signIn, startApp, type E2eApp } from "./harness";

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

const SITE = "Scarrowfield road cutting";

async function upToDate(page: Page) {
  await page.getByText("Analysis up to date").waitFor({ timeout: 30_000 });
}

describe("designer practice", () => {
  it("keeps end shots outside a growing spread, applies with a choice and undoes", async () => {
    const { page } = browser;
    await signIn(page, app.url, demoAccounts.lead);
    await page.getByRole("link", { name: SITE }).click();
    await page.getByRole("heading", { name: "Plans" }).waitFor();
    await page.getByRole("button", { name: "New plan" }).click();
    await page.getByLabel("Plan name").fill("Anchored shots check");
    await page.getByRole("button", { name: "Create plan" }).click();
    await page.getByRole("heading", { name: "Anchored shots check" }).waitFor();
    await upToDate(page);

    await page.getByRole("tab", { name: "Spread" }).click();
    // A new plan: 3 m × 24 with end shots anchored to the spread's ends.
    expect(await page.getByLabel("Spacing (m)", { exact: true }).inputValue()).toBe("3");
    const placed = page.getByLabel(/^Shot \d+ placed$/);
    let count = 0;
    for (let i = 1; i <= (await placed.count()); i++) {
      if ((await page.getByLabel(`Shot ${i} placed`).inputValue()) === "end") count = i;
    }
    expect(count).toBeGreaterThan(0);
    const endShot = page.getByLabel(`Shot ${count} placed`);
    // 48 geophones at 3 m end at 141 m (by hand): the far end shot is 1.5 m beyond.
    await page.getByLabel("Channels", { exact: true }).fill("48");
    await upToDate(page);
    const row = page.locator("tr", { has: endShot });
    expect(await row.innerText()).toContain("at 142.50 m");
    expect(await row.innerText()).toContain("beyond the last geophone");
    await screenshot(page, "designer-practice-anchored-shots");
    // Nit (issue 14 item 11): no stray "|" in the plan verdict row.
    expect(await page.getByLabel("Verdicts").innerText()).not.toContain("|");

    // Undo brings 24 channels (and the end shot at 70.5 m) back; redo returns to 48.
    await page.locator("body").click({ position: { x: 5, y: 5 } });
    await page.keyboard.press("Control+z");
    expect(await page.getByLabel("Channels", { exact: true }).inputValue()).toBe("24");
    expect(
      await page.locator("tr", { has: page.getByLabel(`Shot ${count} placed`) }).innerText(),
    ).toContain("at 70.50 m");
    await page.getByRole("button", { name: "↷ Redo" }).click();
    expect(await page.getByLabel("Channels", { exact: true }).inputValue()).toBe("48");

    // Source reach: a hammer on a moderate site does not reach 142.5 m; stacking is offered.
    await page.getByLabel("Site noise").selectOption("moderate");
    await page.getByLabel("Shot 1 source").selectOption("sledgehammer");
    const reach = page.getByRole("list", { name: "Reach flags" });
    await reach.waitFor();
    expect(await reach.innerText()).toMatch(/Shot 1 must record out to 142\.50 m.*stack 6 shots/);
    expect(await page.getByRole("list", { name: "Source cautions" }).innerText()).toContain(
      "Defer to local codes and licensed practice",
    );
    await page.getByRole("group", { name: "Source reach" }).screenshot({
      path: "tests/e2e/screenshots/designer-practice-source-reach.png",
    });

    // An exported chart says what it shows: its title and legend are in the file.
    await page.getByRole("tab", { name: "Arrivals" }).click();
    await page.getByRole("img", { name: /Arrivals,/ }).waitFor();
    const [download] = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("button", { name: "Export SVG" }).first().click(),
    ]);
    const svgText = readFileSync(await download.path(), "utf8");
    expect(svgText).toMatch(/<text[^>]*font-weight="600"[^>]*>Arrivals/);
    expect(svgText).toContain(">first arrival</text>");

    // Apply offers what to keep, each with its consequence.
    await page.getByRole("tab", { name: "Resolvability" }).click();
    const ways = page.getByRole("list", { name: "Ways to apply" });
    await ways.waitFor();
    const text = await ways.innerText();
    for (const title of [
      "Follow the recommendation",
      "Keep spacing (add channels)",
      "Keep spread length",
      "Keep channel count",
    ])
      expect(text).toContain(title);
    await screenshot(page, "designer-practice-apply-choices");

    // The sweep reads: a y-axis title, the worst-verdict line and the spread-length caveat.
    await page.getByRole("button", { name: "Design sweep" }).click();
    await page.getByRole("button", { name: "Run sweep" }).click();
    await page.getByRole("grid", { name: "Design sweep heatmap" }).waitFor({ timeout: 60_000 });
    await page.locator('[data-role="y-title"]').waitFor();
    // The y title names its unit, as the spacing axis does (issue 14 QA).
    expect(await page.locator('[data-role="y-title"]').textContent()).toMatch(
      /^Layer \d \w+ \((m|m\/s)\)$/,
    );
    // The helper sentence under the grid is in the text face; only a pointed cell's figures
    // are monospace (issue 14 nit: helper sentences in monospace).
    const readout = page.getByTestId("sweep-readout");
    expect(await readout.textContent()).toMatch(/\(rows\) against .* \(columns\)\.$/);
    expect(await readout.evaluate((el) => getComputedStyle(el).fontFamily)).not.toMatch(/mono/i);
    expect(await page.getByText(/worst verdict over all refractors/).count()).toBe(1);
    await screenshot(page, "designer-practice-sweep");
  });
});

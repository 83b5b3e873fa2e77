/**
 * Ground sections in the browser: a survey lead converts the layered model of a new plan into
 * a section, bends the rockhead into a buried channel by dragging a point on the section
 * chart, reads the stretches of rockhead the spread samples, tightens the spread and saves;
 * a reviewer then sees the same section, read-only, with its stretches and verdicts.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { demoAccounts, openBrowser, screenshot, signIn, startApp, type E2eApp } from "./harness";

type Browser = Awaited<ReturnType<typeof openBrowser>>;

let app: E2eApp;
let lead: Browser;
let reviewer: Browser;
let planId = "";

const SITE = "Scarrowfield road cutting";
const PLAN = "Scarrowfield cutting, channel section";
const SECTION = "Soil over weathered rock (section)";
const BASE = "base of loose sandy soil";

beforeAll(async () => {
  app = await startApp();
  [lead, reviewer] = await Promise.all([openBrowser(), openBrowser()]);
  await Promise.all([
    signIn(lead.page, app.url, demoAccounts.lead),
    signIn(reviewer.page, app.url, demoAccounts.reviewer),
  ]);
}, 60_000);

afterAll(async () => {
  await Promise.all([lead?.close(), reviewer?.close()]);
  await app?.close();
});

const upToDate = (page: Page) => page.getByText("Analysis up to date").waitFor({ timeout: 30_000 });

/** Elevation (m) shown in the table for point `n` (1-based) of the base. */
async function baseElevation(page: Page, n: number): Promise<number> {
  return Number(await page.getByLabel(`${BASE} point ${n} elevation (m)`).inputValue());
}

describe("ground sections in the browser", () => {
  it("lets a lead convert a model, drag the rockhead into a channel and read its stretches", async () => {
    const { page } = lead;
    await page.getByRole("link", { name: "Sites" }).click();
    await page.getByRole("link", { name: SITE }).click();
    await page.getByRole("button", { name: "New plan" }).click();
    await page.getByLabel("Plan name").fill(PLAN);
    await page.getByRole("button", { name: "Create plan" }).click();
    await page.waitForURL(/\/plans\/[0-9a-f-]{36}$/);
    planId = new URL(page.url()).pathname.split("/")[2];
    await upToDate(page);

    // One click: a section copy of the layered model (flat ground, straight base).
    await page.getByRole("button", { name: "Convert to section" }).click();
    await page.getByRole("tab", { name: SECTION, selected: true }).first().waitFor();
    await page.getByRole("img", { name: /^Section being edited/ }).waitFor();
    await upToDate(page);

    // A point in the middle of the base, from its table, then dragged down on the chart.
    await page.getByLabel("Polyline shown in the table").selectOption({ label: BASE });
    await page.getByRole("button", { name: `Add a point after point 1 of the ${BASE}` }).click();
    const before = await baseElevation(page, 2);
    const handle = page.getByRole("button", { name: new RegExp(`^${BASE} point 2 at`) });
    const box = await handle.boundingBox();
    expect(box).not.toBeNull();
    const cx = box!.x + box!.width / 2;
    const cy = box!.y + box!.height / 2;
    await page.mouse.move(cx, cy);
    await page.mouse.down();
    for (let step = 1; step <= 6; step++) await page.mouse.move(cx, cy + step * 15);
    await page.mouse.up();
    const after = await baseElevation(page, 2);
    // dragged down: the channel floor is now well below the straight base
    expect(after).toBeLessThan(before - 2);

    // Clicking the base line adds a point there; Delete removes the selected one again.
    const p2 = (await handle.boundingBox())!;
    const p3 = (await page
      .getByRole("button", { name: new RegExp(`^${BASE} point 3 at`) })
      .boundingBox())!;
    const midX = (p2.x + p2.width / 2 + p3.x + p3.width / 2) / 2;
    const midY = (p2.y + p2.height / 2 + p3.y + p3.height / 2) / 2;
    await page.mouse.click(midX, midY);
    await page.getByLabel(`${BASE} point 4 elevation (m)`).waitFor();
    await page.keyboard.press("Delete");
    await expect.poll(() => page.getByLabel(`${BASE} point 4 elevation (m)`).count()).toBe(0);
    await upToDate(page);

    // The answers on the section: stretches per shot branch, verdicts, the interpretation.
    await page.getByRole("tab", { name: "Section", exact: true }).click();
    await page
      .getByRole("img", { name: /stretches sampled by head waves/ })
      .waitFor({ timeout: 30_000 });
    const top = page.getByRole("region", { name: "Top of layer 2" });
    await top.waitFor();
    expect(await top.textContent()).toMatch(/sampled from/);
    await page
      .getByText(/grid cell/)
      .first()
      .waitFor();
    await page.getByText(/intercept-time method under each shot/).waitFor();
    await page.waitForTimeout(500); // let the rays arrive
    await screenshot(page, "section-designer-channel");
    await page.getByRole("tab", { name: "Resolvability", exact: true }).click();
    const stretches = page.getByRole("table", { name: "Stretches of the top of layer 2" });
    await stretches.waitFor();
    expect(await stretches.getByRole("row").count()).toBeGreaterThan(1);
    await screenshot(page, "section-designer-stretches");

    // A narrow flat-floored channel (floor 32–38 m, walls 4 m wide): the spread's rays leave
    // the floor at too few geophones, so the floor is flagged by name, on the table and on
    // the section, with a recommendation beside it.
    const setPoint = async (n: number, x: number, z: number) => {
      await page.getByLabel(`${BASE} point ${n} position (m)`).fill(String(x));
      await page.keyboard.press("Tab");
      await page.getByLabel(`${BASE} point ${n} elevation (m)`).fill(String(z));
      await page.keyboard.press("Tab");
    };
    await setPoint(2, 28, 95);
    for (const [n, x, z] of [
      [3, 32, 90.5],
      [4, 38, 90],
      [5, 42, 95],
    ]) {
      await page
        .getByRole("button", { name: `Add a point after point ${n - 1} of the ${BASE}` })
        .click();
      await setPoint(n, x, z);
    }
    await upToDate(page);
    const missed = page.getByRole("group", {
      name: "Features of the top of weathered rock the spread misses",
    });
    await missed.waitFor({ timeout: 30_000 });
    expect(await missed.textContent()).toMatch(
      /channel floor\s*3[0-9]\.\d\d m – 3[0-9]\.\d\d m: \d geophones?/,
    );
    expect(await missed.textContent()).toMatch(/spacing at most/);
    await screenshot(page, "section-designer-channel-floor");
    await page.getByRole("tab", { name: "Section", exact: true }).click();
    await page.getByRole("img", { name: /^channel floor from .*under-sampled$/ }).waitFor();
    await screenshot(page, "section-designer-channel-floor-section");
    // back to the dragged V-shaped base for the rest of the journey
    for (const n of [5, 4, 3])
      await page.getByRole("button", { name: `Remove point ${n} of the ${BASE}` }).click();
    await setPoint(2, 34.5, after);
    await upToDate(page);
  }, 180_000);

  it("tightens the spread, saves, and the section is stored", async () => {
    const { page } = lead;
    await page.getByRole("tab", { name: "Spread", exact: true }).click();
    await page.getByLabel("Spacing (m)").fill("1.5");
    await page.getByLabel("Channels", { exact: true }).fill("48");
    await upToDate(page);
    await page.getByRole("tab", { name: "Section", exact: true }).click();
    await page.getByRole("img", { name: /stretches sampled by head waves/ }).waitFor();

    // Design sweep of the section: spacing × the channel floor's elevation (2 × 2 cells).
    await page.getByRole("button", { name: "Design sweep" }).click();
    await page.getByLabel("Point", { exact: true }).selectOption({ index: 1 });
    await page.getByLabel("Spacing steps", { exact: true }).fill("2");
    await page.getByLabel("Elevation steps", { exact: true }).fill("2");
    await page.getByRole("button", { name: "Run section sweep" }).click();
    const sweep = page.getByRole("table", { name: "Section sweep: worst verdict and depth error" });
    await sweep.waitFor({ timeout: 60_000 });
    expect(await sweep.getByRole("row").count()).toBe(3);
    await screenshot(page, "section-sweep");

    // Side by side: the layered model and its section, overlaid.
    await page.getByRole("button", { name: "Side by side" }).click();
    await page
      .getByRole("table", { name: "Verdicts and depth errors side by side" })
      .waitFor({ timeout: 30_000 });
    await page.getByRole("img", { name: "First arrivals of the scenarios, overlaid" }).waitFor();
    await screenshot(page, "section-side-by-side");
    await page.getByRole("button", { name: "Design", exact: true }).click();

    await page.getByRole("button", { name: "Save" }).click();
    await page.getByText(/revision 2/).waitFor({ timeout: 20_000 });

    // the stored document is a format-2 plan holding the section
    const stored = await page.evaluate(async (id) => {
      const r = await fetch(`/api/plans/${id}`);
      return r.json();
    }, planId);
    const doc = stored.document ?? stored.plan?.document;
    expect(doc.format).toBe("spreadsight-plan/2");
    const section = doc.models.find((m: { kind?: string }) => m.kind === "section");
    expect(section.layers[0].base.length).toBe(3);
    expect(doc.spread.spacing).toBe(1.5);

    await page.goto(`${app.url}/plans/${planId}/review`);
    await page.getByLabel("Note for the reviewers").fill("Channel section, 1.5 m spacing.");
    await page.getByRole("button", { name: "Submit for review" }).click();
    await page.locator("header").getByText("In review", { exact: true }).waitFor();
  }, 120_000);

  it("shows the reviewer the same section, read-only, with stretches and verdicts", async () => {
    const { page } = reviewer;
    await page.goto(`${app.url}/plans/${planId}/review`);
    await page.getByRole("heading", { name: `Review: ${PLAN}` }).waitFor();
    await page.getByLabel("Ground model").selectOption({ label: SECTION });
    await page.getByText("Section: stretches sampled by head waves (read-only)").waitFor({
      timeout: 30_000,
    });
    await page.getByRole("img", { name: /stretches sampled by head waves/ }).waitFor();
    const stretches = page.getByRole("table", { name: "Stretches of the top of layer 2" });
    await stretches.waitFor();
    // read-only: no draggable points on the Review screen
    expect(await page.getByRole("button", { name: new RegExp(`^${BASE} point`) }).count()).toBe(0);
    await screenshot(page, "section-review");
  }, 120_000);
});

/**
 * The plan designer in the browser, against the real server and the built client:
 * a survey lead designs a spread from scratch, thins a layer until the engine flags it,
 * applies the recommendation and sees it resolved; a trainee compares two scenarios.
 * Screenshots of every designer screen go to tests/e2e/screenshots/.
 */
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
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

const SITE = "Scarrowfield road cutting";
const LEAD_PLAN = "Cutting line 1, clay lens check";

async function upToDate(page: Page) {
  await page.getByText("Analysis up to date").waitFor({ timeout: 20_000 });
}

async function openSite(page: Page) {
  await page.getByRole("link", { name: SITE }).click();
  await page.getByRole("heading", { name: "Plans" }).waitFor();
}

/** The verdict word in a Resolvability row. */
async function verdictOf(page: Page, layer: number): Promise<string> {
  const row = page.locator(`tr[data-layer="${layer}"]`);
  return (await row.locator("td").first().innerText()).trim();
}

/** Click an export button and return the downloaded file's name and bytes. */
async function exported(page: Page, button: string) {
  const [download] = await Promise.all([
    page.waitForEvent("download"),
    page.getByRole("button", { name: button }).first().click(),
  ]);
  const file = await download.path();
  return { name: download.suggestedFilename(), bytes: readFileSync(file) };
}

async function setField(page: Page, label: string, value: string) {
  const box = page.getByLabel(label, { exact: true });
  await box.fill(value);
}

describe("plan designer in the browser", () => {
  it("lets a lead design a spread, see a thin layer flagged and fix it with the recommendation", async () => {
    const { page } = browser;
    await signIn(page, app.url, demoAccounts.lead);
    await openSite(page);

    await page.getByRole("button", { name: "New plan" }).click();
    await page.getByLabel("Plan name").fill(LEAD_PLAN);
    await page.getByRole("button", { name: "Create plan" }).click();
    await page.getByRole("heading", { name: LEAD_PLAN }).waitFor();
    await upToDate(page);

    // A clay lens between the soil and the rock.
    await page.getByRole("button", { name: "Add layer above the half-space" }).click();
    await setField(page, "Layer 2 name", "soft clay lens");
    await setField(page, "Layer 2 velocity (m/s)", "1500");
    await setField(page, "Layer 2 thickness (m)", "6");
    await upToDate(page);
    await screenshot(page, "designer-ground-models");

    // Thin the lens until the engine flags it.
    await page.getByRole("tab", { name: "Resolvability" }).click();
    expect(await verdictOf(page, 2)).toContain("Resolved");
    let flaggedAt: string | null = null;
    for (const thickness of ["5", "4", "3.5", "3", "2.5"]) {
      await setField(page, "Layer 2 thickness (m)", thickness);
      await upToDate(page);
      const verdict = await verdictOf(page, 2);
      if (!verdict.includes("Resolved")) {
        expect(verdict).toContain("Under-sampled");
        flaggedAt = thickness;
        break;
      }
    }
    expect(flaggedAt).not.toBeNull();
    await page
      .getByText(/No depths can be interpreted|not seen|interpreted/)
      .first()
      .waitFor();
    await screenshot(page, "designer-resolvability-flagged");

    // The Arrivals chart flags it too, with the reason.
    await page.getByRole("tab", { name: "Arrivals" }).click();
    const flags = page.getByRole("list", { name: "Flagged arrivals on this shot" });
    await flags.waitFor();
    expect(await flags.innerText()).toMatch(/Layer 2 \(soft clay lens\).*under-sampled/);
    await screenshot(page, "designer-arrivals-flagged");

    // One click on the recommendation, and the engine says it is resolved.
    await page.getByRole("tab", { name: "Resolvability" }).click();
    await page.getByRole("button", { name: /^Follow the recommendation: / }).click();
    await upToDate(page);
    expect(await verdictOf(page, 2)).toContain("Resolved");
    const verdicts = page.getByLabel("Verdicts");
    expect(await verdicts.innerText()).not.toMatch(/Under-sampled|Blind|Velocity inversion/);
    await screenshot(page, "designer-resolvability-resolved");

    await page.getByRole("button", { name: "Save" }).click();
    await page.getByText(/revision 2/).waitFor();
    await page.getByText("No changes").or(page.getByText("Saved")).first().waitFor();

    await page.getByRole("tab", { name: "Arrivals" }).click();
    await page.getByRole("img", { name: /Arrivals,/ }).waitFor();
    await screenshot(page, "designer-arrivals");
    const svg = await exported(page, "Export SVG");
    expect(svg.name).toMatch(/^arrivals-.*\.svg$/);
    expect(svg.bytes.toString("utf8")).toContain("<svg");
    expect(svg.bytes.toString("utf8")).not.toContain("NaN");
    const png = await exported(page, "Export PNG");
    expect(png.name).toMatch(/\.png$/);
    expect(png.bytes.subarray(0, 8).toString("hex")).toBe("89504e470d0a1a0a"); // PNG signature
    expect(png.bytes.length).toBeGreaterThan(5000);
    await page.getByRole("button", { name: "Near offsets" }).click();
    await page.waitForTimeout(300);
    await screenshot(page, "designer-arrivals-near");

    await page.getByRole("tab", { name: "Section" }).click();
    await page.getByRole("img", { name: /Section,/ }).waitFor();
    await screenshot(page, "designer-section");
    const sectionPng = await exported(page, "Export PNG");
    expect(sectionPng.name).toMatch(/^section-.*\.png$/);
    expect(sectionPng.bytes.subarray(0, 4).toString("hex")).toBe("89504e47");

    await page.getByRole("tab", { name: "Spread" }).click();
    await page.getByText(/Spread length/).waitFor();
    await screenshot(page, "designer-spread");

    await page.getByRole("button", { name: "Design sweep" }).click();
    await page.getByRole("button", { name: "Run sweep" }).click();
    await page.getByText("Done").waitFor({ timeout: 60_000 });
    await page.getByRole("grid", { name: "Design sweep heatmap" }).waitFor();
    await screenshot(page, "designer-sweep");

    await page.goto(`${app.url}/sites`);
    await openSite(page);
    const row = page.locator("tr", { has: page.getByRole("link", { name: LEAD_PLAN }) });
    expect(await row.innerText()).toContain("Resolved");
    await screenshot(page, "site-plans");
    await signOut(page);
  });

  it("lets a trainee compare two scenarios side by side", async () => {
    const { page } = browser;
    await signIn(page, app.url, demoAccounts.trainee);
    await openSite(page);
    await page.getByRole("button", { name: "New sandbox scenario" }).click();
    await page.getByLabel("Plan name").fill("Thicker soil scenario");
    await page.getByRole("button", { name: "Create plan" }).click();
    await page.getByRole("heading", { name: "Thicker soil scenario" }).waitFor();
    await page.getByText("Sandbox").first().waitFor();
    await upToDate(page);

    // A second candidate model: the same ground with twice the soil.
    await page.getByRole("button", { name: "+ Copy as new model" }).click();
    await setField(page, "Model name", "Thick soil");
    await setField(page, "Layer 1 thickness (m)", "9");
    await upToDate(page);

    await page.getByRole("button", { name: "Side by side" }).click();
    const table = page.getByRole("table", { name: "Verdicts and depth errors side by side" });
    await table.waitFor({ timeout: 20_000 });
    expect(await table.locator("thead th").count()).toBe(3);
    expect(await table.locator('[data-differs="true"]').count()).toBeGreaterThan(0);
    await screenshot(page, "side-by-side-models");

    // And against the lead's plan on the same site.
    await page.getByRole("radio", { name: "Plans of this site" }).click();
    await page.getByRole("checkbox", { name: new RegExp(LEAD_PLAN) }).check();
    await table.waitFor({ timeout: 20_000 });
    await page.getByRole("columnheader", { name: new RegExp(LEAD_PLAN) }).waitFor();
    await screenshot(page, "side-by-side-plans");

    await page.getByRole("button", { name: "Save" }).click();
    await page.getByText(/revision 2/).waitFor();
    await page.goto(`${app.url}/sites`);
    await openSite(page);
    const row = page.locator("tr", {
      has: page.getByRole("link", { name: "Thicker soil scenario" }),
    });
    expect(await row.innerText()).toContain("Sandbox");
    await signOut(page);
  });
});

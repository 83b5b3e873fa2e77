/**
 * The designer on a phone and on paper (issue 14). At 390 × 844 CSS px (a common phone
 * viewport, common practice) a layered plan and the demo section plan scroll only up and
 * down in the design view (inputs, Arrivals, Section, Resolvability), the design sweep and
 * side by side: nothing is wider than the screen, no table hides columns in a box that scrolls
 * sideways, the verdicts are in view and the small buttons are big enough to tap. Printed, the
 * designer is a record on a white page: the inputs as text, every analysis view, no navigation,
 * tabs, buttons or form boxes. Screenshots: tests/e2e/screenshots/phone-designer-* and
 * print-designer-*.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { demoAccounts, openBrowser, screenshot, signIn, startApp, type E2eApp } from "./harness";

const PHONE = { width: 390, height: 844 };
const LAYERED = "Cutting line A — clay lens check";
const SECTION = "Cutting line C — buried channel (2-D)";

let app: E2eApp;
let browser: Awaited<ReturnType<typeof openBrowser>>;
const planIds = new Map<string, string>();

beforeAll(async () => {
  app = await startApp();
  browser = await openBrowser();
  // The lead wrote both demo plans, so the designer shows every editing control.
  await signIn(browser.page, app.url, demoAccounts.lead);
  const { page } = browser;
  const sites = (await (await page.request.get(`${app.url}/api/sites`)).json()) as Array<{
    id: string;
  }>;
  for (const site of sites) {
    const plans = (await (
      await page.request.get(`${app.url}/api/sites/${site.id}/plans`)
    ).json()) as Array<{ id: string; name: string }>;
    for (const plan of plans) planIds.set(plan.name, plan.id);
  }
  await page.setViewportSize(PHONE);
});

afterAll(async () => {
  await browser?.close();
  await app?.close();
});

function planUrl(name: string, query = ""): string {
  const id = planIds.get(name);
  if (!id) throw new Error(`the demo data holds no plan "${name}"`);
  return `${app.url}/plans/${id}${query}`;
}

async function openDesigner(page: Page, name: string, query = "") {
  await page.goto(planUrl(name, query));
  await page.getByText("Analysis up to date").waitFor({ timeout: 30_000 });
}

/**
 * How far the page reaches past the right edge of the screen, px, and what sticks out or
 * scrolls sideways inside its own box (so a failure names it). As in phone.e2e.ts.
 */
async function overflow(page: Page): Promise<{ extra: number; culprits: string[] }> {
  return page.evaluate(() => {
    const width = document.documentElement.clientWidth;
    const extra = (document.scrollingElement ?? document.documentElement).scrollWidth - width;
    const culprits: string[] = [];
    for (const el of Array.from(document.querySelectorAll("body *"))) {
      const box = el.getBoundingClientRect();
      if (box.right > width + 1 && box.width > 0) {
        const text = (el.textContent ?? "").trim().slice(0, 40);
        culprits.push(
          `${el.tagName.toLowerCase()}.${String(el.className).slice(0, 60)} «${text}» ${Math.round(box.right)}px`,
        );
      }
    }
    for (const el of Array.from(document.querySelectorAll("main *"))) {
      const style = getComputedStyle(el);
      if (
        (style.overflowX === "auto" || style.overflowX === "scroll") &&
        el.scrollWidth > el.clientWidth + 1
      ) {
        const text = (el.textContent ?? "").trim().slice(0, 40);
        culprits.push(`scrolls inside: ${el.tagName.toLowerCase()} «${text}» ${el.scrollWidth}px`);
      }
    }
    return { extra, culprits: culprits.slice(0, 8) };
  });
}

async function expectNoSidewaysScroll(page: Page, name: string) {
  await screenshot(page, `phone-designer-${name}`);
  const { extra, culprits } = await overflow(page);
  expect(culprits, `${name} is wider than the phone`).toEqual([]);
  expect(extra, `${name} scrolls sideways`).toBeLessThanOrEqual(0);
}

/** The element is shown and lies wholly within the phone's width. */
async function expectInView(locator: ReturnType<Page["locator"]>, what: string) {
  const box = await locator.boundingBox();
  expect(box, `${what} is not shown`).not.toBeNull();
  expect(box!.x, `${what} starts left of the screen`).toBeGreaterThanOrEqual(0);
  expect(box!.x + box!.width, `${what} ends right of the screen`).toBeLessThanOrEqual(PHONE.width);
}

/**
 * Smallest tap target we accept for the designer's small icon buttons on a phone, CSS px.
 * Common practice for touch: WCAG 2.2 asks for at least 24 px (2.5.8) and 44 px at the
 * enhanced level (2.5.5); the designer's row buttons are 36 px below the sm breakpoint.
 */
const TAP = 36;

describe("the designer at 390 px", () => {
  it("shows a layered plan's inputs as cards within the screen, with every control in reach", async () => {
    const { page } = browser;
    await openDesigner(page, LAYERED);
    await expectNoSidewaysScroll(page, "layered");
    // The header's own controls and the inputs, in view.
    await expectInView(page.getByRole("heading", { level: 1 }), "the plan's name");
    await expectInView(page.getByRole("button", { name: "Save" }), "Save");
    await expectInView(page.getByRole("link", { name: "Field check" }), "Field check");
    for (const label of [
      "Layer 2 name",
      "Layer 2 velocity (m/s)",
      "Layer 2 thickness (m)",
      "Layer 2 base dip (degrees)",
    ]) {
      await expectInView(page.getByLabel(label), label);
    }
    const remove = page.getByRole("button", { name: "Remove layer 2" });
    await expectInView(remove, "Remove layer 2");
    const tap = (await remove.boundingBox())!;
    expect(tap.width).toBeGreaterThanOrEqual(TAP);
    expect(tap.height).toBeGreaterThanOrEqual(TAP);
    const undo = (await page.getByRole("button", { name: /Undo/ }).boundingBox())!;
    expect(undo.height).toBeGreaterThanOrEqual(TAP);
    await expectInView(
      page.getByRole("button", { name: "Add layer above the half-space" }),
      "Add layer",
    );
    // The Arrivals chart is drawn to the card's width.
    await expectInView(page.getByRole("img", { name: /^Arrivals, / }), "the Arrivals chart");
  });

  it("keeps the layered plan's Section and Resolvability views, verdicts included, on the screen", async () => {
    const { page } = browser;
    await openDesigner(page, LAYERED, "?panel=section");
    await page.getByText(/^Ray path: /).waitFor({ timeout: 30_000 });
    await expectNoSidewaysScroll(page, "layered-section");

    await openDesigner(page, LAYERED, "?panel=resolvability");
    const table = page.getByRole("table", { name: "Resolvability of Clay lens present" });
    await table.waitFor();
    await expectNoSidewaysScroll(page, "layered-resolvability");
    // Each refractor's verdict (the column the issue found cut off) and its depths are in view.
    const rows = table.locator("tbody tr");
    expect(await rows.count()).toBe(4);
    await expectInView(table.locator('tr[data-layer="2"]').getByText("Blind"), "layer 2's verdict");
    for (let i = 0; i < 4; i++) {
      await expectInView(rows.nth(i).locator("td").first(), `row ${i + 1}'s verdict`);
    }
    // The refractors' depths and minimum thickness (the direct wave has none on a phone).
    for (const layer of [2, 3, 4]) {
      const cells = table.locator(`tr[data-layer="${layer}"] td`);
      await expectInView(cells.nth(3), `layer ${layer}'s depths`);
      await expectInView(cells.last(), `layer ${layer}'s minimum thickness`);
    }
  });

  it("shows the demo section plan's editor and answers within the screen", async () => {
    const { page } = browser;
    await openDesigner(page, SECTION);
    await page.getByRole("img", { name: /^Section being edited/ }).waitFor();
    await expectNoSidewaysScroll(page, "section");
    await expectInView(
      page.getByRole("img", { name: /^Section being edited/ }),
      "the section being edited",
    );
    await expectInView(page.getByLabel("Layer 2 velocity (m/s)"), "layer 2's velocity");
    await expectInView(
      page.getByLabel("Layer 2 velocity along the line"),
      "layer 2's velocity along the line",
    );
    await expectInView(page.getByLabel("surface point 3 elevation (m)"), "a point's elevation");

    await openDesigner(page, SECTION, "?panel=resolvability");
    const stretches = page.getByRole("table", { name: "Stretches of the top of layer 3" });
    await stretches.waitFor({ timeout: 30_000 });
    await expectNoSidewaysScroll(page, "section-resolvability");
    await expectInView(stretches.getByText("Under-sampled").first(), "a stretch's verdict");

    await openDesigner(page, SECTION, "?panel=section");
    await page
      .getByRole("img", { name: /^Section, .*stretches sampled by head waves/ })
      .waitFor({ timeout: 30_000 });
    await expectNoSidewaysScroll(page, "section-answers");
  });

  it("runs both design sweeps and shows their grids within the screen", async () => {
    const { page } = browser;
    await openDesigner(page, LAYERED, "?view=sweep");
    await page.getByRole("button", { name: "Run sweep" }).click();
    const heatmap = page.getByRole("grid", { name: "Design sweep heatmap" });
    await heatmap.waitFor({ timeout: 90_000 });
    await expectNoSidewaysScroll(page, "sweep");
    await expectInView(heatmap, "the sweep heatmap");

    await openDesigner(page, SECTION, "?view=sweep");
    await page.getByRole("button", { name: "Run section sweep" }).click();
    const grid = page.getByRole("table", { name: "Section sweep: worst verdict and depth error" });
    await grid.waitFor({ timeout: 90_000 });
    await expectNoSidewaysScroll(page, "section-sweep");
    // Every cell of the last column (the widest spacing) is on the screen.
    const rows = grid.locator("tbody tr");
    const n = await rows.count();
    expect(n).toBeGreaterThanOrEqual(2);
    for (let i = 0; i < n; i++) {
      await expectInView(rows.nth(i).locator("td").last(), `row ${i + 1}'s last cell`);
    }
  });

  it("compares two ground models side by side within the screen", async () => {
    const { page } = browser;
    await openDesigner(page, LAYERED, "?view=compare");
    const table = page.getByRole("table", { name: "Verdicts and depth errors side by side" });
    await table.waitFor({ timeout: 30_000 });
    await expectNoSidewaysScroll(page, "compare");
    await expectInView(table.locator("thead th").last(), "the last scenario's column");
  });
});

/** What shows on the printed page (print media emulated). */
async function printed(page: Page) {
  return page.evaluate(() => {
    const shown = (el: Element | null) =>
      !!el && getComputedStyle(el).display !== "none" && el.getClientRects().length > 0;
    const main = document.querySelector("main")!;
    const count = (selector: string) =>
      Array.from(main.querySelectorAll(selector)).filter(shown).length;
    const boxes = Array.from(
      main.querySelectorAll("input:not([type=checkbox]):not([type=radio]), select, textarea"),
    ).filter(shown);
    return {
      header: shown(document.querySelector(".app-header")),
      background: getComputedStyle(document.body).backgroundColor,
      heading: document.querySelector("h1")?.textContent ?? "",
      buttons: count("button, [role=button], a[download], [role=tablist], form"),
      designerViews: shown(document.querySelector('nav[aria-label="Designer views"]')),
      // a box still printed (outside a form) shows its value without the box's border
      boxedInputs: boxes.filter((b) => getComputedStyle(b).borderTopColor !== "rgba(0, 0, 0, 0)")
        .length,
      record: shown(main.querySelector("[data-print-record]"))
        ? (main.querySelector("[data-print-record]") as HTMLElement).innerText
        : "",
      charts: Array.from(main.querySelectorAll("svg[role=img]"))
        .filter(shown)
        .map((svg) => svg.getAttribute("aria-label") ?? svg.querySelector("title")?.textContent),
      text: main.innerText,
      // Tinted panels and highlighted rows (a background that is neither white nor clear, with
      // more than a chip's words) must not force their colour onto paper: the browser drops
      // them and the page stays a record on white.
      tintedInInk: Array.from(main.querySelectorAll("*"))
        .filter((el) => {
          if (el.closest("svg") || !shown(el)) return false;
          const style = getComputedStyle(el);
          const bg = style.backgroundColor;
          return (
            bg !== "rgba(0, 0, 0, 0)" &&
            bg !== "rgb(255, 255, 255)" &&
            (el.textContent ?? "").trim().length > 20 &&
            style.printColorAdjust === "exact"
          );
        })
        .map((el) => `${el.tagName.toLowerCase()} «${(el.textContent ?? "").trim().slice(0, 40)}»`)
        .slice(0, 6),
      // …while the charts, the legends' swatches and the verdict chips keep their colours.
      colourKept: (() => {
        const kept = Array.from(
          main.querySelectorAll("svg[role=img], span.rounded-full, span[style*=background]"),
        ).filter(shown);
        return (
          kept.length > 0 && kept.every((el) => getComputedStyle(el).printColorAdjust === "exact")
        );
      })(),
    };
  });
}

describe("the designer in print", () => {
  it("prints a layered plan as a record: inputs, verdicts and every chart, no controls", async () => {
    const { page } = browser;
    await page.setViewportSize({ width: 800, height: 1100 });
    await openDesigner(page, LAYERED);
    await page.emulateMedia({ media: "print" });
    try {
      await page.getByRole("table", { name: "Resolvability of Clay lens present" }).waitFor();
      await page.getByText(/^Ray path: /).waitFor({ timeout: 30_000 });
      const sheet = await printed(page);
      await screenshot(page, "print-designer-layered");
      expect(sheet.header).toBe(false);
      expect(sheet.background).toBe("rgb(255, 255, 255)");
      expect(sheet.heading).toBe(LAYERED);
      expect(sheet.buttons).toBe(0);
      expect(sheet.designerViews).toBe(false);
      expect(sheet.boxedInputs).toBe(0);
      // The inputs as text: site, both models with their layers, spread and shots.
      expect(sheet.record).toContain("Scarrowfield road cutting");
      expect(sheet.record).toContain("Clay lens present");
      expect(sheet.record).toContain("Lens pinched out");
      expect(sheet.record).toContain("soft clay lens");
      expect(sheet.record).toMatch(/24 geophones at 3\.00 m/);
      expect(sheet.record).toContain("-1.50 m");
      // Arrivals, the section with its ray, and the resolvability table, one after another.
      expect(sheet.charts.some((c) => /^Arrivals, /.test(c ?? ""))).toBe(true);
      expect(sheet.charts.length).toBeGreaterThanOrEqual(2);
      expect(sheet.text).toContain("Resolvability");
      expect(sheet.text).toMatch(/Blind/);
      expect(sheet.tintedInInk).toEqual([]);
      expect(sheet.colourKept).toBe(true);
    } finally {
      await page.emulateMedia({ media: "screen" });
      await page.setViewportSize(PHONE);
    }
  });

  it("prints the section plan with its section figure and stretches", async () => {
    const { page } = browser;
    await page.setViewportSize({ width: 800, height: 1100 });
    await openDesigner(page, SECTION);
    await page.emulateMedia({ media: "print" });
    try {
      await page.getByRole("table", { name: "Stretches of the top of layer 3" }).waitFor({
        timeout: 30_000,
      });
      const sheet = await printed(page);
      await screenshot(page, "print-designer-section");
      expect(sheet.header).toBe(false);
      expect(sheet.background).toBe("rgb(255, 255, 255)");
      expect(sheet.buttons).toBe(0);
      expect(sheet.boxedInputs).toBe(0);
      expect(sheet.record).toContain("Channel in the sandstone (section)");
      expect(sheet.record).toMatch(/surface of 3 points/);
      expect(sheet.charts.length).toBeGreaterThanOrEqual(2);
      expect(sheet.text).toContain("Under-sampled");
      expect(sheet.tintedInInk).toEqual([]);
      expect(sheet.colourKept).toBe(true);
    } finally {
      await page.emulateMedia({ media: "screen" });
      await page.setViewportSize(PHONE);
    }
  });
});

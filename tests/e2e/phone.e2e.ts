/**
 * Phone width (issue 14, item 3): at 390 px CSS width (a common phone viewport, common practice)
 * the sign-in page, the site list, a site's plan list, the Review screen, the Team page, Team
 * activity and the inbox scroll only up and down — nothing is wider than the screen, and no
 * table hides columns in a box that scrolls sideways. The designer at this width and in print
 * is covered by designer-phone.e2e.ts. Also: the print stylesheet hides the navigation and
 * buttons on the Review screen and prints on a white page.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { demoAccounts, openBrowser, screenshot, signIn, startApp, type E2eApp } from "./harness";

/**
 * Smallest tap target in the header on a phone, CSS px: WCAG 2.2 asks for at least 24 px
 * (2.5.8) and 44 px at the enhanced level (2.5.5); we keep 36 px, as the designer's row buttons.
 */
const TAP = 36;

const PHONE = { width: 390, height: 844 };

let app: E2eApp;
let browser: Awaited<ReturnType<typeof openBrowser>>;

beforeAll(async () => {
  app = await startApp();
  browser = await openBrowser();
  await browser.page.setViewportSize(PHONE);
});

afterAll(async () => {
  await browser?.close();
  await app?.close();
});

/**
 * How far the page reaches past the right edge of the screen, px, and the widest offenders
 * (so a failure names them). 0 means no sideways scroll.
 */
async function overflow(page: Page): Promise<{ extra: number; culprits: string[] }> {
  return page.evaluate(() => {
    const width = document.documentElement.clientWidth;
    const extra = document.documentElement.scrollWidth - width;
    const culprits: string[] = [];
    if (extra > 0) {
      for (const el of Array.from(document.querySelectorAll("body *"))) {
        const box = el.getBoundingClientRect();
        if (box.right > width + 1 && box.width > 0) {
          const text = (el.textContent ?? "").trim().slice(0, 40);
          culprits.push(
            `${el.tagName.toLowerCase()}.${String(el.className).slice(0, 60)} «${text}» ${Math.round(box.right)}px`,
          );
        }
      }
    }
    // A table that scrolls sideways inside its own box hides columns just the same.
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
  await page.waitForLoadState("networkidle");
  await screenshot(page, `phone-${name}`);
  const { extra, culprits } = await overflow(page);
  expect(culprits, `${name} is wider than the phone`).toEqual([]);
  expect(extra, `${name} scrolls sideways`).toBeLessThanOrEqual(0);
}

/** The first site of the demo team and a plan of it that the reviewer can review. */
async function demoPlan(page: Page): Promise<{ siteId: string; planId: string }> {
  const sites = (await (await page.request.get(`${app.url}/api/sites`)).json()) as Array<{
    id: string;
  }>;
  for (const site of sites) {
    const plans = (await (
      await page.request.get(`${app.url}/api/sites/${site.id}/plans`)
    ).json()) as Array<{ id: string; sandbox: boolean }>;
    const plan = plans.find((p) => !p.sandbox);
    if (plan) return { siteId: site.id, planId: plan.id };
  }
  throw new Error("the demo data holds no team plan");
}

describe("phone width, 390 px", () => {
  it("signs in without sideways scroll", async () => {
    const { page } = browser;
    await page.goto(`${app.url}/sign-in`);
    await page.getByRole("heading", { name: "Sign in" }).waitFor();
    await expectNoSidewaysScroll(page, "sign-in");
    await signIn(page, app.url, demoAccounts.admin);
  });

  it("shows the sites and a site's plan list within the screen", async () => {
    const { page } = browser;
    await page.goto(`${app.url}/sites`);
    await page.getByRole("heading", { name: "Sites" }).waitFor();
    await expectNoSidewaysScroll(page, "sites");
    const { siteId } = await demoPlan(page);
    await page.goto(`${app.url}/sites/${siteId}`);
    await page.getByRole("table").first().waitFor();
    await expectNoSidewaysScroll(page, "plans");
  });

  it("shows the Review screen within the screen", async () => {
    const { page } = browser;
    const { planId } = await demoPlan(page);
    await page.goto(`${app.url}/plans/${planId}/review`);
    await page.getByRole("heading", { name: /^Review: / }).waitFor();
    await page.getByRole("heading", { name: "Review notes" }).waitFor();
    // The designer's Arrivals chart, read-only, fits the phone too.
    await page.getByRole("img", { name: /^Arrivals, / }).waitFor();
    await expectNoSidewaysScroll(page, "review");
  });

  it("shows Team, Team activity and the inbox within the screen", async () => {
    const { page } = browser;
    await page.goto(`${app.url}/team`);
    await page.getByRole("heading", { name: "Members" }).waitFor();
    await page.getByRole("table").waitFor();
    await expectNoSidewaysScroll(page, "team");
    await page.goto(`${app.url}/activity`);
    await page.getByRole("list", { name: "Team activity" }).waitFor();
    await expectNoSidewaysScroll(page, "activity");
    await page.goto(`${app.url}/inbox`);
    await page.getByRole("heading", { name: "Inbox" }).waitFor();
    await expectNoSidewaysScroll(page, "inbox");
  });

  it("keeps the header to two lines for every role, each link in reach and big enough to tap", async () => {
    const { page } = browser;
    const roles = ["admin", "lead", "reviewer", "trainee"] as const;
    for (const role of roles) {
      if (role !== "admin") await signIn(page, app.url, demoAccounts[role]);
      await page.goto(`${app.url}/sites`);
      await page.getByRole("heading", { name: "Sites" }).waitFor();
      await expectNoSidewaysScroll(page, `header-${role}`);
      const header = page.locator(".app-header");
      const targets = [
        header.getByRole("link", { name: "Spreadsight home" }),
        ...(await header.getByRole("navigation", { name: "Main" }).getByRole("link").all()),
        header.getByRole("link", { name: /^Inbox/ }),
        header.getByRole("button", { name: /^Account: / }),
      ];
      // The admin's five links and the others' fewer all fit beside one another.
      expect(targets.length).toBeGreaterThanOrEqual(5);
      const centres: number[] = [];
      for (const target of targets) {
        const box = await target.boundingBox();
        const name = (await target.getAttribute("aria-label")) ?? (await target.innerText());
        expect(box, `${role}: ${name} is not shown`).not.toBeNull();
        expect(box!.x, `${role}: ${name} starts left of the screen`).toBeGreaterThanOrEqual(0);
        expect(
          box!.x + box!.width,
          `${role}: ${name} ends right of the screen`,
        ).toBeLessThanOrEqual(PHONE.width);
        expect(box!.height, `${role}: ${name} is too small to tap`).toBeGreaterThanOrEqual(TAP);
        centres.push(box!.y + box!.height / 2);
      }
      // Lines of the header: the controls' vertical centres, those within 4 px on one line.
      const lines = centres
        .sort((a, b) => a - b)
        .filter((c, i, all) => i === 0 || c - all[i - 1] > 4).length;
      expect(lines, `${role}: the header runs to ${lines} lines`).toBeLessThanOrEqual(2);

      // The name, role and Sign out sit behind the account button, within the screen.
      await header.getByRole("button", { name: /^Account: / }).click();
      const signOutButton = header.getByRole("button", { name: "Sign out" });
      const box = await signOutButton.boundingBox();
      expect(box, `${role}: Sign out is not shown`).not.toBeNull();
      expect(box!.x).toBeGreaterThanOrEqual(0);
      expect(box!.x + box!.width).toBeLessThanOrEqual(PHONE.width);
      expect(box!.height).toBeGreaterThanOrEqual(TAP);
      await header.getByText(/ · /).waitFor();
      await screenshot(page, `phone-header-menu-${role}`);
      await expectNoSidewaysScroll(page, `header-menu-${role}`);
      await signOutButton.click();
      await page.getByRole("heading", { name: "Sign in" }).waitFor();
    }
    await signIn(page, app.url, demoAccounts.admin);
  });

  it("prints the Review screen without navigation or buttons, on a white page", async () => {
    const { page } = browser;
    await page.setViewportSize({ width: 1000, height: 900 });
    const { planId } = await demoPlan(page);
    await page.goto(`${app.url}/plans/${planId}/review`);
    await page.getByRole("heading", { name: "Review notes" }).waitFor();
    await page.emulateMedia({ media: "print" });
    const printed = await page.evaluate(() => {
      const shown = (el: Element | null) => !!el && getComputedStyle(el).display !== "none";
      return {
        nav: shown(document.querySelector("header")),
        buttons: Array.from(document.querySelectorAll("main button")).filter(shown).length,
        background: getComputedStyle(document.body).backgroundColor,
        heading: shown(document.querySelector("h1")),
        designerLink: Array.from(document.querySelectorAll("main a"))
          .filter((a) => /in the designer/.test(a.textContent ?? ""))
          .some(shown),
      };
    });
    await screenshot(page, "print-review");
    await page.emulateMedia({ media: "screen" });
    await page.setViewportSize(PHONE);
    expect(printed.nav).toBe(false);
    expect(printed.buttons).toBe(0);
    expect(printed.heading).toBe(true);
    expect(printed.designerLink).toBe(false);
  });

  it("prints the Field check screen without navigation or buttons, on a white page", async () => {
    const { page } = browser;
    await page.setViewportSize({ width: 1000, height: 900 });
    const { planId } = await demoPlan(page);
    await page.goto(`${app.url}/plans/${planId}/field`);
    await page.getByRole("heading", { name: "Field check" }).waitFor();
    await page.waitForLoadState("networkidle");
    await page.emulateMedia({ media: "print" });
    const printed = await page.evaluate(() => {
      const shown = (el: Element | null) => !!el && getComputedStyle(el).display !== "none";
      return {
        nav: shown(document.querySelector(".app-header")),
        buttons: Array.from(document.querySelectorAll("main button, main a[download]")).filter(
          shown,
        ).length,
        background: getComputedStyle(document.body).backgroundColor,
        heading: shown(document.querySelector("h1")),
      };
    });
    await screenshot(page, "print-field-check");
    await page.emulateMedia({ media: "screen" });
    await page.setViewportSize(PHONE);
    expect(printed).toEqual({
      nav: false,
      buttons: 0,
      background: "rgb(255, 255, 255)",
      heading: true,
    });
    expect(printed.background).toBe("rgb(255, 255, 255)");
  });
});

/**
 * The built app under the server's Content-Security-Policy (server/http/security.ts): Chromium
 * reports no violation (securitypolicyviolation events and console messages) on the sign-in,
 * reset and invitation pages, the sites list, the designer, the review and the field check.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { demoAccounts, openBrowser, screenshot, signIn, startApp, type E2eApp } from "./harness";

let app: E2eApp;
let browser: Awaited<ReturnType<typeof openBrowser>>;
const violations: string[] = [];

beforeAll(async () => {
  app = await startApp();
  browser = await openBrowser();
  await browser.context.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (event) => {
      console.error(
        `CSP violation: ${event.violatedDirective} blocked ${event.blockedURI || "inline"} (${event.sourceFile}:${event.lineNumber})`,
      );
    });
  });
  browser.page.on("console", (message) => {
    const text = message.text();
    if (/Content Security Policy|CSP violation/i.test(text)) violations.push(text);
  });
  browser.page.on("pageerror", (error) => {
    if (/Content Security Policy/i.test(error.message)) violations.push(error.message);
  });
}, 60_000);

afterAll(async () => {
  await browser?.close();
  await app?.close();
});

/** Lets the page settle (workers started, charts drawn) before violations are read. */
async function settle(page: Page) {
  await page.waitForLoadState("networkidle");
  await page.waitForTimeout(500);
}

describe("Content-Security-Policy in Chromium", () => {
  it("the served pages carry the policy", async () => {
    const response = await fetch(`${app.url}/sign-in`);
    expect(response.headers.get("content-security-policy")).toContain("frame-ancestors 'none'");
  });

  it("no violation on the public pages (sign-in, reset, invitation)", async () => {
    const { page } = browser;
    await page.goto(`${app.url}/sign-in`);
    await page.getByRole("heading", { name: "Sign in" }).waitFor();
    await settle(page);
    await page.goto(`${app.url}/reset/${"a".repeat(32)}`);
    await settle(page);
    await page.goto(`${app.url}/invite/${"a".repeat(32)}`);
    await settle(page);
    expect(violations).toEqual([]);
  }, 60_000);

  it("no violation across the designer, review and field check", async () => {
    const { page } = browser;
    await signIn(page, app.url, demoAccounts.lead);
    await settle(page);
    const planId = await page.evaluate(async () => {
      const sites = (await (await fetch("/api/sites")).json()) as { id: string }[];
      const plans = (await (await fetch(`/api/sites/${sites[0].id}/plans`)).json()) as {
        id: string;
      }[];
      return plans[0].id;
    });
    await page.goto(`${app.url}/plans/${planId}`);
    await page.getByRole("tab", { name: "Spread" }).waitFor();
    await settle(page);
    await screenshot(page, "csp-designer");
    await page.goto(`${app.url}/plans/${planId}/review`);
    await settle(page);
    await page.goto(`${app.url}/plans/${planId}/field`);
    await settle(page);
    await screenshot(page, "csp-field");
    expect(violations).toEqual([]);
  }, 120_000);
});

/**
 * End-to-end harness: starts the real app (built client + API, demo data, fake SMTP) on a free
 * port with a throw-away SQLite file, and drives Debian's Chromium through playwright-core.
 */
import { existsSync, mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { startServer } from "../../server/start";
import { CHROMIUM_ARGS } from "./chromium-args";

export const DEMO_PASSWORD = "spreadsight-demo";
export const demoAccounts = {
  admin: "admin@spreadsight.test",
  lead: "lead@spreadsight.test",
  reviewer: "reviewer@spreadsight.test",
  trainee: "trainee@spreadsight.test",
} as const;

export const screenshotDir = path.resolve("tests/e2e/screenshots");

export interface E2eApp {
  url: string;
  close: () => Promise<void>;
}

export async function startApp(): Promise<E2eApp> {
  // SPREADSIGHT_CLIENT_DIR lets a developer test a private build (vite build --outDir …).
  const clientDir = path.resolve(process.env.SPREADSIGHT_CLIENT_DIR ?? "dist");
  if (!existsSync(path.join(clientDir, "index.html")))
    throw new Error(`${clientDir} is missing: run \`npm run build\` before the e2e tests`);
  const dir = mkdtempSync(path.join(tmpdir(), "spreadsight-e2e-"));
  const server = await startServer({
    port: 0,
    dbPath: path.join(dir, "e2e.sqlite"),
    demo: true,
    serveClient: true,
    clientDir,
  });
  return {
    url: server.url,
    close: async () => {
      await server.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** A fresh browser profile (its own cookies), closed by the returned function. */
export async function openBrowser(): Promise<{
  context: BrowserContext;
  page: Page;
  close: () => Promise<void>;
}> {
  const profile = mkdtempSync(path.join(tmpdir(), "spreadsight-chromium-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.SPREADSIGHT_CHROMIUM ?? "/usr/bin/chromium",
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: { width: 1360, height: 900 },
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export async function signIn(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.getByRole("navigation", { name: "Main" }).waitFor();
}

export async function signOut(page: Page) {
  await page.getByRole("button", { name: "Sign out" }).click();
  await page.getByRole("heading", { name: "Sign in" }).waitFor();
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(screenshotDir, { recursive: true });
  await page.screenshot({ path: path.join(screenshotDir, `${name}.png`), fullPage: true });
}

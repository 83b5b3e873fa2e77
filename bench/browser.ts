/**
 * Browser benchmark of the designer (npm run bench:browser; issue 11).
 *
 * Builds the client into a temporary folder (never dist/), starts the app on a free port with
 * a throw-away database and the demo data, drives Debian's Chromium through playwright-core
 * and prints p50/p90 of:
 *  - edit → redrawn Arrivals chart (from the input event until the first-arrival path has
 *    changed and the next animation frame has run),
 *  - edit → redrawn Resolvability table (same, until the table's text has changed),
 *  - edit → redrawn 2-D section (issue 9): the demo section plan's surface elevation under
 *    one point is typed, until the Section figure of the 2-D modeller (rays, stretches) has
 *    changed; the analysis reruns the eikonal solver on every edit (aim < 300 ms),
 *  - main-thread long tasks (PerformanceObserver "longtask") during each edit: the longest
 *    and the sum,
 *  - first load of the designer: a cold browser context opens a plan's address, the sign-in
 *    page appears (navigation → form ready), then "Sign in" → the designer analysed and the
 *    Arrivals chart drawn; the figure is the sum of the two (typing excluded),
 *  - the design sweep (200 × 200 when the build allows it, else its largest grid): "Run
 *    sweep" → "Done" with the heatmap drawn, including the sweep worker's start; progress
 *    updates per second; and "Cancel" → "Cancelled" shown.
 *
 * Options (after `--`):
 *   --compare <dir>   also measure an existing build (e.g. the starting commit's, built with
 *                     `npx vite build --outDir <dir>` in a git worktree), labelled "before";
 *                     rounds alternate between the builds so both see the same machine load.
 *   --client <dir>    measure this build instead of building the work tree.
 *   --rounds <n>      rounds (default 3); each round takes 10 edits per view, 1 first load
 *                     and 1 sweep per build.
 *   --json <file>     also write the raw samples as JSON.
 * SPREADSIGHT_BENCH_SERVER=<path of a server/start.ts> runs another checkout's server (e.g. a
 * stable worktree while the server is being changed); both builds are served by the same one.
 * Medians on a shared machine move with its load: compare builds within one run, as ratios.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import type { startServer as StartServer } from "../server/start";
import { CHROMIUM_ARGS } from "../tests/e2e/chromium-args";

const LEAD = "lead@spreadsight.test";
const PASSWORD = "spreadsight-demo";
const SITE = "Scarrowfield road cutting";
const PLAN = "Cutting line A — clay lens check";
const EDIT_BOX = "Layer 1 thickness (m)";
/** The demo's 2-D section plan and the box its scenario types into. */
const SECTION_PLAN = "Cutting line C — buried channel (2-D)";
const SECTION_BOX = "surface point 2 elevation (m)";
/** Surface elevations typed in turn under point 2 (m): each differs from the one before. */
const ELEVATIONS = [
  "100.6",
  "99.8",
  "100.4",
  "100.0",
  "100.8",
  "99.6",
  "100.5",
  "99.9",
  "100.7",
  "100.1",
];
/** Layer 1 thicknesses typed in turn (m): each differs from the one before. */
const THICKNESSES = ["2.6", "2.2", "2.8", "2.0", "3.0", "2.4", "2.7", "2.1", "2.9", "2.3"];

// ---------------------------------------------------------------------------------------
// arguments

function argValues(name: string): string[] {
  const out: string[] = [];
  const argv = process.argv.slice(2);
  for (let i = 0; i < argv.length; i++) if (argv[i] === name && argv[i + 1]) out.push(argv[++i]);
  return out;
}
const rounds = Math.max(1, Number(argValues("--rounds")[0] ?? 3));
const jsonOut = argValues("--json")[0];

// ---------------------------------------------------------------------------------------
// statistics

function quantile(values: number[], q: number): number {
  if (values.length === 0) return Number.NaN;
  const s = [...values].sort((a, b) => a - b);
  const pos = (s.length - 1) * q;
  const lo = Math.floor(pos);
  const hi = Math.ceil(pos);
  return s[lo] + (s[hi] - s[lo]) * (pos - lo);
}
const fmt = (v: number, digits = 0) => (Number.isFinite(v) ? v.toFixed(digits) : "—");

// ---------------------------------------------------------------------------------------
// in-page helpers (run inside Chromium)

/** Collect long tasks from the first script on. */
const LONGTASK_INIT = `
  window.__longtasks = [];
  try {
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) window.__longtasks.push([e.startTime, e.duration]);
    }).observe({ type: "longtask", buffered: true });
  } catch {}
`;

interface EditSample {
  ms: number;
  longest: number;
  longSum: number;
}

type View = "arrivals" | "resolvability" | "section";

/**
 * Type `value` into the box labelled `label` in one input event and resolve when `probe()`
 * (a snapshot of what is drawn) differs from its value before the edit, after the next frame.
 */
async function timedEdit(
  page: Page,
  label: string,
  value: string,
  view: View,
): Promise<EditSample> {
  return page.evaluate(
    ({ label, value, view }) =>
      new Promise<EditSample>((resolve, reject) => {
        const probe = () =>
          view === "arrivals"
            ? (document.querySelector('path[data-role="first-arrival"]')?.getAttribute("d") ?? "")
            : view === "section"
              ? (document.querySelector('svg[aria-label^="Section, "]')?.innerHTML ?? "")
              : (document.querySelector('table[aria-label^="Resolvability of"] tbody')
                  ?.textContent ?? "");
        const input = [...document.querySelectorAll("input")].find(
          (i) => i.getAttribute("aria-label") === label,
        );
        if (!input) return reject(new Error(`no box labelled ${label}`));
        const before = probe();
        const w = window as unknown as { __longtasks: Array<[number, number]> };
        let t0 = 0;
        const timer = setTimeout(() => {
          observer.disconnect();
          reject(new Error(`no redraw of ${view} within 10 s`));
        }, 10_000);
        const observer = new MutationObserver(() => {
          if (probe() === before) return;
          observer.disconnect();
          clearTimeout(timer);
          requestAnimationFrame(() => {
            const t1 = performance.now();
            // let the frame's own task finish before reading the long tasks
            setTimeout(() => {
              const tasks = w.__longtasks.filter(([s, d]) => s + d > t0 && s < t1);
              resolve({
                ms: t1 - t0,
                longest: tasks.reduce((m, [, d]) => Math.max(m, d), 0),
                longSum: tasks.reduce((m, [, d]) => m + d, 0),
              });
            }, 60);
          });
        });
        observer.observe(document.body, {
          subtree: true,
          childList: true,
          attributes: true,
          characterData: true,
        });
        const setter = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, "value")!.set!;
        input.focus();
        t0 = performance.now();
        setter.call(input, value);
        input.dispatchEvent(new Event("input", { bubbles: true }));
      }),
    { label, value, view },
  );
}

async function settled(page: Page) {
  await page.getByText("Analysis up to date").waitFor({ timeout: 30_000 });
  await page.waitForTimeout(400);
}

// ---------------------------------------------------------------------------------------
// scenarios

async function signIn(page: Page) {
  await page.getByLabel("E-mail").fill(LEAD);
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
}

/** The address of the demo plan `plan` (signs in on a throw-away context). */
async function planUrl(browser: Browser, base: string, plan = PLAN): Promise<string> {
  const context = await newContext(browser);
  const page = await context.newPage();
  await page.goto(`${base}/sign-in`);
  await signIn(page);
  await page.getByRole("link", { name: SITE }).click();
  await page.getByRole("link", { name: plan }).click();
  await page.getByText("Analysis up to date").waitFor({ timeout: 30_000 });
  const url = page.url().split("?")[0];
  await context.close();
  return url;
}

async function firstLoad(browser: Browser, url: string) {
  const context = await newContext(browser);
  const page = await context.newPage();
  const t0 = Date.now();
  await page.goto(url);
  await page.getByRole("button", { name: "Sign in" }).waitFor();
  const signInMs = Date.now() - t0;
  await page.getByLabel("E-mail").fill(LEAD);
  await page.getByLabel("Password").fill(PASSWORD);
  const t1 = Date.now();
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.getByText("Analysis up to date").waitFor({ timeout: 30_000 });
  await page.locator('path[data-role="first-arrival"]').waitFor();
  await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r(null))));
  const designerMs = Date.now() - t1;
  const longest = await page.evaluate(() =>
    (window as unknown as { __longtasks: Array<[number, number]> }).__longtasks.reduce(
      (m, [, d]) => Math.max(m, d),
      0,
    ),
  );
  await context.close();
  return { signInMs, designerMs, total: signInMs + designerMs, longest };
}

async function edits(page: Page, url: string, view: View) {
  await page.goto(`${url}?panel=${view}`);
  await settled(page);
  const samples: EditSample[] = [];
  const [box, values] = view === "section" ? [SECTION_BOX, ELEVATIONS] : [EDIT_BOX, THICKNESSES];
  if (view === "section") await page.locator('svg[aria-label^="Section, "]').waitFor();
  for (const value of values) {
    samples.push(await timedEdit(page, box, value, view));
    await settled(page);
  }
  return samples;
}

interface SweepSample {
  size: number;
  ms: number;
  updatesPerSecond: number;
  longestGap: number;
  cancelMs: number;
}

async function sweep(page: Page, url: string): Promise<SweepSample> {
  await page.goto(`${url}?view=sweep`);
  await page.getByRole("button", { name: "Run sweep" }).waitFor();
  let size = 200;
  await page.getByLabel("Parameter steps").fill(String(size));
  await page.getByLabel("spacing steps").fill(String(size));
  if (await page.getByRole("button", { name: "Run sweep" }).isDisabled()) {
    size = 120; // the starting code caps a sweep at 120 steps
    await page.getByLabel("Parameter steps").fill(String(size));
    await page.getByLabel("spacing steps").fill(String(size));
  }
  // Cancel: start, wait for the first progress, cancel, time until "Cancelled" shows.
  const cancelMs = await page.evaluate(
    () =>
      new Promise<number>((resolve, reject) => {
        const run = [...document.querySelectorAll("button")].find(
          (b) => b.textContent === "Run sweep",
        )!;
        const timer = setTimeout(() => reject(new Error("sweep cancel timed out")), 30_000);
        run.click();
        const started = new MutationObserver(() => {
          const bar = document.querySelector('[role="progressbar"]');
          const cancel = [...document.querySelectorAll("button")].find(
            (b) => b.textContent === "Cancel",
          );
          if (!bar || !cancel || Number(bar.getAttribute("aria-valuenow")) < 1) return;
          started.disconnect();
          const t0 = performance.now();
          const done = new MutationObserver(() => {
            if (!document.body.textContent?.includes("Cancelled")) return;
            done.disconnect();
            clearTimeout(timer);
            requestAnimationFrame(() => resolve(performance.now() - t0));
          });
          done.observe(document.body, { subtree: true, childList: true, characterData: true });
          cancel.click();
        });
        started.observe(document.body, { subtree: true, childList: true, attributes: true });
      }),
  );
  await page.waitForTimeout(300);
  // Full sweep (the cancel ended the sweep worker, so this includes a fresh worker's start).
  const run = await page.evaluate(
    () =>
      new Promise<{ ms: number; updates: number[] }>((resolve, reject) => {
        const button = [...document.querySelectorAll("button")].find(
          (b) => b.textContent === "Run sweep",
        )!;
        const updates: number[] = [];
        let last = "";
        const timer = setTimeout(() => reject(new Error("sweep timed out")), 120_000);
        const observer = new MutationObserver(() => {
          const bar = document.querySelector('[role="progressbar"]');
          const now = bar?.getAttribute("aria-valuenow") ?? "";
          if (now !== last) {
            last = now;
            updates.push(performance.now());
          }
          const status = [...document.querySelectorAll("p")].some((p) => p.textContent === "Done");
          if (!status || !document.querySelector('[aria-label="Design sweep heatmap"]')) return;
          observer.disconnect();
          clearTimeout(timer);
          requestAnimationFrame(() => {
            const t1 = performance.now();
            resolve({ ms: t1 - t0, updates: updates.map((u) => u - t0) });
          });
        });
        observer.observe(document.body, {
          subtree: true,
          childList: true,
          attributes: true,
          characterData: true,
        });
        const t0 = performance.now();
        button.click();
      }),
  );
  const marks = [0, ...run.updates, run.ms];
  let longestGap = 0;
  for (let i = 1; i < marks.length; i++) longestGap = Math.max(longestGap, marks[i] - marks[i - 1]);
  return {
    size,
    ms: run.ms,
    updatesPerSecond: run.updates.length / (run.ms / 1000),
    longestGap,
    cancelMs,
  };
}

// ---------------------------------------------------------------------------------------
// main

interface Target {
  label: string;
  clientDir: string;
  url?: string;
  planUrl?: string;
  sectionUrl?: string;
  close?: () => Promise<void>;
  dbDir?: string;
  samples: {
    arrivals: EditSample[];
    resolvability: EditSample[];
    section: EditSample[];
    load: Array<{ signInMs: number; designerMs: number; total: number; longest: number }>;
    sweep: SweepSample[];
  };
}

function build(): string {
  const outDir = mkdtempSync(path.join(tmpdir(), "spreadsight-bench-client-"));
  console.log(`building the client into ${outDir} …`);
  const r = spawnSync("npx", ["vite", "build", "--outDir", outDir, "--logLevel", "warn"], {
    stdio: "inherit",
  });
  if (r.status !== 0) throw new Error("vite build failed");
  return outDir;
}

/** A context whose pages know tsx's `__name` helper (esbuild keepNames) and log long tasks. */
async function newContext(browser: Browser): Promise<BrowserContext> {
  const context = await browser.newContext({ viewport: { width: 1360, height: 900 } });
  await context.addInitScript("window.__name = (f) => f;" + LONGTASK_INIT);
  return context;
}

async function main() {
  process.env.LOG_LEVEL ??= "warn";
  const serverModule = process.env.SPREADSIGHT_BENCH_SERVER
    ? path.resolve(process.env.SPREADSIGHT_BENCH_SERVER)
    : "../server/start";
  const { startServer } = (await import(serverModule)) as { startServer: typeof StartServer };
  const own = argValues("--client")[0];
  const builtHere = own ? null : build();
  const targets: Target[] = [];
  const emptySamples = () => ({
    arrivals: [],
    resolvability: [],
    section: [],
    load: [],
    sweep: [],
  });
  for (const dir of argValues("--compare"))
    targets.push({ label: "before", clientDir: path.resolve(dir), samples: emptySamples() });
  targets.push({
    label: targets.length ? "after" : "this build",
    clientDir: path.resolve(own ?? (builtHere as string)),
    samples: emptySamples(),
  });

  for (const t of targets) {
    t.dbDir = mkdtempSync(path.join(tmpdir(), "spreadsight-bench-db-"));
    const server = await startServer({
      port: 0,
      dbPath: path.join(t.dbDir, "bench.sqlite"),
      demo: true,
      serveClient: true,
      clientDir: t.clientDir,
      // every round signs in twice: keep the sign-in limits out of the way
      rateLimits: {
        signInPerPair: { limit: 10_000, windowMs: 60_000 },
        signInPerIp: { limit: 10_000, windowMs: 60_000 },
      },
    });
    t.url = server.url;
    t.close = () => server.close();
  }
  const browser = await chromium.launch({
    executablePath: process.env.SPREADSIGHT_CHROMIUM ?? "/usr/bin/chromium",
    headless: true,
    args: CHROMIUM_ARGS,
  });
  try {
    for (const t of targets) {
      t.planUrl = await planUrl(browser, t.url as string);
      t.sectionUrl = await planUrl(browser, t.url as string, SECTION_PLAN);
    }
    for (let round = 0; round < rounds; round++) {
      const order = round % 2 === 0 ? targets : [...targets].reverse();
      for (const t of order) {
        process.stdout.write(`round ${round + 1}/${rounds}: ${t.label} … `);
        t.samples.load.push(await firstLoad(browser, t.planUrl as string));
        const context = await newContext(browser);
        const page = await context.newPage();
        await page.goto(`${t.url}/sign-in`);
        await signIn(page);
        await page.getByRole("navigation", { name: "Main" }).waitFor();
        t.samples.arrivals.push(...(await edits(page, t.planUrl as string, "arrivals")));
        // leave without the unsaved-changes prompt
        await page.close({ runBeforeUnload: false });
        const page2 = await context.newPage();
        t.samples.resolvability.push(...(await edits(page2, t.planUrl as string, "resolvability")));
        await page2.close({ runBeforeUnload: false });
        const pageS = await context.newPage();
        t.samples.section.push(...(await edits(pageS, t.sectionUrl as string, "section")));
        await pageS.close({ runBeforeUnload: false });
        const page3 = await context.newPage();
        t.samples.sweep.push(await sweep(page3, t.planUrl as string));
        await context.close();
        console.log("done");
      }
    }
  } finally {
    await browser.close();
    for (const t of targets) {
      await t.close?.();
      if (t.dbDir) rmSync(t.dbDir, { recursive: true, force: true });
    }
    if (builtHere) rmSync(builtHere, { recursive: true, force: true });
  }

  // report
  const rows: string[][] = [];
  const line = (name: string, pick: (t: Target) => number[], digits = 0) => {
    const cells = targets.map((t) => {
      const v = pick(t);
      return `${fmt(quantile(v, 0.5), digits)} / ${fmt(quantile(v, 0.9), digits)}`;
    });
    const ratio =
      targets.length === 2
        ? (quantile(pick(targets[0]), 0.5) / quantile(pick(targets[1]), 0.5)).toFixed(1) + "×"
        : "";
    rows.push([name, ...cells, ratio]);
  };
  line("edit → Arrivals redrawn (ms)", (t) => t.samples.arrivals.map((s) => s.ms));
  line("edit → Resolvability redrawn (ms)", (t) => t.samples.resolvability.map((s) => s.ms));
  line("edit → 2-D section redrawn (ms)", (t) => t.samples.section.map((s) => s.ms));
  line("longest main-thread task per edit (ms)", (t) =>
    [...t.samples.arrivals, ...t.samples.resolvability].map((s) => s.longest),
  );
  line("longest main-thread task per section edit (ms)", (t) =>
    t.samples.section.map((s) => s.longest),
  );
  line("long-task time per edit (ms)", (t) =>
    [...t.samples.arrivals, ...t.samples.resolvability].map((s) => s.longSum),
  );
  line("first load: sign-in page ready (ms)", (t) => t.samples.load.map((s) => s.signInMs));
  line("first load: sign in → designer drawn (ms)", (t) => t.samples.load.map((s) => s.designerMs));
  line("first load of the designer, total (ms)", (t) => t.samples.load.map((s) => s.total));
  line("first load: longest main-thread task (ms)", (t) => t.samples.load.map((s) => s.longest));
  line("design sweep, run → done (ms)", (t) => t.samples.sweep.map((s) => s.ms));
  line(
    "sweep progress updates per second",
    (t) => t.samples.sweep.map((s) => s.updatesPerSecond),
    1,
  );
  line("sweep longest wait between updates (ms)", (t) => t.samples.sweep.map((s) => s.longestGap));
  line("sweep cancel → cancelled shown (ms)", (t) => t.samples.sweep.map((s) => s.cancelMs));
  const header = [
    "p50 / p90",
    ...targets.map((t) => `${t.label} (${t.samples.sweep[0]?.size ?? "?"}² sweep)`),
    ...(targets.length === 2 ? ["p50 ratio"] : []),
  ];
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]?.length ?? 0)));
  const print = (r: string[]) =>
    console.log(r.map((c, i) => (c ?? "").padEnd(widths[i])).join("  "));
  console.log(`\n${rounds} rounds, ${THICKNESSES.length} edits per view per round`);
  print(header);
  for (const r of rows) print(r);
  if (jsonOut)
    writeFileSync(
      jsonOut,
      JSON.stringify(
        targets.map((t) => ({ label: t.label, samples: t.samples })),
        null,
        1,
      ),
    );
}

main().then(
  () => process.exit(0),
  (error: unknown) => {
    console.error(error);
    process.exit(1);
  },
);

/**
 * Server benchmarks (issues 11 and 12), printed by `npm run bench` (or `npm run bench:server`):
 *
 *  A. reads while exporting: GET of a plan at 200 requests/s (autocannon) for 30 s while 20
 *     clients export the plan's PDF report back to back. Aim: p99 < 50 ms, no errors.
 *  B. exports: 500 PDF reports (4 at a time); the server's RSS after the first 50 and at the
 *     end. Aim: steady (growth under 50 MB).
 *  C. uploads: three 2 MB bad CSVs and a 20 MB SEG-2 record uploaded again and again while
 *     /api/health and GET of a plan are read at 50 requests/s each. Aim: both p99 < 100 ms,
 *     RSS growth under 100 MB.
 *
 * The compiled server (build/server, built here first) runs in its own process in demo mode on
 * a temporary database, as `npm start` runs it. Options:
 *   --quick            10 s phases and 100 exports (for a quick look; the aims are for the full run)
 *   --before <dir>     also run every phase against another checkout (e.g. `git archive` of an
 *                      older commit with node_modules linked), started with tsx, and print ratios
 *   BENCH_QUICK=1      same as --quick
 * Latencies are medians (p50) and p99 in ms. On a shared machine read them as ratios.
 */
import autocannon from "autocannon";
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { syntheticShotRecord } from "../workers/field/__fixtures__/shot-record";

const root = fileURLToPath(new URL("..", import.meta.url));
const args = process.argv.slice(2);
const quick = args.includes("--quick") || process.env.BENCH_QUICK === "1";
const beforeAt = args.indexOf("--before");
const beforeDir = beforeAt >= 0 ? args[beforeAt + 1] : null;
const PHASE_S = quick ? 10 : 30;
const EXPORTS = quick ? 100 : 500;

interface Target {
  label: string;
  url: string;
  child: ChildProcess;
  dir: string;
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as { port: number }).port;
      s.close(() => resolve(port));
    });
    s.on("error", reject);
  });
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function start(label: string, cwd: string, compiled: boolean): Promise<Target> {
  const port = await freePort();
  const dir = mkdtempSync(join(tmpdir(), "spreadsight-bench-"));
  const command = compiled
    ? ["build/server/main.js", "--demo"]
    : ["--import", "tsx", "server/main.ts", "--demo"];
  const child = spawn(process.execPath, command, {
    cwd,
    env: {
      ...process.env,
      PORT: String(port),
      SPREADSIGHT_DB: join(dir, "bench.sqlite"),
      SPREADSIGHT_CLIENT_DIR: join(dir, "no-client"),
      LOG_LEVEL: "error",
      NODE_ENV: "production",
    },
    stdio: ["ignore", "ignore", "inherit"],
  });
  const url = `http://127.0.0.1:${port}`;
  for (let i = 0; i < 600; i++) {
    try {
      if ((await fetch(`${url}/api/health`)).ok) return { label, url, child, dir };
    } catch {
      // not listening yet
    }
    await sleep(100);
  }
  child.kill();
  throw new Error(`${label}: the server did not start`);
}

async function stop(target: Target): Promise<void> {
  const exited = new Promise((r) => target.child.once("exit", r));
  target.child.kill("SIGTERM");
  await Promise.race([exited, sleep(5000)]);
  if (target.child.exitCode === null) target.child.kill("SIGKILL");
  rmSync(target.dir, { recursive: true, force: true });
}

/** Resident set size of the server process (threads included), MB. */
function rssMb(target: Target): number {
  const status = readFileSync(`/proc/${target.child.pid}/status`, "utf8");
  const kb = Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0);
  return kb / 1024;
}

interface Session {
  cookie: string;
  planId: string;
  uploadPlanId: string;
}

async function session(target: Target): Promise<Session> {
  const signIn = await fetch(`${target.url}/api/auth/sign-in`, {
    method: "POST",
    headers: { "Content-Type": "application/json", Origin: target.url },
    body: JSON.stringify({ email: "lead@spreadsight.test", password: "spreadsight-demo" }),
  });
  if (!signIn.ok) throw new Error(`sign-in failed: ${signIn.status}`);
  const cookie = (signIn.headers.get("set-cookie") ?? "").split(";")[0];
  const get = async (path: string) => {
    const r = await fetch(`${target.url}${path}`, { headers: { cookie } });
    if (!r.ok) throw new Error(`${path}: ${r.status}`);
    return r.json() as Promise<unknown>;
  };
  const sites = (await get("/api/sites")) as { id: string }[];
  const plans = (await get(`/api/sites/${sites[0].id}/plans`)) as { id: string }[];
  const document = JSON.parse(
    readFileSync(join(root, "docs/examples/two-layer-simple.json"), "utf8"),
  );
  const created = await fetch(`${target.url}/api/sites/${sites[0].id}/plans`, {
    method: "POST",
    headers: { "Content-Type": "application/json", Origin: target.url, cookie },
    body: JSON.stringify({ name: "Bench uploads", document }),
  });
  if (!created.ok) throw new Error(`create plan: ${created.status}`);
  const upload = (await created.json()) as { id: string };
  return { cookie, planId: plans[0].id, uploadPlanId: upload.id };
}

interface Load {
  p50: number;
  p99: number;
  /** Answered requests. */
  requests: number;
  /** Requests sent (an answer that never came within the phase counts here, not above). */
  sent: number;
  errors: number;
}

function cannon(url: string, cookie: string, rate: number, seconds: number): Promise<Load> {
  return new Promise((resolve, reject) => {
    autocannon(
      {
        url,
        headers: { cookie },
        connections: Math.max(4, Math.ceil(rate / 20)),
        overallRate: rate,
        duration: seconds,
        timeout: 30,
      },
      (error, result) => {
        if (error) {
          reject(error);
          return;
        }
        resolve({
          p50: result.latency.p50,
          p99: result.latency.p99,
          requests: result.requests.total,
          sent: result.requests.sent,
          errors: result.errors + result.timeouts + result.non2xx,
        });
      },
    );
  });
}

function percentile(values: number[], p: number): number {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

async function exportOnce(target: Target, s: Session): Promise<{ ms: number; ok: boolean }> {
  const t = performance.now();
  try {
    const r = await fetch(`${target.url}/api/plans/${s.planId}/report.pdf`, {
      headers: { cookie: s.cookie },
    });
    await r.arrayBuffer();
    return { ms: performance.now() - t, ok: r.ok };
  } catch {
    return { ms: performance.now() - t, ok: false };
  }
}

async function phaseA(target: Target, s: Session) {
  let running = true;
  const times: number[] = [];
  let failed = 0;
  await exportOnce(target, s); // start the worker pool
  const exporters = Array.from({ length: 20 }, async () => {
    while (running) {
      const { ms, ok } = await exportOnce(target, s);
      times.push(ms);
      if (!ok) failed++;
    }
  });
  await sleep(1000);
  const reads = await cannon(`${target.url}/api/plans/${s.planId}`, s.cookie, 200, PHASE_S);
  running = false;
  await Promise.all(exporters);
  return {
    reads,
    exports: {
      count: times.length,
      failed,
      p50: percentile(times, 50),
      p99: percentile(times, 99),
    },
  };
}

async function phaseB(target: Target, s: Session) {
  let done = 0;
  let failed = 0;
  let rssEarly = 0;
  const warm = Math.round(EXPORTS / 10);
  const worker = async () => {
    while (done < EXPORTS) {
      done++;
      const { ok } = await exportOnce(target, s);
      if (!ok) failed++;
      if (done === warm) rssEarly = rssMb(target);
    }
  };
  await Promise.all(Array.from({ length: 4 }, worker));
  await sleep(500);
  return { exports: done, failed, warm, rssEarly, rssEnd: rssMb(target) };
}

function badCsvs(): { name: string; bytes: Buffer }[] {
  const size = 2 * 1024 * 1024 - 4096;
  const oneValue = "depth_from,depth_to,material\n" + "5\n".repeat((size - 40) / 2);
  const row = "0.5,abc,no such material at all here,-9999,\n";
  const badRows =
    "depth_from,depth_to,material,velocity\n" + row.repeat(Math.floor((size - 40) / row.length));
  const quote = 'depth_from,depth_to,material\n"' + "1,2,sand\n".repeat(Math.floor(size / 9) - 10);
  return [
    { name: "one-value-lines.csv", bytes: Buffer.from(oneValue) },
    { name: "bad-rows.csv", bytes: Buffer.from(badRows) },
    { name: "open-quote.csv", bytes: Buffer.from(quote) },
  ];
}

function bigSeg2(): Buffer {
  const document = JSON.parse(
    readFileSync(join(root, "docs/examples/two-layer-simple.json"), "utf8"),
  );
  const channels = document.spread.channels as number;
  const samples = Math.floor((19.5 * 1024 * 1024) / (channels * 4));
  const record = syntheticShotRecord({
    model: document.models[0],
    spread: document.spread,
    samples,
    sampleInterval: 0.000125,
  });
  return Buffer.from(record.bytes);
}

async function upload(target: Target, s: Session, kind: string, name: string, bytes: Buffer) {
  const form = new FormData();
  form.set("kind", kind);
  form.set("file", new Blob([new Uint8Array(bytes)], { type: "application/octet-stream" }), name);
  const r = await fetch(`${target.url}/api/plans/${s.uploadPlanId}/attachments`, {
    method: "POST",
    headers: { cookie: s.cookie, Origin: target.url },
    body: form,
  });
  await r.arrayBuffer();
  return r.status;
}

async function phaseC(
  target: Target,
  s: Session,
  csvs: { name: string; bytes: Buffer }[],
  seg2: Buffer,
) {
  const rssStart = rssMb(target);
  let rssPeak = rssStart;
  let running = true;
  const sampler = setInterval(() => {
    rssPeak = Math.max(rssPeak, rssMb(target));
  }, 200);
  const statuses: number[] = [];
  const uploads = (async () => {
    while (running) {
      const round = [
        ...csvs.map((c) => upload(target, s, "borehole", c.name, c.bytes)),
        upload(target, s, "seg2", "shot.sg2", seg2),
      ];
      statuses.push(...(await Promise.all(round)));
    }
  })();
  await sleep(300);
  const [health, plan] = await Promise.all([
    cannon(`${target.url}/api/health`, s.cookie, 50, PHASE_S),
    cannon(`${target.url}/api/plans/${s.planId}`, s.cookie, 50, PHASE_S),
  ]);
  running = false;
  await uploads;
  clearInterval(sampler);
  const counts: Record<string, number> = {};
  for (const st of statuses) counts[st] = (counts[st] ?? 0) + 1;
  return { health, plan, uploads: statuses.length, statuses: counts, rssStart, rssPeak };
}

async function runAll(target: Target) {
  const s = await session(target);
  const csvs = badCsvs();
  const seg2 = bigSeg2();
  console.log(`\n[${target.label}] A. GET plan at 200/s for ${PHASE_S} s while 20 clients export…`);
  const a = await phaseA(target, s);
  console.log(`[${target.label}] B. ${EXPORTS} exports…`);
  const b = await phaseB(target, s);
  console.log(`[${target.label}] C. uploads while reading for ${PHASE_S} s…`);
  const c = await phaseC(target, s, csvs, seg2);
  return { a, b, c };
}

type Results = Awaited<ReturnType<typeof runAll>>;

const f = (n: number) => (Number.isFinite(n) ? n.toFixed(n < 10 ? 1 : 0) : "–");

function report(label: string, r: Results) {
  console.log(`\n${label}`);
  console.table([
    {
      case: "A. GET plan @200/s during exports",
      p50_ms: f(r.a.reads.p50),
      p99_ms: f(r.a.reads.p99),
      n: `${r.a.reads.requests}/${r.a.reads.sent}`,
      errors: r.a.reads.errors,
      aim: `p99 < 50, 0 errors: ${r.a.reads.p99 < 50 && r.a.reads.errors === 0 && r.a.reads.requests >= r.a.reads.sent * 0.99 ? "met" : "NOT met"}`,
    },
    {
      case: "A. report.pdf (20 clients)",
      p50_ms: f(r.a.exports.p50),
      p99_ms: f(r.a.exports.p99),
      n: r.a.exports.count,
      errors: r.a.exports.failed,
      aim: "",
    },
    {
      case: "C. /api/health @50/s during uploads",
      p50_ms: f(r.c.health.p50),
      p99_ms: f(r.c.health.p99),
      n: `${r.c.health.requests}/${r.c.health.sent}`,
      errors: r.c.health.errors,
      aim: `p99 < 100: ${r.c.health.p99 < 100 && r.c.health.requests >= r.c.health.sent * 0.99 ? "met" : "NOT met"}`,
    },
    {
      case: "C. GET plan @50/s during uploads",
      p50_ms: f(r.c.plan.p50),
      p99_ms: f(r.c.plan.p99),
      n: `${r.c.plan.requests}/${r.c.plan.sent}`,
      errors: r.c.plan.errors,
      aim: `p99 < 100: ${r.c.plan.p99 < 100 && r.c.plan.requests >= r.c.plan.sent * 0.99 ? "met" : "NOT met"}`,
    },
  ]);
  const growthB = r.b.rssEnd - r.b.rssEarly;
  const growthC = r.c.rssPeak - r.c.rssStart;
  console.log(
    `B. RSS after ${r.b.warm} exports ${f(r.b.rssEarly)} MB, after ${r.b.exports} ${f(r.b.rssEnd)} MB ` +
      `(growth ${f(growthB)} MB; steady < 50 MB: ${growthB < 50 ? "met" : "NOT met"}; failed ${r.b.failed})`,
  );
  console.log(
    `C. ${r.c.uploads} uploads ${JSON.stringify(r.c.statuses)}; RSS ${f(r.c.rssStart)} → peak ${f(r.c.rssPeak)} MB ` +
      `(growth ${f(growthC)} MB; < 100 MB: ${growthC < 100 ? "met" : "NOT met"})`,
  );
}

console.log(`Node ${process.version}; ${quick ? "quick" : "full"} run`);
const build = spawnSync(process.execPath, ["scripts/build-server.mjs"], {
  cwd: root,
  stdio: "inherit",
});
if (build.status !== 0) throw new Error("server build failed");

let before: Results | null = null;
if (beforeDir) {
  const old = await start("before", beforeDir, false);
  try {
    before = await runAll(old);
  } finally {
    await stop(old);
  }
}
const now = await start("after", root, true);
let after: Results;
try {
  after = await runAll(now);
} finally {
  await stop(now);
}
if (before) report(`before (${beforeDir}, tsx)`, before);
report("after (build/server, compiled)", after);
if (before) {
  const ratio = (b: number, a: number) => (a > 0 && b > 0 ? `${(b / a).toFixed(1)}×` : "–");
  const answered = (l: Load) => `${l.requests}/${l.sent}`;
  console.log("\nbefore / after (a ratio above 1 means after is faster; answered/sent):");
  console.table([
    {
      case: "A. GET plan p50 / p99",
      p50: ratio(before.a.reads.p50, after.a.reads.p50),
      p99: ratio(before.a.reads.p99, after.a.reads.p99),
      before: answered(before.a.reads),
      after: answered(after.a.reads),
    },
    {
      case: "A. report p50 / p99",
      p50: ratio(before.a.exports.p50, after.a.exports.p50),
      p99: ratio(before.a.exports.p99, after.a.exports.p99),
      before: before.a.exports.count,
      after: after.a.exports.count,
    },
    {
      case: "C. health p50 / p99",
      p50: ratio(before.c.health.p50, after.c.health.p50),
      p99: ratio(before.c.health.p99, after.c.health.p99),
      before: answered(before.c.health),
      after: answered(after.c.health),
    },
    {
      case: "C. GET plan p50 / p99",
      p50: ratio(before.c.plan.p50, after.c.plan.p50),
      p99: ratio(before.c.plan.p99, after.c.plan.p99),
      before: answered(before.c.plan),
      after: answered(after.c.plan),
    },
  ]);
}

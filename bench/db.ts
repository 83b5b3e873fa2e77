/**
 * Database benchmark (issue 13), printed at the end of bench/run.ts (`npm run bench`), or alone
 * with `node --import tsx bench/db.ts`: plan GET and plan save latencies, p50 and p99, on
 * SQLite and on PostgreSQL side by side, through the whole HTTP stack.
 *
 * Each database gets a fresh server (startServer, in this process) with the demo data: SQLite
 * in a temporary file (WAL), PostgreSQL in a throwaway cluster (server/testing/pg-cluster.ts,
 * fsync off as in the tests, so it is an upper bound for a real server's speed; a server on
 * another machine adds its network round trips). The lead GETs one plan `GETS` times one after
 * another, then saves it `SAVES` times (each save a new revision with its analysis summary).
 * A save is measured end to end, including the engine's summary of the document.
 * On this shared 2-core machine read the figures as ratios between the two columns.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { performance } from "node:perf_hooks";
import { DEMO_PASSWORD } from "../server/data/seed-demo";
import { startServer, type StartOptions } from "../server/start";
import { findPgBin, startPgCluster } from "../server/testing/pg-cluster";
import { thinLayerDocument } from "../server/testing/plans";
import { createLogger } from "../server/logger";

const GETS = Number(process.env.BENCH_DB_GETS) || 400;
const SAVES = Number(process.env.BENCH_DB_SAVES) || 150;

interface Figures {
  get: { p50: number; p99: number };
  save: { p50: number; p99: number };
}

function percentile(samples: number[], p: number): number {
  const sorted = [...samples].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

async function measure(database: Pick<StartOptions, "dbPath" | "databaseUrl">): Promise<Figures> {
  const server = await startServer({
    port: 0,
    ...database,
    demo: true,
    serveClient: false,
    logger: createLogger("silent"),
  });
  try {
    const headers = { "Content-Type": "application/json", Origin: server.url };
    const signIn = await fetch(`${server.url}/api/auth/sign-in`, {
      method: "POST",
      headers,
      body: JSON.stringify({ email: "lead@spreadsight.test", password: DEMO_PASSWORD }),
    });
    if (signIn.status !== 200) throw new Error(`sign-in failed: ${signIn.status}`);
    const cookie = (signIn.headers.get("set-cookie") ?? "").split(";")[0];
    const auth = { ...headers, Cookie: cookie };
    const sites = (await (await fetch(`${server.url}/api/sites`, { headers: auth })).json()) as {
      id: string;
    }[];
    const created = await fetch(`${server.url}/api/sites/${sites[0].id}/plans`, {
      method: "POST",
      headers: auth,
      body: JSON.stringify({ name: "Benchmark line", document: thinLayerDocument() }),
    });
    const plan = (await created.json()) as { id: string; revision: number };
    const url = `${server.url}/api/plans/${plan.id}`;

    const gets: number[] = [];
    for (let i = 0; i < GETS + 20; i++) {
      const t0 = performance.now();
      const r = await fetch(url, { headers: auth });
      await r.arrayBuffer();
      if (r.status !== 200) throw new Error(`GET failed: ${r.status}`);
      if (i >= 20) gets.push(performance.now() - t0); // the first 20 warm up
    }
    const saves: number[] = [];
    let revision = plan.revision;
    for (let i = 0; i < SAVES + 5; i++) {
      const body = JSON.stringify({
        baseRevision: revision,
        document: thinLayerDocument(1 + (i % 10) / 10),
      });
      const t0 = performance.now();
      const r = await fetch(url, { method: "PUT", headers: auth, body });
      const saved = (await r.json()) as { revision: number };
      if (r.status !== 200) throw new Error(`save failed: ${r.status}`);
      if (i >= 5) saves.push(performance.now() - t0);
      revision = saved.revision;
    }
    return {
      get: { p50: percentile(gets, 50), p99: percentile(gets, 99) },
      save: { p50: percentile(saves, 50), p99: percentile(saves, 99) },
    };
  } finally {
    await server.close();
  }
}

export async function runDbBench(): Promise<void> {
  console.log(`\nDatabase: plan GET (${GETS}×) and save (${SAVES}×), sequential, ms`);
  const dir = mkdtempSync(join(tmpdir(), "spreadsight-bench-db-"));
  let sqlite: Figures;
  try {
    sqlite = await measure({ dbPath: join(dir, "bench.sqlite") });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  let postgres: Figures | null = null;
  if (process.env.BENCH_DATABASE_URL) {
    postgres = await measure({ databaseUrl: process.env.BENCH_DATABASE_URL });
  } else if (findPgBin()) {
    const cluster = await startPgCluster();
    try {
      postgres = await measure({ databaseUrl: cluster.url });
    } finally {
      await cluster.stop();
    }
  }
  const f = (ms: number | undefined) => (ms === undefined ? "—" : ms.toFixed(2));
  const row = (name: string, pick: (x: Figures) => { p50: number; p99: number }) => ({
    case: name,
    "SQLite p50": f(pick(sqlite).p50),
    "SQLite p99": f(pick(sqlite).p99),
    "PostgreSQL p50": f(postgres ? pick(postgres).p50 : undefined),
    "PostgreSQL p99": f(postgres ? pick(postgres).p99 : undefined),
    "p50 ratio PG/SQLite": postgres ? (pick(postgres).p50 / pick(sqlite).p50).toFixed(2) : "—",
  });
  console.table([
    row("GET /api/plans/:id", (x) => x.get),
    row("PUT /api/plans/:id (save)", (x) => x.save),
  ]);
  if (!postgres) {
    console.log(
      "PostgreSQL column empty: initdb not found (apt-get install postgresql) and no BENCH_DATABASE_URL",
    );
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await runDbBench();
  process.exit(0);
}

/**
 * db:copy round trip (project `server-pg`): a SQLite team database with the demo data, an
 * upload and a session is copied into an empty PostgreSQL database; every count
 * matches, sessions stay behind, a second copy into the now-full target is refused, and every
 * plan's export (and the uploaded file) reads the same from a server on either database.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { client, createTestContext, signIn } from "../testing/harness";
import { createTestDatabase, type TestDatabase } from "../testing/database";
import { startServer, type RunningServer } from "../start";
import { copyDatabase, CopyRefused, type TableCount } from "./copy";
import { openDatabase } from "./data-source";
import { Plan } from "./entities/plan";
import { databaseFileStore, useFileStore } from "./file-store";
import { DEMO_PASSWORD, seedDemo } from "./seed-demo";

let dir: string;
let sqlitePath: string;
let target: TestDatabase;
let counts: TableCount[];
let attachmentId: string;
const uploaded = "shot_m,geophone_m,time_ms\n-1,0,1.8\n-1,2,5.5\n-1,4,9.1\n";

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "spreadsight-copy-"));
  sqlitePath = join(dir, "team.sqlite");
  const source = await createTestContext({
    database: { kind: "sqlite", options: { path: sqlitePath }, drop: async () => {} },
  });
  try {
    useFileStore(source.dataSource, databaseFileStore); // bytes in the SQLite row
    await seedDemo(source.dataSource);
    const lead = client(source.app, await signIn(source.app, "lead@spreadsight.test", DEMO_PASSWORD));
    const plan = await source.dataSource
      .getRepository(Plan)
      .findOneByOrFail({ sandbox: false, status: "draft" });
    const upload = await lead
      .post(`/api/plans/${plan.id}/attachments`)
      .field("kind", "picks")
      .attach("file", Buffer.from(uploaded), "line-1-picks.csv");
    expect(upload.status).toBe(201);
    attachmentId = upload.body.attachment.id;
  } finally {
    await source.close();
  }
  target = await createTestDatabase({ empty: true });
  counts = await copyDatabase({ path: sqlitePath }, target.options);
});
afterAll(async () => {
  await target?.drop();
  rmSync(dir, { recursive: true, force: true });
});

async function fetchText(server: RunningServer, path: string, cookie: string) {
  const response = await fetch(`${server.url}${path}`, { headers: { Cookie: cookie } });
  return { status: response.status, text: await response.text() };
}

async function adminCookie(server: RunningServer): Promise<string> {
  const response = await fetch(`${server.url}/api/auth/sign-in`, {
    method: "POST",
    headers: { "Content-Type": "application/json", Origin: server.url },
    body: JSON.stringify({ email: "admin@spreadsight.test", password: DEMO_PASSWORD }),
  });
  expect(response.status).toBe(200);
  return (response.headers.get("set-cookie") ?? "").split(";")[0];
}

describe("db:copy from SQLite to PostgreSQL", () => {
  it("copies every table and verifies the counts (sessions excepted)", async () => {
    const byTable = Object.fromEntries(counts.map((c) => [c.table, c]));
    for (const table of [
      "teams",
      "users",
      "memberships",
      "sites",
      "plans",
      "plan_revisions",
      "comments",
      "notifications",
      "audit_events",
      "attachments",
    ]) {
      expect(byTable[table]?.source, table).toBeGreaterThan(0);
      expect(byTable[table].target, table).toBe(byTable[table].source);
    }
    expect(byTable.sessions).toBeUndefined();
    const ds = await openDatabase(target.options);
    try {
      const [row] = (await ds.query(`SELECT COUNT(*) AS n FROM "sessions"`)) as { n: number }[];
      expect(row.n).toBe(0);
    } finally {
      await ds.destroy();
    }
  });

  it("refuses a target that is not empty, and writes nothing", async () => {
    await expect(copyDatabase({ path: sqlitePath }, target.options)).rejects.toBeInstanceOf(
      CopyRefused,
    );
    const ds = await openDatabase(target.options);
    try {
      const [row] = (await ds.query(`SELECT COUNT(*) AS n FROM "teams"`)) as { n: number }[];
      expect(row.n).toBe(counts.find((c) => c.table === "teams")!.source);
    } finally {
      await ds.destroy();
    }
  });

  it("every plan exports the same from both databases, and the upload reads the same", async () => {
    const before = await startServer({ port: 0, dbPath: sqlitePath, serveClient: false });
    const after = await startServer({
      port: 0,
      databaseUrl: target.options.url,
      serveClient: false,
    });
    try {
      const [cookieBefore, cookieAfter] = [await adminCookie(before), await adminCookie(after)];
      const plans = await before.dataSource.getRepository(Plan).find();
      expect(plans.length).toBeGreaterThan(1);
      for (const plan of plans) {
        const path = `/api/plans/${plan.id}/export.json`;
        const source = await fetchText(before, path, cookieBefore);
        expect(source.status, plan.name).toBe(200);
        expect(await fetchText(after, path, cookieAfter), plan.name).toEqual(source);
      }
      const file = `/api/attachments/${attachmentId}/content`;
      expect((await fetchText(after, file, cookieAfter)).text).toBe(uploaded);
    } finally {
      await before.close();
      await after.close();
    }
  });
});

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_SITES, DEMO_TEAM_NAME } from "./data/seed-demo";
import { openDatabase } from "./data/data-source";
import { migrations } from "./data/migrations";
import {
  createTestDatabase,
  serverDatabase,
  testDatabaseKind,
  type TestDatabase,
} from "./testing/database";
import { startServer } from "./start";

let dir: string;
const databases: TestDatabase[] = [];
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "spreadsight-start-"));
});
afterAll(async () => {
  rmSync(dir, { recursive: true, force: true });
  for (const database of databases) await database.drop();
});

/** A fresh database of this project's kind (SQLite or PostgreSQL), dropped after the file. */
async function freshDatabase() {
  const database = await createTestDatabase();
  databases.push(database);
  return serverDatabase(database);
}

async function signInOver(url: string, email: string, password = DEMO_PASSWORD) {
  const response = await fetch(`${url}/api/auth/sign-in`, {
    method: "POST",
    headers: { "Content-Type": "application/json", Origin: url },
    body: JSON.stringify({ email, password }),
  });
  const cookie = (response.headers.get("set-cookie") ?? "").split(";")[0];
  return {
    status: response.status,
    cookie,
    body: (await response.json()) as Record<string, unknown>,
  };
}

describe.runIf(testDatabaseKind() === "sqlite")("database (SQLite)", () => {
  // PostgreSQL's counterpart is server/data/data-source.test.ts.
  it("runs every migration on an empty file, with WAL and foreign keys on", async () => {
    const path = join(dir, "nested", "folder", "empty.sqlite");
    const dataSource = await openDatabase({ path });
    try {
      const ran = (await dataSource.query(`SELECT name FROM "migrations" ORDER BY id`)) as {
        name: string;
      }[];
      expect(ran.map((m) => m.name)).toEqual(migrations.map((m) => new m().name));
      const tables = (
        (await dataSource.query(
          `SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name`,
        )) as { name: string }[]
      ).map((t) => t.name);
      for (const table of ["teams", "users", "memberships", "sessions", "sites", "audit_events"]) {
        expect(tables).toContain(table);
      }
      expect(await dataSource.query("PRAGMA journal_mode")).toEqual([{ journal_mode: "wal" }]);
      expect(await dataSource.query("PRAGMA foreign_keys")).toEqual([{ foreign_keys: 1 }]);
      await expect(
        dataSource.query(
          `INSERT INTO memberships (id, teamId, userId, role, createdAt) VALUES ('m', 'no-team', 'no-user', 'admin', '2025-01-01')`,
        ),
      ).rejects.toThrow(/FOREIGN KEY/);
    } finally {
      await dataSource.destroy();
    }
  });
});

describe("startServer", () => {
  it("seeds the demo team once, and everything survives a restart on the same file", async () => {
    const db = await freshDatabase();
    const first = await startServer({ port: 0, ...db, demo: true, serveClient: false });
    let siteId: string;
    try {
      expect(first.seeded).toBe(true);
      expect(first.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
      expect(await (await fetch(`${first.url}/api/health`)).json()).toEqual({ ok: true });

      const lead = await signInOver(first.url, "lead@spreadsight.test");
      expect(lead.status).toBe(200);
      expect(lead.body).toMatchObject({ role: "lead", demo: true, team: { name: DEMO_TEAM_NAME } });
      const created = await fetch(`${first.url}/api/sites`, {
        method: "POST",
        headers: { "Content-Type": "application/json", Origin: first.url, Cookie: lead.cookie },
        body: JSON.stringify({ name: "Restart test ridge", description: "Loess over gravel." }),
      });
      expect(created.status).toBe(201);
      siteId = ((await created.json()) as { id: string }).id;

      // Admin invites someone: the mail reaches the fake mailbox over real SMTP.
      const admin = await signInOver(first.url, "admin@spreadsight.test");
      const invite = await fetch(`${first.url}/api/invitations`, {
        method: "POST",
        headers: { "Content-Type": "application/json", Origin: first.url, Cookie: admin.cookie },
        body: JSON.stringify({ email: "restart@example.test", role: "trainee" }),
      });
      expect(invite.status).toBe(201);
      const mail = await first.mailbox!.waitFor((m) => m.to.includes("restart@example.test"));
      expect(mail.text).toContain(`${first.url}/invite/`);
    } finally {
      await first.close();
    }

    const second = await startServer({ port: 0, ...db, demo: true, serveClient: false });
    try {
      expect(second.seeded).toBe(false);
      const lead = await signInOver(second.url, "lead@spreadsight.test");
      expect(lead.status).toBe(200);
      const sites = (await (
        await fetch(`${second.url}/api/sites`, { headers: { Cookie: lead.cookie } })
      ).json()) as { id: string; name: string }[];
      expect(sites.map((s) => s.name).sort()).toEqual(
        [...DEMO_SITES.map((s) => s.name), "Restart test ridge"].sort(),
      );
      expect(sites.map((s) => s.id)).toContain(siteId);
      const members = await second.dataSource.query(`SELECT COUNT(*) AS n FROM users`);
      expect(members).toEqual([{ n: DEMO_ACCOUNTS.length }]);
      expect((await second.mailbox!.all()).some((m) => m.to.includes("restart@example.test"))).toBe(
        true,
      );
    } finally {
      await second.close();
    }
  });

  it("serves the built client with an index.html fallback, but never for /api", async () => {
    const clientDir = join(dir, "dist");
    mkdirSync(join(clientDir, "assets"), { recursive: true });
    writeFileSync(
      join(clientDir, "index.html"),
      "<!doctype html><title>Spreadsight test shell</title>",
    );
    writeFileSync(join(clientDir, "assets", "app-1234.js"), "console.log('hi')");
    const server = await startServer({
      port: 0,
      ...(await freshDatabase()),
      clientDir,
      smtpUrl: "smtp://127.0.0.1:9",
    });
    try {
      expect(server.mailbox).toBeNull();
      const page = await fetch(`${server.url}/sites/some-id`);
      expect(page.status).toBe(200);
      expect(await page.text()).toContain("Spreadsight test shell");
      const asset = await fetch(`${server.url}/assets/app-1234.js`);
      expect(asset.status).toBe(200);
      expect(asset.headers.get("cache-control")).toContain("immutable");
      const api = await fetch(`${server.url}/api/unknown`);
      expect(api.status).toBe(404);
      expect(api.headers.get("content-type")).toMatch(/application\/json/);
    } finally {
      await server.close();
    }
  });

  it("refuses to start on a port that is taken, and releases the database", async () => {
    const db = await freshDatabase();
    const first = await startServer({ port: 0, ...(await freshDatabase()), serveClient: false });
    try {
      await expect(startServer({ port: first.port, ...db, serveClient: false })).rejects.toThrow(
        /EADDRINUSE/,
      );
    } finally {
      await first.close();
    }
  });
});

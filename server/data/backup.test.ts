/**
 * Backup and restore as the README describes them, on this project's database:
 * - SQLite: an online backup (better-sqlite3 `.backup()`) taken while the app has the file
 *   open; the backup file, opened on its own, holds what was there and nothing written after.
 * - PostgreSQL: `pg_dump --format=custom` and `pg_restore --no-owner` into a new database; the
 *   restored database has the same rows.
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { client, createTestContext, seedTeam, signIn, type TestContext } from "../testing/harness";
import { createTestDatabase, testDatabaseKind, type TestDatabase } from "../testing/database";
import { findPgBin } from "../testing/pg-cluster";
import { backupSqlite } from "./backup";
import { openDatabase } from "./data-source";
import { Site } from "./entities/site";

let ctx: TestContext;
let dir: string;
let lead: ReturnType<typeof client>;
let teamId: string;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "spreadsight-backup-"));
  ctx = await createTestContext();
  const team = await seedTeam(ctx.dataSource, "Backup Surveys", "backup");
  teamId = team.id;
  lead = client(ctx.app, await signIn(ctx.app, team.users.lead.email));
  const made = await lead.post("/api/sites").send({ name: "Before the backup", description: "" });
  expect(made.status).toBe(201);
});
afterAll(async () => {
  await ctx.close();
  rmSync(dir, { recursive: true, force: true });
});

const siteNames = async (ds: typeof ctx.dataSource) =>
  (await ds.getRepository(Site).findBy({ teamId })).map((s) => s.name).sort();

describe(`backup and restore (${testDatabaseKind()})`, () => {
  it("restores what the database held at backup time", async () => {
    const expected = await siteNames(ctx.dataSource);
    expect(expected).toContain("Before the backup");
    let restored: TestDatabase | null = null;
    try {
      if (testDatabaseKind() === "sqlite") {
        const file = join(dir, "backup.sqlite");
        await backupSqlite(ctx.database.path!, file); // the app still has the file open
        await expect(backupSqlite(ctx.database.path!, file)).rejects.toThrow(/exists already/);
        restored = { kind: "sqlite", options: { path: file }, drop: async () => {} };
      } else {
        const bin = findPgBin();
        expect(bin, "pg_dump and pg_restore come with the postgresql package").not.toBeNull();
        const dump = join(dir, "spreadsight.dump");
        execFileSync(join(bin!, "pg_dump"), ["--format=custom", `--file=${dump}`, ctx.database.url!]);
        restored = await createTestDatabase({ empty: true });
        execFileSync(join(bin!, "pg_restore"), [
          "--no-owner",
          `--dbname=${restored.options.url!}`,
          dump,
        ]);
      }
      // Written after the backup: must not be in it.
      await lead.post("/api/sites").send({ name: "After the backup", description: "" });
      const ds = await openDatabase(restored.options);
      try {
        expect(await siteNames(ds)).toEqual(expected);
      } finally {
        await ds.destroy();
      }
    } finally {
      await restored?.drop();
    }
  });
});

/**
 * Which database the server tests run on, and a fresh empty one per caller.
 *
 * - vitest project `server`: SQLite, a new file in a temporary folder.
 * - vitest project `server-pg` (SPREADSIGHT_TEST_DB=postgres): a new database in the PostgreSQL
 *   cluster that `pg-global-setup.ts` started (or in the server at TEST_DATABASE_URL), created
 *   from a template that already holds every migration, so test files run in parallel.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { randomBytes } from "node:crypto";
import { tmpdir } from "node:os";
import { join } from "node:path";
import pg from "pg";
import type { DatabaseKind, DatabaseOptions } from "../data/data-source";
import type { ObjectStoreSettings } from "../data/file-store";

export interface TestDatabase {
  kind: DatabaseKind;
  /** Pass to openDatabase (or its `url`/`path` to startServer). */
  options: DatabaseOptions;
  /** Drops the database (PostgreSQL) or removes its folder (SQLite). */
  drop(): Promise<void>;
}

/** Set by pg-global-setup.ts through vitest's provide/inject. */
declare module "vitest" {
  export interface ProvidedContext {
    pgAdminUrl: string;
    pgTemplate: string;
    s3Settings: ObjectStoreSettings;
  }
}

/** The database the current test project runs on. */
export function testDatabaseKind(): DatabaseKind {
  return process.env.SPREADSIGHT_TEST_DB === "postgres" ? "postgres" : "sqlite";
}

/** The fake S3 server of the `server-pg` project (uploads go there), or null (SQLite project:
 * uploads stay in the database). */
export async function testObjectStore(): Promise<ObjectStoreSettings | null> {
  if (testDatabaseKind() === "sqlite") return null;
  const { inject } = await import("vitest");
  return inject("s3Settings");
}

/** `postgres://…/<name>`: the admin URL with another database name. */
export function withDatabase(url: string, name: string): string {
  const parsed = new URL(url);
  parsed.pathname = `/${name}`;
  return parsed.toString();
}

async function pgSettings(): Promise<{ adminUrl: string; template: string }> {
  const { inject } = await import("vitest");
  return { adminUrl: inject("pgAdminUrl"), template: inject("pgTemplate") };
}

/** Runs one statement on the cluster's `postgres` database. */
export async function adminQuery(adminUrl: string, sql: string): Promise<void> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

/** A fresh database of the project's kind: migrated and without rows (or, with `empty`, without
 * tables: PostgreSQL only; a new SQLite file always starts empty). */
export async function createTestDatabase(options: { empty?: boolean } = {}): Promise<TestDatabase> {
  if (testDatabaseKind() === "sqlite") {
    const dir = mkdtempSync(join(tmpdir(), "spreadsight-db-"));
    return {
      kind: "sqlite",
      options: { path: join(dir, "test.sqlite") },
      async drop() {
        rmSync(dir, { recursive: true, force: true });
      },
    };
  }
  const { adminUrl, template } = await pgSettings();
  const name = `spreadsight_test_${randomBytes(6).toString("hex")}`;
  // `empty`: no tables at all, so the caller's first openDatabase runs every migration.
  await adminQuery(
    adminUrl,
    options.empty
      ? `CREATE DATABASE "${name}"`
      : `CREATE DATABASE "${name}" TEMPLATE "${template}"`,
  );
  return {
    kind: "postgres",
    options: { url: withDatabase(adminUrl, name) },
    async drop() {
      await adminQuery(adminUrl, `DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
    },
  };
}

/** The startServer options that point at this database. */
export function serverDatabase(database: TestDatabase): { dbPath?: string; databaseUrl?: string } {
  return database.options.url
    ? { databaseUrl: database.options.url }
    : { dbPath: database.options.path };
}

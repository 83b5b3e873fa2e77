/**
 * The one DataSource module. Two databases behind the same entities and migrations:
 *
 * - SQLite through better-sqlite3 (the default: one file, WAL, foreign keys on);
 * - PostgreSQL through `pg`, chosen by a `postgres://…` URL (DATABASE_URL in server/main.ts).
 *
 * Migrations run at start on both; the schema is never synchronized.
 */
import "reflect-metadata";
import { mkdirSync } from "node:fs";
import { dirname } from "node:path";
import pg from "pg";
import { DataSource } from "typeorm";
import { usePortableTypes } from "./columns";
import { entities } from "./entities";
import { migrations } from "./migrations";

/** Where the data lives: a SQLite file (or ":memory:") or a PostgreSQL URL. */
export type DatabaseOptions = { path: string; url?: undefined } | { url: string; path?: undefined };

/** "sqlite" or "postgres": the two databases Spreadsight runs on. */
export type DatabaseKind = "sqlite" | "postgres";

/** True for a postgres:// or postgresql:// URL. */
export function isPostgresUrl(value: string): boolean {
  return /^postgres(ql)?:\/\//i.test(value);
}

/** Which database a DataSource talks to. */
export function databaseKind(dataSource: DataSource): DatabaseKind {
  return dataSource.options.type === "postgres" ? "postgres" : "sqlite";
}

/** The URL with its password replaced by "***", for logs and start-up lines. */
export function redactUrl(url: string): string {
  try {
    const parsed = new URL(url);
    if (parsed.password) parsed.password = "***";
    return parsed.toString();
  } catch {
    return "(unparseable database URL)";
  }
}

/** COUNT(*) and other int8 results come back as JS numbers (they stay far below 2^53 here). */
const INT8_OID = 20;
const pgTypes = {
  getTypeParser: ((oid: number, format?: "text" | "binary") =>
    oid === INT8_OID && format !== "binary"
      ? (value: string) => Number(value)
      : pg.types.getTypeParser(oid, format)) as typeof pg.types.getTypeParser,
};

/**
 * Creates and initialises the DataSource and runs pending migrations. SQLite: opens the file
 * (creating its folder), turns on WAL and foreign keys. PostgreSQL: a connection pool
 * (`DB_POOL_SIZE`, default 10).
 */
export async function openDatabase(options: DatabaseOptions): Promise<DataSource> {
  const dataSource =
    options.url !== undefined
    ? new DataSource({
        type: "postgres",
        url: options.url,
        entities,
        migrations,
        // Run below, under a lock: several app servers may start at once on one database.
        migrationsRun: false,
        migrationsTransactionMode: "each",
        synchronize: false,
        logging: false,
        extra: {
          max: Number(process.env.DB_POOL_SIZE) || 10,
          types: pgTypes,
          application_name: "spreadsight",
        },
      })
    : sqliteDataSource(options.path);
  usePortableTypes(dataSource);
  await dataSource.initialize();
  if (options.url !== undefined) {
    try {
      await migrateUnderLock(dataSource);
    } catch (error) {
      await dataSource.destroy();
      throw error;
    }
  }
  return dataSource;
}

/** Any fixed number: the key of the PostgreSQL advisory lock held while migrating. */
const MIGRATION_LOCK = 7_311_004_213;

/**
 * Runs pending migrations while holding a session advisory lock, so that when several app
 * servers start together on one PostgreSQL database one migrates and the others wait, then
 * find nothing left to do.
 */
async function migrateUnderLock(dataSource: DataSource): Promise<void> {
  const runner = dataSource.createQueryRunner();
  await runner.connect();
  try {
    await runner.query(`SELECT pg_advisory_lock(${MIGRATION_LOCK})`);
    await dataSource.runMigrations({ transaction: "each" });
  } finally {
    await runner.query(`SELECT pg_advisory_unlock(${MIGRATION_LOCK})`).catch(() => undefined);
    await runner.release();
  }
}

function sqliteDataSource(path: string): DataSource {
  if (path !== ":memory:") mkdirSync(dirname(path), { recursive: true });
  return new DataSource({
    type: "better-sqlite3",
    database: path,
    entities,
    migrations,
    migrationsRun: true,
    migrationsTransactionMode: "each",
    synchronize: false,
    enableWAL: path !== ":memory:",
    prepareDatabase: (db: { pragma: (sql: string) => unknown }) => {
      db.pragma("foreign_keys = ON");
      db.pragma("busy_timeout = 5000");
    },
    logging: false,
  });
}

/** `{ url }` for a postgres:// URL, else `{ path }` (a SQLite file). */
export function databaseOptionsFrom(value: string): DatabaseOptions {
  return isPostgresUrl(value) ? { url: value } : { path: value };
}

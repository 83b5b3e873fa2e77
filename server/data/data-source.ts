/** The one DataSource module: SQLite through better-sqlite3, WAL, foreign keys, migrations at start. */
import "reflect-metadata";
import { mkdirSync } from "node:fs";
import { dirname } from "node:path";
import { DataSource } from "typeorm";
import { entities } from "./entities";
import { migrations } from "./migrations";

export interface DatabaseOptions {
  /** SQLite file path, or ":memory:". Its folder is created when missing. */
  path: string;
}

/**
 * Creates and initialises the DataSource: opens the file, turns on WAL and foreign keys and
 * runs pending migrations. Never synchronizes the schema.
 */
export async function openDatabase({ path }: DatabaseOptions): Promise<DataSource> {
  if (path !== ":memory:") mkdirSync(dirname(path), { recursive: true });
  const dataSource = new DataSource({
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
  await dataSource.initialize();
  return dataSource;
}

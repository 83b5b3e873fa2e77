/**
 * Backups (npm run db:backup): an online copy of the SQLite file while the server keeps
 * running, through SQLite's backup API (better-sqlite3 `.backup()`), into a new file that is a
 * complete database on its own. For PostgreSQL use its own tools: `pg_dump --format=custom`
 * and `pg_restore` (README, "Backup and restore").
 */
import { existsSync, mkdirSync } from "node:fs";
import { dirname } from "node:path";
import Database from "better-sqlite3";

/** Copies the live SQLite database at `from` into a new file `to` (refuses to overwrite). */
export async function backupSqlite(from: string, to: string): Promise<{ pages: number }> {
  if (!existsSync(from)) throw new Error(`no such SQLite file: ${from}`);
  if (existsSync(to)) throw new Error(`${to} exists already: choose a new file for the backup`);
  mkdirSync(dirname(to), { recursive: true });
  const db = new Database(from, { readonly: true, fileMustExist: true });
  try {
    const { totalPages } = await db.backup(to);
    return { pages: totalPages };
  } finally {
    db.close();
  }
}

/**
 * npm run db:backup -- [--from data/spreadsight.sqlite] --to <new file>
 *
 * An online backup of the SQLite database (the server may keep running): server/data/backup.ts.
 * For PostgreSQL use pg_dump (README, "Backup and restore").
 */
import { parseArgs } from "node:util";
import { resolve } from "node:path";
import { backupSqlite } from "../server/data/backup";

const USAGE = "usage: npm run db:backup -- [--from data/spreadsight.sqlite] --to <new file>";
try {
  const { values } = parseArgs({
    options: { from: { type: "string" }, to: { type: "string" } },
  });
  if (!values.to) throw new Error("--to is required");
  const from = resolve(values.from ?? process.env.SPREADSIGHT_DB ?? "data/spreadsight.sqlite");
  const to = resolve(values.to);
  const { pages } = await backupSqlite(from, to);
  console.log(`Backed up ${from}\n       to ${to} (${pages} pages)`);
} catch (error) {
  console.error(`${(error as Error).message}\n${USAGE}`);
  process.exit(1);
}

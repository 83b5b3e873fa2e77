/**
 * npm run db:copy -- --from <SQLite file or postgres:// URL> --to <postgres:// URL or new SQLite file>
 *
 * Copies every table except sessions into an empty database, prints the rows per table and
 * checks the counts at the end (server/data/copy.ts). Exit code 0 only when every count
 * matches; 2 when the target is not empty (nothing written); 1 for any other failure.
 */
import { parseArgs } from "node:util";
import { resolve } from "node:path";
import { existsSync } from "node:fs";
import { databaseOptionsFrom, isPostgresUrl, redactUrl } from "../server/data/data-source";
import { copyDatabase, CopyRefused } from "../server/data/copy";

const USAGE =
  "usage: npm run db:copy -- --from <SQLite file or postgres:// URL> --to <postgres:// URL or SQLite file>";

async function main(): Promise<number> {
  let values: { from?: string; to?: string; help?: boolean };
  try {
    ({ values } = parseArgs({
      options: {
        from: { type: "string" },
        to: { type: "string" },
        help: { type: "boolean", short: "h" },
      },
    }));
  } catch (error) {
    console.error(`${(error as Error).message}\n${USAGE}`);
    return 1;
  }
  if (values.help) {
    console.log(USAGE);
    return 0;
  }
  if (!values.from || !values.to) {
    console.error(`${!values.from ? "--from" : "--to"} is required\n${USAGE}`);
    return 1;
  }
  const from = isPostgresUrl(values.from) ? values.from : resolve(values.from);
  const to = isPostgresUrl(values.to) ? values.to : resolve(values.to);
  if (!isPostgresUrl(from) && !existsSync(from)) {
    console.error(`--from: no such SQLite file: ${from}`);
    return 1;
  }
  if (from === to) {
    console.error("--from and --to are the same database");
    return 1;
  }
  const show = (v: string) => (isPostgresUrl(v) ? redactUrl(v) : v);
  console.log(`Copying ${show(from)}\n     to ${show(to)}`);
  try {
    const counts = await copyDatabase(databaseOptionsFrom(from), databaseOptionsFrom(to), (line) =>
      console.log(line),
    );
    console.log("\nVerified (rows in source = rows in target):");
    for (const c of counts) {
      console.log(`  ${c.table.padEnd(22)} ${String(c.source).padStart(8)} = ${c.target}`);
    }
    console.log("Sessions were not copied: everyone signs in again.");
    return 0;
  } catch (error) {
    if (error instanceof CopyRefused) {
      console.error(`Refused: ${error.message}`);
      return 2;
    }
    console.error(`Copy failed (the target keeps no partial copy): ${(error as Error).message}`);
    return 1;
  }
}

main().then((code) => process.exit(code));

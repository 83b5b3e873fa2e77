/**
 * A throwaway PostgreSQL cluster for tests and benchmarks: `initdb` into a temporary folder,
 * `pg_ctl start` on a free port on 127.0.0.1 (trust authentication, no fsync), and on `stop()`
 * an immediate shutdown and the folder removed. Uses Debian's `postgresql` package
 * (/usr/lib/postgresql/<version>/bin); as root the server runs as the `postgres` user.
 *
 *   const cluster = await startPgCluster();
 *   // cluster.url === "postgres://postgres@127.0.0.1:<port>/postgres"
 *   await cluster.stop();
 */
import { execFileSync } from "node:child_process";
import { chownSync, existsSync, mkdtempSync, readdirSync, rmSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";

export interface PgCluster {
  /** Superuser URL of the cluster's `postgres` database. */
  url: string;
  port: number;
  dir: string;
  stop(): Promise<void>;
}

/** The newest /usr/lib/postgresql/<version>/bin holding initdb and pg_ctl, or PG_BIN. */
export function findPgBin(): string | null {
  if (process.env.PG_BIN) return process.env.PG_BIN;
  const root = "/usr/lib/postgresql";
  if (!existsSync(root)) return null;
  const versions = readdirSync(root)
    .filter((v) => existsSync(join(root, v, "bin", "initdb")))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? join(root, versions[0], "bin") : null;
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      const port = typeof address === "object" && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

function postgresIds(): { uid: number; gid: number } | null {
  if (process.getuid?.() !== 0) return null;
  const uid = Number(execFileSync("id", ["-u", "postgres"], { encoding: "utf8" }).trim());
  const gid = Number(execFileSync("id", ["-g", "postgres"], { encoding: "utf8" }).trim());
  return { uid, gid };
}

/** Runs a PostgreSQL program, as `postgres` when we are root (the server refuses root). */
function run(bin: string, program: string, args: string[], asPostgres: boolean): void {
  const file = join(bin, program);
  const [command, argv] = asPostgres
    ? ["runuser", ["-u", "postgres", "--", file, ...args]]
    : [file, args];
  execFileSync(command, argv, { stdio: ["ignore", "pipe", "pipe"] });
}

export async function startPgCluster(): Promise<PgCluster> {
  const bin = findPgBin();
  if (!bin) {
    throw new Error(
      "PostgreSQL is not installed: run `apt-get install -y postgresql` (Debian), or set " +
        "TEST_DATABASE_URL to an existing server (see docs/api.md, Database)",
    );
  }
  const ids = postgresIds();
  // As root the server runs as `postgres`, which must reach the folder: /tmp always lets it
  // (a TMPDIR under /root would not).
  const dir = mkdtempSync(join(ids ? "/tmp" : tmpdir(), "spreadsight-pg-"));
  if (ids) chownSync(dir, ids.uid, ids.gid);
  const data = join(dir, "data");
  const port = await freePort();
  const asPostgres = ids !== null;
  try {
    run(
      bin,
      "initdb",
      ["-D", data, "-U", "postgres", "--auth=trust", "-E", "UTF8", "--locale=C", "--no-sync"],
      asPostgres,
    );
    const settings = [
      `-p ${port}`,
      `-k ${dir}`,
      "-c listen_addresses=127.0.0.1",
      "-c fsync=off",
      "-c synchronous_commit=off",
      "-c full_page_writes=off",
      "-c max_connections=200",
      "-c shared_buffers=32MB",
    ].join(" ");
    run(
      bin,
      "pg_ctl",
      ["-D", data, "-l", join(dir, "server.log"), "-o", settings, "-w", "-t", "60", "start"],
      asPostgres,
    );
  } catch (error) {
    rmSync(dir, { recursive: true, force: true });
    const stderr = (error as { stderr?: Buffer }).stderr?.toString() ?? "";
    throw new Error(`could not start a PostgreSQL test cluster: ${stderr || String(error)}`);
  }
  let stopped = false;
  return {
    url: `postgres://postgres@127.0.0.1:${port}/postgres`,
    port,
    dir,
    async stop() {
      if (stopped) return;
      stopped = true;
      try {
        run(bin, "pg_ctl", ["-D", data, "-m", "immediate", "-w", "stop"], asPostgres);
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  };
}

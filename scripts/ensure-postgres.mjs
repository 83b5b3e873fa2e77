// Installs Debian's PostgreSQL server package when initdb is missing: the `server-pg` test
// project starts a throwaway cluster with it (server/testing/pg-cluster.ts). Skipped when
// TEST_DATABASE_URL points the tests at an existing server instead.
import { existsSync, readdirSync } from "node:fs";
import { execSync } from "node:child_process";
import { join } from "node:path";

const root = "/usr/lib/postgresql";
const installed =
  existsSync(root) && readdirSync(root).some((v) => existsSync(join(root, v, "bin", "initdb")));
if (installed || process.env.TEST_DATABASE_URL || process.env.PG_BIN) {
  process.exit(0);
}
console.log("[ensure-postgres] initdb is missing; installing Debian's postgresql package");
const sudo = process.getuid && process.getuid() !== 0 ? "sudo " : "";
try {
  execSync(`${sudo}apt-get update -qq`, { stdio: "inherit" });
  execSync(`${sudo}env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql`, {
    stdio: "inherit",
  });
} catch (error) {
  console.error("[ensure-postgres] could not install postgresql:", error.message);
  process.exit(1);
}

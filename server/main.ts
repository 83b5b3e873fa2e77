/**
 * Command-line entry: `node build/server/main.js [--demo]` (npm start / npm run demo; built by
 * `npm run build`), or `node --import tsx server/main.ts` from the sources.
 *
 * Environment: PORT (3000), HOST (127.0.0.1), SPREADSIGHT_DB (./data/spreadsight.sqlite),
 * DATABASE_URL (postgres://…: PostgreSQL instead of the SQLite file; DB_POOL_SIZE, default 10),
 * S3_ENDPOINT + S3_BUCKET (+ S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY, S3_REGION, S3_PREFIX,
 * S3_FORCE_PATH_STYLE): uploaded files in an S3-compatible object store instead of the database,
 * SMTP_URL (unset: in demo mode the built-in fake mailbox, otherwise no mail is sent),
 * SPREADSIGHT_MAILBOX=catch (the fake mailbox outside demo mode: admins can then read every
 * member's reset link, so only for a trial on one machine), MAIL_FROM, PUBLIC_URL
 * (http://HOST:PORT), SPREADSIGHT_DEMO=1 (same as --demo), TRUST_PROXY, LOG_LEVEL (info),
 * SPREADSIGHT_WORKERS (threads for reports and upload checks, default 2), SPREADSIGHT_CLIENT_DIR
 * (the built client, default dist/).
 */
import { resolve } from "node:path";
import { isPostgresUrl, redactUrl } from "./data/data-source";
import { objectStoreFromEnv } from "./data/file-store";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "./data/seed-demo";
import { createLogger } from "./logger";
import { startServer } from "./start";

function parsePort(value: string | undefined): number {
  if (value === undefined || value === "") return 3000;
  const port = Number(value);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`PORT must be a whole number from 0 to 65535, got "${value}"`);
  }
  return port;
}

function parseTrustProxy(value: string | undefined): boolean | number | string {
  if (value === undefined || value === "" || value === "0" || value === "false") return false;
  if (value === "1" || value === "true") return true;
  return /^\d+$/.test(value) ? Number(value) : value;
}

async function main(): Promise<void> {
  const env = process.env;
  const demo = process.argv.includes("--demo") || env.SPREADSIGHT_DEMO === "1";
  const logger = createLogger();
  const databaseUrl = env.DATABASE_URL || undefined;
  if (databaseUrl && !isPostgresUrl(databaseUrl)) {
    throw new Error(`DATABASE_URL must start with postgres:// or postgresql://`);
  }
  const dbPath = resolve(env.SPREADSIGHT_DB || "data/spreadsight.sqlite");
  const objectStore = objectStoreFromEnv(env);
  const server = await startServer({
    dbPath,
    databaseUrl,
    objectStore,
    port: parsePort(env.PORT),
    host: env.HOST || "127.0.0.1",
    demo,
    serveClient: true,
    clientDir: env.SPREADSIGHT_CLIENT_DIR || undefined,
    smtpUrl: env.SMTP_URL || null,
    mailbox: demo || env.SPREADSIGHT_MAILBOX === "catch",
    mailFrom: env.MAIL_FROM || undefined,
    publicUrl: env.PUBLIC_URL || undefined,
    trustProxy: parseTrustProxy(env.TRUST_PROXY),
    logger,
  });

  const lines = [
    "",
    `Spreadsight is running at ${server.url}`,
    `  database: ${databaseUrl ? redactUrl(databaseUrl) : dbPath}`,
    `  uploads:  ${objectStore ? `object store ${objectStore.endpoint} bucket ${objectStore.bucket}` : "in the database"}`,
    `  e-mail:   ${server.mailbox ? "built-in fake mailbox (admins: Mailbox page)" : env.SMTP_URL ? "SMTP_URL" : "not sent (set SMTP_URL)"}`,
  ];
  if (server.publicUrl !== server.url) lines.push(`  links in e-mails use ${server.publicUrl}`);
  if (demo) {
    lines.push(
      server.seeded ? "  demo data: created" : "  demo data: already present",
      `  demo accounts (password "${DEMO_PASSWORD}"):`,
      ...DEMO_ACCOUNTS.map((a) => `    ${a.role.padEnd(9)} ${a.email}`),
    );
  }
  if (!server.mailbox && demo) lines.push("  (SMTP_URL is set: mail goes to the real server)");
  if (server.mailbox && !demo) {
    logger.warn(
      "SPREADSIGHT_MAILBOX=catch: e-mail is caught by the built-in mailbox, where admins can read every member's reset link; set SMTP_URL for real use",
    );
  }
  if (!server.mailbox && !env.SMTP_URL) {
    logger.warn("SMTP_URL is not set: invitations and password-reset e-mails are not sent");
  }
  lines.push("Press Ctrl+C to stop.", "");
  console.log(lines.join("\n"));

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, "shutting down");
    server.close().then(
      () => process.exit(0),
      (error: unknown) => {
        logger.error({ err: error }, "shutdown failed");
        process.exit(1);
      },
    );
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
}

main().catch((error: unknown) => {
  console.error("Spreadsight could not start:", error instanceof Error ? error.message : error);
  process.exit(1);
});

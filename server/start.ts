/**
 * Start and stop a complete Spreadsight server: database (migrations), e-mail (real SMTP or
 * the built-in fake), the Express app on a port, optional demo data and the built client.
 *
 *   const server = await startServer({ port: 0, dbPath, demo: true, serveClient: true });
 *   // server.url === "http://127.0.0.1:<port>"
 *   const mail = await server.mailbox!.waitFor((m) => m.to.includes("new@spreadsight.test"));
 *   await server.close();
 */
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { fileURLToPath } from "node:url";
import type { Logger } from "pino";
import type { DataSource } from "typeorm";
import { openDatabase } from "./data/data-source";
import {
  s3FileStore,
  sweepOrphanObjects,
  useFileStore,
  type ObjectStoreSettings,
} from "./data/file-store";
import { TypeormLuciaAdapter } from "./data/lucia-adapter";
import { seedDemo } from "./data/seed-demo";
import { createApp, type AppLocals } from "./http/app";
import type { RateLimitConfig } from "./http/rate-limit";
import { createLogger } from "./logger";
import { reportFontsMissing } from "./reports/fonts";
import { closeWorkerPools } from "./workers/pool";
import type { FakeSmtp } from "./mail/fake-smtp";
import { createMailer, disabledMailer } from "./mail/mailer";
import { startOutboxSweeper } from "./mail/outbox";

export interface StartOptions {
  /** SQLite file (created with its folder when missing), or ":memory:". Ignored when
   * `databaseUrl` is given. */
  dbPath?: string;
  /** A postgres:// URL: use PostgreSQL instead of SQLite (see docs/api.md, "Database"). */
  databaseUrl?: string;
  /** Keep uploaded files in this S3-compatible store instead of the database. */
  objectStore?: ObjectStoreSettings | null;
  /** TCP port; 0 picks a free one. Default 3000. */
  port?: number;
  /** Interface to listen on. Default 127.0.0.1. */
  host?: string;
  /** Seed the demo team once (idempotent) and report demo mode to the client. Default false. */
  demo?: boolean;
  /** Serve the built client from `clientDir` with SPA fallback. Default true. */
  serveClient?: boolean;
  /** Default: dist/ at the project root. */
  clientDir?: string;
  /** A real SMTP server (nodemailer URL). When absent, mail goes to the built-in fake SMTP
   * server if `mailbox` is on (messages readable at /api/mailbox by admins and through
   * `mailbox` below); otherwise it is not sent at all (a warning is logged per message). */
  smtpUrl?: string | null;
  /** Catch mail in the built-in mailbox when no smtpUrl is given. Default: `demo`. Outside demo
   * mode this lets an admin read every member's reset link: only for a trial on one machine. */
  mailbox?: boolean;
  /** Sender address of outgoing mail. Default "Spreadsight <no-reply@spreadsight.test>". */
  mailFrom?: string;
  /** Base URL for links in e-mails. Default http://<host>:<actual port>. */
  publicUrl?: string;
  /** Override sign-in / reset rate limits. */
  rateLimits?: Partial<RateLimitConfig>;
  /** Express `trust proxy`. Default false. */
  trustProxy?: boolean | number | string;
  /** Further origins allowed on state-changing requests (e.g. the Vite dev server). */
  extraOrigins?: string[];
  /** A pino logger; default one at LOG_LEVEL (silent under tests). */
  logger?: Logger;
}

export interface RunningServer {
  /** http://<host>:<port> */
  url: string;
  port: number;
  publicUrl: string;
  dataSource: DataSource;
  logger: Logger;
  /** The fake mailbox (all teams) when no smtpUrl was given, else null. */
  mailbox: AppLocals["mailbox"];
  /** True when demo data was inserted by this start (false when it already existed). */
  seeded: boolean;
  /** Stops accepting connections, ends open ones, stops SMTP, closes the database. */
  close(): Promise<void>;
}

/** dist/ at the project root, from server/start.ts or from the compiled build/server/main.js. */
export const DEFAULT_CLIENT_DIR = fileURLToPath(
  new URL(import.meta.url.endsWith(".js") ? "../../dist" : "../dist", import.meta.url),
);

export async function startServer(options: StartOptions): Promise<RunningServer> {
  const logger = options.logger ?? createLogger();
  const host = options.host ?? "127.0.0.1";
  if (!options.databaseUrl && !options.dbPath)
    throw new Error("startServer: give dbPath or databaseUrl");
  const dataSource = await openDatabase(
    options.databaseUrl ? { url: options.databaseUrl } : { path: options.dbPath! },
  );
  if (options.objectStore) useFileStore(dataSource, s3FileStore(options.objectStore));
  let fakeSmtp: FakeSmtp | null = null;
  let httpServer: Server | null = null;
  try {
    const seeded = options.demo ? (await seedDemo(dataSource)).created : false;
    const missingFonts = reportFontsMissing();
    if (missingFonts.length) {
      logger.warn(
        { missing: missingFonts },
        "report fonts not found in public/fonts or dist/fonts: PDF reports will use Helvetica",
      );
    }
    const from = options.mailFrom ?? "Spreadsight <no-reply@spreadsight.test>";
    let smtpUrl = options.smtpUrl;
    if (!smtpUrl && (options.mailbox ?? options.demo ?? false)) {
      // smtp-server and mailparser are demo-only packages: loaded only when the mailbox is on.
      const { startFakeSmtp } = await import("./mail/fake-smtp");
      fakeSmtp = await startFakeSmtp(dataSource, logger);
      smtpUrl = fakeSmtp.url;
    }
    const mailer = smtpUrl ? createMailer({ smtpUrl, from }) : disabledMailer(logger);

    const server = createServer();
    httpServer = server;
    await new Promise<void>((resolve, reject) => {
      server.once("error", reject);
      server.listen(options.port ?? 3000, host, () => {
        server.off("error", reject);
        resolve();
      });
    });
    const { port } = server.address() as AddressInfo;
    const urlHost = host.includes(":") ? `[${host}]` : host;
    const url = `http://${urlHost}:${port}`;
    const publicUrl = (options.publicUrl ?? url).replace(/\/+$/, "");
    const app = createApp({
      dataSource,
      mailer,
      logger,
      publicUrl,
      demo: options.demo ?? false,
      mailboxEnabled: fakeSmtp !== null,
      rateLimits: options.rateLimits,
      clientDir: options.serveClient === false ? null : (options.clientDir ?? DEFAULT_CLIENT_DIR),
      trustProxy: options.trustProxy,
      extraOrigins: options.extraOrigins,
    });
    server.on("request", app);
    const locals = app.locals.spreadsight as AppLocals;

    // lucia deletes an expired session when it is presented; sweep the ones never seen again.
    const sweepSessions = () =>
      new TypeormLuciaAdapter(dataSource)
        .deleteExpiredSessions()
        .catch((error: unknown) => logger.warn({ err: error }, "session sweep failed"));
    // Objects whose attachment row is gone (cascades, refused uploads): see file-store.ts.
    const sweepObjects = () =>
      sweepOrphanObjects(dataSource).catch((error: unknown) =>
        logger.warn({ err: error }, "object store sweep failed"),
      );
    await sweepSessions();
    void sweepObjects();
    const sweeper = setInterval(() => void sweepSessions().then(sweepObjects), 60 * 60 * 1000);
    sweeper.unref();
    // Notification e-mails left in the outbox (SMTP down, a server stopped before sending).
    const outbox = startOutboxSweeper({ dataSource, mailer, logger });

    let closing: Promise<void> | null = null;
    const close = () => {
      closing ??= (async () => {
        clearInterval(sweeper);
        await new Promise<void>((resolve) => {
          server.close(() => resolve());
          server.closeIdleConnections();
          setTimeout(() => server.closeAllConnections(), 2000).unref();
        });
        await locals.drain();
        await outbox.stop();
        await closeWorkerPools();
        mailer.close();
        await fakeSmtp?.close();
        if (dataSource.isInitialized) await dataSource.destroy();
        logger.info("Spreadsight stopped");
      })();
      return closing;
    };
    return {
      url,
      port,
      publicUrl,
      dataSource,
      logger,
      mailbox: locals.mailbox,
      seeded,
      close,
    };
  } catch (error) {
    httpServer?.close();
    await fakeSmtp?.close();
    if (dataSource.isInitialized) await dataSource.destroy();
    throw error;
  }
}

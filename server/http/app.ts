/**
 * The Express app factory. Everything the app needs comes in through `AppDeps`, so tests run
 * it in-process (supertest) against a temporary SQLite file; starting and stopping a real
 * server is server/start.ts.
 */
import compression from "compression";
import express, { type Express } from "express";
import type { Logger } from "pino";
import type { DataSource } from "typeorm";
import type { MailboxMessage } from "@/contracts/mailbox";
import { allMail } from "../domain/mailbox";
import type { Mailer } from "../mail/mailer";
import { clientRouter } from "./client";
import type { RouteContext } from "./context";
import { AppError } from "../domain/errors";
import { apiNotFound, errorHandler } from "./errors";
import { originCheck } from "./origin";
import { backgroundQueue } from "./background";
import {
  DEFAULT_RATE_LIMITS,
  RateLimitStore,
  SignInGuard,
  type RateLimitConfig,
} from "./rate-limit";
import { securityHeaders } from "./security";
import { requestLog } from "./request-log";
import { authRouter } from "./routes/auth";
import { invitationsRouter } from "./routes/invitations";
import { meRouter } from "./routes/me";
import { auditRouter, healthRouter, mailboxRouter } from "./routes/misc";
import { sitesRouter } from "./routes/sites";
import { activityRouter } from "./routes/activity";
import { commentsRouter } from "./routes/comments";
import { notificationsRouter } from "./routes/notifications";
import { plansRouter } from "./routes/plans";
import { teamRouter } from "./routes/team";
import { attachmentsRouter, attachmentUploadRouter } from "./routes/attachments";
import { exportsRouter } from "./routes/exports";
import { sessionTools } from "./session";

export interface AppDeps {
  dataSource: DataSource;
  mailer: Mailer;
  logger: Logger;
  /** Base URL for links in e-mails and an allowed Origin, e.g. http://127.0.0.1:3000. */
  publicUrl: string;
  /** Demo mode (reported to the client in MeResponse.demo). Default false. */
  demo?: boolean;
  /** True when the built-in fake SMTP server catches mail: enables GET /api/mailbox. Only demo
   * mode (or the explicit SPREADSIGHT_MAILBOX=catch setting) turns it on: whoever reads the
   * mailbox reads every member's reset links. */
  mailboxEnabled?: boolean;
  /** Override any sign-in / reset limit (tests use small windows). */
  rateLimits?: Partial<RateLimitConfig>;
  /** Folder of the built client (index.html + assets). Omit or null: API only. */
  clientDir?: string | null;
  /** Express `trust proxy` (set when behind a TLS-terminating proxy). Default false. */
  trustProxy?: boolean | number | string;
  /** Further origins allowed on state-changing requests (e.g. a dev server). */
  extraOrigins?: string[];
}

/** What tests and the e2e harness may read from `app.locals.spreadsight`. */
export interface AppLocals {
  /** Every message the fake SMTP server caught (all teams), newest first. */
  mailbox: {
    all(): Promise<MailboxMessage[]>;
    /** Polls until a message matches (default 5 s), newest first. */
    waitFor(match: (m: MailboxMessage) => boolean, timeoutMs?: number): Promise<MailboxMessage>;
  } | null;
  limits: RouteContext["limits"];
  /** Waits for work queued after responses (password-reset e-mails). */
  drain(): Promise<void>;
}

const BODY_LIMIT = "1mb";

export function createApp(deps: AppDeps): Express {
  const publicUrl = deps.publicUrl.replace(/\/+$/, "");
  const rateLimits: RateLimitConfig = { ...DEFAULT_RATE_LIMITS, ...deps.rateLimits };
  const limitStore = new RateLimitStore(deps.dataSource);
  const sessions = sessionTools(deps.dataSource, { publicUrl });
  const ctx: RouteContext = {
    services: { dataSource: deps.dataSource, mailer: deps.mailer, logger: deps.logger, publicUrl },
    sessions,
    flags: { demo: deps.demo ?? false, mailbox: deps.mailboxEnabled ?? false },
    limits: {
      config: rateLimits,
      store: limitStore,
      signIn: new SignInGuard(limitStore, rateLimits),
    },
    background: backgroundQueue(deps.logger),
  };

  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", deps.trustProxy ?? false);
  app.set("query parser", "simple");
  const locals: AppLocals = {
    mailbox: ctx.flags.mailbox ? mailboxHelper(deps.dataSource) : null,
    limits: ctx.limits,
    drain: () => ctx.background.drain(),
  };
  app.locals.spreadsight = locals;

  app.use(requestLog(deps.logger));
  app.use(securityHeaders());
  // gzip or brotli for every compressible answer (JSON, the client's JS and CSS, CSV, PDF).
  app.use(compression({ threshold: 1024 }));

  const api = express.Router();
  api.use((req, res, next) => {
    res.setHeader("Cache-Control", "no-store");
    const hasBody =
      req.headers["transfer-encoding"] !== undefined ||
      Number(req.headers["content-length"] ?? 0) > 0;
    if (hasBody && !req.is("application/json")) {
      next(
        new AppError(415, "unsupported_media_type", "send the request body as application/json"),
      );
      return;
    }
    next();
  });
  api.use(express.json({ limit: BODY_LIMIT }));
  api.use(originCheck({ publicUrl, extraOrigins: deps.extraOrigins }));
  api.use(sessions.middleware);
  api.use("/health", healthRouter());
  api.use("/auth", authRouter(ctx));
  api.use("/me", meRouter(ctx));
  api.use("/invitations", invitationsRouter(ctx));
  api.use("/team", teamRouter(ctx));
  api.use("/sites", sitesRouter(ctx));
  api.use("/audit", auditRouter(ctx));
  api.use("/mailbox", mailboxRouter(ctx));
  api.use(plansRouter(ctx));
  api.use(commentsRouter(ctx));
  api.use(notificationsRouter(ctx));
  api.use(activityRouter(ctx));
  api.use(attachmentsRouter(ctx));
  api.use(exportsRouter(ctx));
  api.use(apiNotFound);
  app.use("/api", attachmentUploadRouter(ctx, { publicUrl, extraOrigins: deps.extraOrigins }));
  app.use("/api", api);

  if (deps.clientDir) {
    const client = clientRouter(deps.clientDir);
    if (client) app.use(client);
    else deps.logger.warn({ dir: deps.clientDir }, "no built client found; run `npm run build`");
  }

  app.use(errorHandler(deps.logger));
  return app;
}

function mailboxHelper(dataSource: DataSource): NonNullable<AppLocals["mailbox"]> {
  return {
    all: () => allMail(dataSource),
    async waitFor(match, timeoutMs = 5000) {
      const deadline = Date.now() + timeoutMs;
      for (;;) {
        const found = (await allMail(dataSource)).find(match);
        if (found) return found;
        if (Date.now() > deadline) throw new Error("no matching e-mail arrived in time");
        await new Promise((resolve) => setTimeout(resolve, 25));
      }
    },
  };
}

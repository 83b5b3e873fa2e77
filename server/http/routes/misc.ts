/** /api/health, /api/audit and /api/mailbox. */
import { Router } from "express";
import { auditQuerySchema } from "@/contracts/audit";
import { idParamSchema } from "@/contracts/common";
import { requirePermission, requireRole } from "../../domain/actor";
import { listAudit } from "../../domain/audit";
import { AppError } from "../../domain/errors";
import { getMailboxMessage, listMailbox } from "../../domain/mailbox";
import type { RouteContext } from "../context";
import { requireActor } from "../session";
import { noQuerySchema, parseParams, parseQuery } from "../validate";

export function healthRouter(): Router {
  const router = Router();
  router.get("/", (_req, res) => {
    res.json({ ok: true });
  });
  return router;
}

export function auditRouter(ctx: RouteContext): Router {
  const router = Router();
  router.get("/", async (req, res) => {
    const actor = requireActor(res);
    requireRole(actor, "admin", "lead", "reviewer");
    const { limit } = parseQuery(auditQuerySchema, req);
    res.json(await listAudit(ctx.services.dataSource, actor, limit));
  });
  return router;
}

export function mailboxRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;
  const guard = (res: Parameters<typeof requireActor>[0]) => {
    const actor = requireActor(res);
    requirePermission(actor, "readMailbox");
    if (!ctx.flags.mailbox) {
      throw new AppError(
        404,
        "mailbox_disabled",
        "the mailbox exists only when the built-in fake SMTP server catches e-mail",
      );
    }
    return actor;
  };

  router.get("/", async (req, res) => {
    const actor = guard(res);
    parseQuery(noQuerySchema, req);
    res.json(await listMailbox(dataSource, actor));
  });

  router.get("/:id", async (req, res) => {
    const actor = guard(res);
    const { id } = parseParams(idParamSchema, req);
    res.json(await getMailboxMessage(dataSource, actor, id));
  });
  return router;
}

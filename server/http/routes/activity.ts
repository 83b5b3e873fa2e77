/**
 * Activity: /api/plans/:id/activity (JSON), /api/plans/:id/activity.csv and /api/audit.csv.
 */
import { Router, type Response } from "express";
import { idParamSchema } from "@/contracts/common";
import { activityQuerySchema } from "@/contracts/plans";
import { requireRole } from "../../domain/actor";
import { planActivity, planActivityCsvFile, teamAuditCsv } from "../../domain/activity";
import type { RouteContext } from "../context";
import { requireActor } from "../session";
import { parseParams, parseQuery } from "../validate";

function sendCsv(res: Response, filename: string, csv: string): void {
  res.setHeader("Content-Type", "text/csv; charset=utf-8");
  res.setHeader("Content-Disposition", `attachment; filename="${filename}"`);
  res.send(csv);
}

export function activityRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;

  router.get("/plans/:id/activity", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    const { limit } = parseQuery(activityQuerySchema, req);
    res.json(await planActivity(dataSource, actor, id, limit));
  });

  router.get("/plans/:id/activity.csv", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    const { limit } = parseQuery(activityQuerySchema, req);
    const { csv, filename } = await planActivityCsvFile(dataSource, actor, id, limit);
    sendCsv(res, filename, csv);
  });

  router.get("/audit.csv", async (req, res) => {
    const actor = requireActor(res);
    requireRole(actor, "admin", "lead", "reviewer");
    const { limit } = parseQuery(activityQuerySchema, req);
    const day = new Date().toISOString().slice(0, 10);
    sendCsv(res, `spreadsight-audit-${day}.csv`, await teamAuditCsv(dataSource, actor, limit));
  });

  return router;
}

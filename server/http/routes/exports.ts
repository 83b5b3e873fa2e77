/**
 * Exports of a plan (report PDF, station layout CSV, plan document JSON) and the import of a
 * plan document into a site. See docs/api.md "Exports and import".
 */
import { Router } from "express";
import { z } from "zod";
import { idParamSchema } from "@/contracts/common";
import { exportPlanDocument, exportStationsCsv, importPlan } from "../../domain/exports";
import { exportInterpretationCsv } from "../../domain/interpretation-export";
import { planReportPdf } from "../../domain/reports";
import type { RouteContext } from "../context";
import { requireActor } from "../session";
import { noQuerySchema, parseParams, parseQuery } from "../validate";
import { requireCreator } from "../../domain/plans";

const siteParamSchema = z.strictObject({ siteId: z.uuid({ error: "siteId must be a UUID" }) });

/** `?units=metric|imperial` on the report; without it the user's preferred units. */
const reportQuerySchema = z.strictObject({
  units: z.enum(["metric", "imperial"], { error: "units must be metric or imperial" }).optional(),
});

export function exportsRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;

  router.get("/plans/:id/report.pdf", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    const { units } = parseQuery(reportQuerySchema, req);
    const { pdf, fileName } = await planReportPdf(dataSource, actor, id, { units });
    res.setHeader("Content-Type", "application/pdf");
    res.attachment(fileName);
    res.send(pdf);
  });

  router.get("/plans/:id/stations.csv", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    parseQuery(noQuerySchema, req);
    const { csv, fileName } = await exportStationsCsv(dataSource, actor, id);
    res.setHeader("Content-Type", "text/csv; charset=utf-8");
    res.attachment(fileName);
    res.send(csv);
  });

  router.get("/plans/:id/interpretation.csv", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    parseQuery(noQuerySchema, req);
    const { csv, fileName } = await exportInterpretationCsv(dataSource, actor, id);
    res.setHeader("Content-Type", "text/csv; charset=utf-8");
    res.attachment(fileName);
    res.send(csv);
  });

  router.get("/plans/:id/export.json", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    parseQuery(noQuerySchema, req);
    const { document, fileName } = await exportPlanDocument(dataSource, actor, id);
    res.attachment(fileName);
    res.setHeader("Content-Type", "application/json; charset=utf-8");
    res.send(`${JSON.stringify(document, null, 2)}\n`);
  });

  router.post("/sites/:siteId/plans/import", async (req, res) => {
    const actor = requireActor(res);
    requireCreator(actor);
    const { siteId } = parseParams(siteParamSchema, req);
    parseQuery(noQuerySchema, req);
    res.status(201).json(await importPlan(dataSource, actor, siteId, req.body));
  });

  return router;
}

/**
 * Plans, revisions, diff and the review workflow:
 * /api/sites/:siteId/plans and /api/plans/:id… (see docs/api.md "Plans").
 */
import { Router, type Request } from "express";
import { z } from "zod";
import {
  decisionNoteSchema,
  diffQuerySchema,
  planCreateSchema,
  planDuplicateSchema,
  planListQuerySchema,
  planSaveSchema,
  planUpdateSchema,
  requestChangesSchema,
} from "@/contracts/plans";
import { idParamSchema } from "@/contracts/common";
import {
  createPlan,
  duplicatePlan,
  getPlan,
  listPlans,
  requireCreator,
  savePlan,
  updatePlan,
} from "../../domain/plans";
import { diffPlan, getRevision, listRevisions } from "../../domain/revisions";
import { requireStepRole, runStep, type WorkflowStep } from "../../domain/workflow";
import type { RouteContext } from "../context";
import { requireActor } from "../session";
import { noQuerySchema, parseBody, parseParams, parseQuery } from "../validate";

const siteParamSchema = z.strictObject({ siteId: z.uuid({ error: "siteId must be a UUID" }) });
const revisionParamSchema = z.strictObject({
  id: z.uuid({ error: "id must be a UUID" }),
  n: z.coerce
    .number({ error: "revision number must be a number" })
    .int("revision number must be a whole number")
    .min(1, "revision number must be at least 1"),
});

export function plansRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;
  const planId = (req: Request) => parseParams(idParamSchema, req).id;

  router.get("/sites/:siteId/plans", async (req, res) => {
    const actor = requireActor(res);
    const { siteId } = parseParams(siteParamSchema, req);
    const { archived } = parseQuery(planListQuerySchema, req);
    res.json(await listPlans(dataSource, actor, siteId, archived));
  });

  router.post("/sites/:siteId/plans", async (req, res) => {
    const actor = requireActor(res);
    requireCreator(actor);
    const { siteId } = parseParams(siteParamSchema, req);
    const input = parseBody(planCreateSchema, req);
    res.status(201).json(await createPlan(dataSource, actor, siteId, input));
  });

  router.get("/plans/:id", async (req, res) => {
    const actor = requireActor(res);
    const id = planId(req);
    parseQuery(noQuerySchema, req);
    res.json(await getPlan(dataSource, actor, id));
  });

  router.put("/plans/:id", async (req, res) => {
    const actor = requireActor(res);
    requireCreator(actor);
    const id = planId(req);
    const input = parseBody(planSaveSchema, req);
    res.json(await savePlan(dataSource, actor, id, input));
  });

  router.patch("/plans/:id", async (req, res) => {
    const actor = requireActor(res);
    requireCreator(actor);
    const id = planId(req);
    const input = parseBody(planUpdateSchema, req);
    res.json(await updatePlan(dataSource, actor, id, input));
  });

  router.post("/plans/:id/duplicate", async (req, res) => {
    const actor = requireActor(res);
    requireCreator(actor);
    const id = planId(req);
    const input = parseBody(planDuplicateSchema, req);
    res.status(201).json(await duplicatePlan(dataSource, actor, id, input));
  });

  router.get("/plans/:id/revisions", async (req, res) => {
    const actor = requireActor(res);
    const id = planId(req);
    parseQuery(noQuerySchema, req);
    res.json(await listRevisions(dataSource, actor, id));
  });

  router.get("/plans/:id/revisions/:n", async (req, res) => {
    const actor = requireActor(res);
    const { id, n } = parseParams(revisionParamSchema, req);
    parseQuery(noQuerySchema, req);
    res.json(await getRevision(dataSource, actor, id, n));
  });

  router.get("/plans/:id/diff", async (req, res) => {
    const actor = requireActor(res);
    const id = planId(req);
    const { from, to } = parseQuery(diffQuerySchema, req);
    res.json(await diffPlan(dataSource, actor, id, from, to));
  });

  const steps: { path: string; step: WorkflowStep; schema: z.ZodType<{ note?: string }> }[] = [
    { path: "submit", step: "submit", schema: decisionNoteSchema },
    { path: "approve", step: "approve", schema: decisionNoteSchema },
    { path: "request-changes", step: "request-changes", schema: requestChangesSchema },
    { path: "reopen", step: "reopen", schema: z.strictObject({}) },
  ];
  for (const { path, step, schema } of steps) {
    router.post(`/plans/:id/${path}`, async (req, res) => {
      const actor = requireActor(res);
      requireStepRole(actor, step);
      const id = planId(req);
      const { note } = parseBody(schema, req);
      res.json(await runStep(ctx.services, actor, id, step, note));
    });
  }

  return router;
}

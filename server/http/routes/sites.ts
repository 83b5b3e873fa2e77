/** /api/sites: every role reads; lead and admin create, rename, describe and archive. */
import { Router } from "express";
import { idParamSchema } from "@/contracts/common";
import { siteCreateSchema, siteListQuerySchema, siteUpdateSchema } from "@/contracts/sites";
import { requirePermission } from "../../domain/actor";
import { createSite, getSite, listSites, updateSite } from "../../domain/sites";
import type { RouteContext } from "../context";
import { requireActor } from "../session";
import { noQuerySchema, parseBody, parseParams, parseQuery } from "../validate";

export function sitesRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;

  router.get("/", async (req, res) => {
    const actor = requireActor(res);
    const { archived } = parseQuery(siteListQuerySchema, req);
    res.json(await listSites(dataSource, actor, archived));
  });

  router.get("/:id", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    parseQuery(noQuerySchema, req);
    res.json(await getSite(dataSource, actor, id));
  });

  router.post("/", async (req, res) => {
    const actor = requireActor(res);
    requirePermission(actor, "editSites");
    const input = parseBody(siteCreateSchema, req);
    res.status(201).json(await createSite(dataSource, actor, input));
  });

  router.patch("/:id", async (req, res) => {
    const actor = requireActor(res);
    requirePermission(actor, "editSites");
    const { id } = parseParams(idParamSchema, req);
    const input = parseBody(siteUpdateSchema, req);
    res.json(await updateSite(dataSource, actor, id, input));
  });

  return router;
}

/** /api/me: who am I, and my preferences. */
import { Router } from "express";
import { preferencesSchema } from "@/contracts/auth";
import { meResponse, savePreferences } from "../../domain/me";
import type { RouteContext } from "../context";
import { requireActor } from "../session";
import { noQuerySchema, parseBody, parseQuery } from "../validate";

export function meRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;

  router.get("/", async (req, res) => {
    const actor = requireActor(res);
    parseQuery(noQuerySchema, req);
    res.json(await meResponse(dataSource, actor, ctx.flags));
  });

  router.put("/preferences", async (req, res) => {
    const actor = requireActor(res);
    const preferences = parseBody(preferencesSchema, req);
    await savePreferences(dataSource, actor, preferences);
    res.json(preferences);
  });

  return router;
}

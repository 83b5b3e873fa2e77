/** Comments: /api/plans/:id/comments and /api/comments/:id (see docs/api.md "Comments"). */
import { Router } from "express";
import { idParamSchema } from "@/contracts/common";
import {
  commentCreateSchema,
  commentListQuerySchema,
  commentUpdateSchema,
} from "@/contracts/plans";
import {
  createComment,
  listComments,
  requireMayComment,
  setThreadResolved,
} from "../../domain/comments";
import type { RouteContext } from "../context";
import { requireActor } from "../session";
import { parseBody, parseParams, parseQuery } from "../validate";

export function commentsRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;

  router.get("/plans/:id/comments", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    const { revision } = parseQuery(commentListQuerySchema, req);
    res.json(await listComments(dataSource, actor, id, revision));
  });

  router.post("/plans/:id/comments", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    await requireMayComment(dataSource, actor, id);
    const input = parseBody(commentCreateSchema, req);
    res.status(201).json(await createComment(ctx.services, actor, id, input));
  });

  router.patch("/comments/:id", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    const { resolved } = parseBody(commentUpdateSchema, req);
    res.json(await setThreadResolved(dataSource, actor, id, resolved));
  });

  return router;
}

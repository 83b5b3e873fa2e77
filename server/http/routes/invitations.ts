/** /api/invitations: admins invite; the public token routes let the invitee accept. */
import { Router } from "express";
import { acceptInvitationSchema, inviteSchema } from "@/contracts/auth";
import { idParamSchema } from "@/contracts/common";
import { requirePermission } from "../../domain/actor";
import {
  acceptInvitation,
  createInvitation,
  listPendingInvitations,
  previewInvitation,
  revokeInvitation,
} from "../../domain/invitations";
import { loadActor, meResponse } from "../../domain/me";
import { AppError } from "../../domain/errors";
import type { RouteContext } from "../context";
import { requireActor } from "../session";
import { noQuerySchema, parseBody, parseParams, parseQuery, tokenParamSchema } from "../validate";

export function invitationsRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;

  router.get("/", async (req, res) => {
    const actor = requireActor(res);
    requirePermission(actor, "manageTeam");
    parseQuery(noQuerySchema, req);
    res.json(await listPendingInvitations(dataSource, actor));
  });

  router.post("/", async (req, res) => {
    const actor = requireActor(res);
    requirePermission(actor, "manageTeam");
    const input = parseBody(inviteSchema, req);
    res.status(201).json(await createInvitation(ctx.services, actor, input));
  });

  router.delete("/:id", async (req, res) => {
    const actor = requireActor(res);
    requirePermission(actor, "manageTeam");
    const { id } = parseParams(idParamSchema, req);
    await revokeInvitation(dataSource, actor, id);
    res.status(204).end();
  });

  router.get("/token/:token", async (req, res) => {
    const { token } = parseParams(tokenParamSchema, req);
    res.json(await previewInvitation(dataSource, token));
  });

  router.post("/token/:token/accept", async (req, res) => {
    const { token } = parseParams(tokenParamSchema, req);
    const input = parseBody(acceptInvitationSchema, req);
    const userId = await acceptInvitation(dataSource, token, input);
    const actor = await loadActor(dataSource, userId);
    if (!actor) throw new AppError(500, "internal", "the new membership could not be read back");
    await ctx.sessions.signIn(req, res, userId);
    res.status(201).json(await meResponse(dataSource, actor, ctx.flags));
  });

  return router;
}

/** /api/team: the member list and the team settings (every role reads them) and admin changes. */
import { Router } from "express";
import { changeRoleSchema, teamSettingsUpdateSchema } from "@/contracts/team";
import { requirePermission } from "../../domain/actor";
import {
  changeRole,
  getTeamSettings,
  listMembers,
  removeMember,
  updateTeamSettings,
} from "../../domain/team";
import type { RouteContext } from "../context";
import { requireActor } from "../session";
import { noQuerySchema, parseBody, parseParams, parseQuery, userIdParamSchema } from "../validate";

export function teamRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;

  router.get("/members", async (req, res) => {
    const actor = requireActor(res);
    parseQuery(noQuerySchema, req);
    res.json(await listMembers(dataSource, actor));
  });

  router.patch("/members/:userId", async (req, res) => {
    const actor = requireActor(res);
    requirePermission(actor, "manageTeam");
    const { userId } = parseParams(userIdParamSchema, req);
    const { role } = parseBody(changeRoleSchema, req);
    res.json(await changeRole(dataSource, actor, userId, role));
  });

  router.delete("/members/:userId", async (req, res) => {
    const actor = requireActor(res);
    requirePermission(actor, "manageTeam");
    const { userId } = parseParams(userIdParamSchema, req);
    await removeMember(dataSource, actor, userId);
    res.status(204).end();
  });

  router.get("/settings", async (req, res) => {
    const actor = requireActor(res);
    parseQuery(noQuerySchema, req);
    res.json(await getTeamSettings(dataSource, actor));
  });

  router.patch("/settings", async (req, res) => {
    const actor = requireActor(res);
    requirePermission(actor, "manageTeam");
    const input = parseBody(teamSettingsUpdateSchema, req);
    res.json(await updateTeamSettings(dataSource, actor, input));
  });

  return router;
}

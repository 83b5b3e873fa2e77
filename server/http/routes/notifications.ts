/**
 * The in-app inbox (/api/notifications) and the e-mail settings
 * (/api/me/notification-settings). Every member has both; each sees only their own.
 */
import { Router } from "express";
import { idParamSchema } from "@/contracts/common";
import { notificationListQuerySchema, notificationSettingsSchema } from "@/contracts/plans";
import {
  getNotificationSettings,
  listNotifications,
  markAllRead,
  markRead,
  saveNotificationSettings,
} from "../../domain/notifications";
import type { RouteContext } from "../context";
import { requireActor } from "../session";
import { noQuerySchema, parseBody, parseParams, parseQuery } from "../validate";

export function notificationsRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;

  router.get("/notifications", async (req, res) => {
    const actor = requireActor(res);
    const { unread, limit } = parseQuery(notificationListQuerySchema, req);
    res.json(await listNotifications(dataSource, actor, { unread: unread === "true", limit }));
  });

  router.post("/notifications/read-all", async (req, res) => {
    const actor = requireActor(res);
    parseBody(noQuerySchema, req);
    res.json({ marked: await markAllRead(dataSource, actor) });
  });

  router.post("/notifications/:id/read", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    parseBody(noQuerySchema, req);
    res.json(await markRead(dataSource, actor, id));
  });

  router.get("/me/notification-settings", async (req, res) => {
    const actor = requireActor(res);
    parseQuery(noQuerySchema, req);
    res.json(await getNotificationSettings(dataSource, actor));
  });

  router.put("/me/notification-settings", async (req, res) => {
    const actor = requireActor(res);
    const settings = parseBody(notificationSettingsSchema, req);
    res.json(await saveNotificationSettings(dataSource, actor, settings));
  });

  return router;
}

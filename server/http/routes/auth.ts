/** /api/auth: sign in, sign out, password reset. */
import { Router } from "express";
import {
  completeResetSchema,
  requestResetSchema,
  signInSchema,
  signOutSchema,
} from "@/contracts/auth";
import { AppError } from "../../domain/errors";
import {
  completePasswordReset,
  recordSignIn,
  requestPasswordReset,
  verifyCredentials,
} from "../../domain/auth";
import { meResponse } from "../../domain/me";
import type { RouteContext } from "../context";
import { assertNotLimited } from "../rate-limit";
import { parseBody, parseParams, tokenParamSchema } from "../validate";

export function authRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;
  const { signInPerAccount, signInPerIp, passwordResetPerIp } = ctx.limiters;

  router.post("/sign-in", async (req, res) => {
    const input = parseBody(signInSchema, req);
    const ip = req.ip ?? "unknown";
    assertNotLimited([
      [signInPerIp, ip],
      [signInPerAccount, input.email],
    ]);
    let actor;
    try {
      actor = await verifyCredentials(dataSource, input.email, input.password);
    } catch (error) {
      if (error instanceof AppError && error.status === 401) {
        signInPerIp.hit(ip);
        signInPerAccount.hit(input.email);
      }
      throw error;
    }
    signInPerAccount.reset(input.email);
    await ctx.sessions.signIn(req, res, actor.userId);
    await recordSignIn(dataSource, actor, req.ip);
    res.status(200).json(await meResponse(dataSource, actor, ctx.flags));
  });

  router.post("/sign-out", async (req, res) => {
    parseBody(signOutSchema, req);
    await ctx.sessions.signOut(req, res);
    res.status(204).end();
  });

  router.post("/password-reset", async (req, res) => {
    const ip = req.ip ?? "unknown";
    assertNotLimited([[passwordResetPerIp, ip]]);
    const { email } = parseBody(requestResetSchema, req);
    passwordResetPerIp.hit(ip);
    await requestPasswordReset(ctx.services, email);
    res.status(202).json({ ok: true });
  });

  router.post("/password-reset/:token", async (req, res) => {
    const { token } = parseParams(tokenParamSchema, req);
    const { password } = parseBody(completeResetSchema, req);
    // Ends every session of that account; a stale cookie is cleared on its next request.
    await completePasswordReset(dataSource, token, password);
    res.status(204).end();
  });

  return router;
}

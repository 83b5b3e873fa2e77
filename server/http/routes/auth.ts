/** /api/auth: sign in, sign out, password reset. */
import { Router } from "express";
import {
  completeResetSchema,
  requestResetSchema,
  signInSchema,
  signOutSchema,
} from "@/contracts/auth";
import {
  completePasswordReset,
  recordSignIn,
  requestPasswordReset,
  verifyCredentials,
} from "../../domain/auth";
import { meResponse } from "../../domain/me";
import type { RouteContext } from "../context";
import { reserveReset } from "../rate-limit";
import { parseBody, parseParams, tokenParamSchema } from "../validate";

export function authRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;
  const { signIn: guard, store, config } = ctx.limits;

  router.post("/sign-in", async (req, res) => {
    const input = parseBody(signInSchema, req);
    const ip = req.ip ?? "unknown";
    // The attempt is counted before the password is hashed: parallel guesses cannot outrun it.
    await guard.reserve(input.email, ip);
    const actor = await verifyCredentials(dataSource, input.email, input.password);
    await guard.succeeded(input.email, ip);
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
    const { email } = parseBody(requestResetSchema, req);
    await reserveReset(store, config, ip);
    // The look-up, the token and the e-mail happen after the answer, which therefore takes
    // the same time for every address.
    ctx.background.run("password reset", async () => {
      const { sent } = await requestPasswordReset(ctx.services, email);
      await sent;
    });
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

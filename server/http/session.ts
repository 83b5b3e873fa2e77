/**
 * lucia sessions in an httpOnly, SameSite=Lax cookie. Secure is set per response when the
 * request came over HTTPS (req.secure, which honours `trust proxy`) or PUBLIC_URL is https.
 */
import type { Request, RequestHandler, Response } from "express";
import { Cookie, Lucia, TimeSpan } from "lucia";
import type { DataSource } from "typeorm";
import { TypeormLuciaAdapter } from "../data/lucia-adapter";
import type { Actor } from "../domain/actor";
import { unauthenticated } from "../domain/errors";
import { loadActor } from "../domain/me";

export const SESSION_COOKIE = "spreadsight_session";

export function createLucia(dataSource: DataSource): Lucia {
  return new Lucia(new TypeormLuciaAdapter(dataSource), {
    sessionExpiresIn: new TimeSpan(30, "d"),
    sessionCookie: {
      name: SESSION_COOKIE,
      attributes: { sameSite: "lax", path: "/", secure: false },
    },
  });
}

export interface SessionTools {
  lucia: Lucia;
  /** Starts a session for the user and sets the cookie on the response. */
  signIn(req: Request, res: Response, userId: string): Promise<void>;
  /** Ends the request's session (if any) and clears the cookie. */
  signOut(req: Request, res: Response): Promise<void>;
  /** Reads the cookie, validates the session and puts the Actor in res.locals. */
  middleware: RequestHandler;
}

export function sessionTools(dataSource: DataSource, options: { publicUrl: string }): SessionTools {
  const lucia = createLucia(dataSource);
  const httpsPublicUrl = options.publicUrl.startsWith("https:");
  const send = (req: Request, res: Response, cookie: Cookie) => {
    const secure = httpsPublicUrl || req.secure;
    const attributes = { ...cookie.attributes, httpOnly: true, sameSite: "lax" as const, secure };
    res.append("Set-Cookie", new Cookie(cookie.name, cookie.value, attributes).serialize());
  };

  return {
    lucia,
    async signIn(req, res, userId) {
      const previous = res.locals.sessionId as string | undefined;
      if (previous) await lucia.invalidateSession(previous);
      const session = await lucia.createSession(userId, {});
      send(req, res, lucia.createSessionCookie(session.id));
    },
    async signOut(req, res) {
      const sessionId =
        (res.locals.sessionId as string | undefined) ??
        lucia.readSessionCookie(req.headers.cookie ?? "");
      if (sessionId) await lucia.invalidateSession(sessionId);
      send(req, res, lucia.createBlankSessionCookie());
    },
    middleware: async (req, res, next) => {
      const sessionId = lucia.readSessionCookie(req.headers.cookie ?? "");
      if (!sessionId) {
        next();
        return;
      }
      const { session, user } = await lucia.validateSession(sessionId);
      if (!session) {
        send(req, res, lucia.createBlankSessionCookie());
        next();
        return;
      }
      const actor = await loadActor(dataSource, user.id);
      if (!actor) {
        // Membership removed: the session is worthless.
        await lucia.invalidateSession(session.id);
        send(req, res, lucia.createBlankSessionCookie());
        next();
        return;
      }
      if (session.fresh) send(req, res, lucia.createSessionCookie(session.id));
      res.locals.actor = actor;
      res.locals.sessionId = session.id;
      next();
    },
  };
}

/** The signed-in member, or 401 `unauthenticated`. */
export function requireActor(res: Response): Actor {
  const actor = res.locals.actor as Actor | undefined;
  if (!actor) throw unauthenticated();
  return actor;
}

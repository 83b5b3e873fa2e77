/**
 * Cross-site request forgery guard for state-changing requests (POST, PUT, PATCH, DELETE):
 *
 * - an Origin header, when present, must name this server, scheme included: it must equal the
 *   request's own origin (its scheme, which honours `trust proxy`, and its Host header) or the
 *   origin of PUBLIC_URL (or one of `extraOrigins`); otherwise 403 `bad_origin`. So
 *   `http://host` is refused by a server whose public URL is `https://host`;
 * - a request without Origin is allowed only when it carries no session cookie (a script or
 *   test client acting for itself); with a session cookie it gets 403 `origin_required`,
 *   since every current browser sends Origin on these methods.
 *
 * GET, HEAD and OPTIONS never change anything and pass.
 */
import type { RequestHandler } from "express";
import { AppError } from "../domain/errors";
import { SESSION_COOKIE } from "./session";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/** "scheme://host[:port]" in lower case with default ports dropped, or null. */
function originOf(url: string): string | null {
  try {
    const parsed = new URL(url);
    if (parsed.protocol !== "http:" && parsed.protocol !== "https:") return null;
    return parsed.origin.toLowerCase();
  } catch {
    return null;
  }
}

export function originCheck(options: {
  publicUrl: string;
  extraOrigins?: string[];
}): RequestHandler {
  const fixedOrigins = [options.publicUrl, ...(options.extraOrigins ?? [])]
    .map(originOf)
    .filter((h): h is string => h !== null);
  const cookiePattern = new RegExp(`(?:^|;)\\s*${SESSION_COOKIE}=`);

  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) {
      next();
      return;
    }
    const origin = req.headers.origin;
    if (origin === undefined) {
      if (cookiePattern.test(req.headers.cookie ?? "")) {
        next(
          new AppError(
            403,
            "origin_required",
            "state-changing requests must send an Origin header",
          ),
        );
        return;
      }
      next();
      return;
    }
    const originValue = originOf(origin);
    const requestOrigin = req.headers.host
      ? originOf(`${req.protocol}://${req.headers.host}`)
      : null;
    if (originValue && (originValue === requestOrigin || fixedOrigins.includes(originValue))) {
      next();
      return;
    }
    next(new AppError(403, "bad_origin", "the request's Origin does not match this server"));
  };
}

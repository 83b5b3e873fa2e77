/**
 * Cross-site request forgery guard for state-changing requests (POST, PUT, PATCH, DELETE):
 *
 * - an Origin header, when present, must name this server: its host must equal the request's
 *   Host header or the host of PUBLIC_URL (or one of `extraOrigins`); otherwise 403 `bad_origin`;
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

function hostOf(url: string): string | null {
  try {
    return new URL(url).host.toLowerCase();
  } catch {
    return null;
  }
}

export function originCheck(options: {
  publicUrl: string;
  extraOrigins?: string[];
}): RequestHandler {
  const fixedHosts = [options.publicUrl, ...(options.extraOrigins ?? [])]
    .map(hostOf)
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
    const originHost = hostOf(origin);
    const requestHost = req.headers.host?.toLowerCase();
    if (originHost && (originHost === requestHost || fixedHosts.includes(originHost))) {
      next();
      return;
    }
    next(new AppError(403, "bad_origin", "the request's Origin does not match this server"));
  };
}

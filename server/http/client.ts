/**
 * Serves the built client (dist/) with a fallback to index.html for the app's own routes.
 * Content-hashed files under assets/ are cached for a year as immutable; index.html is
 * revalidated. Source maps (*.map) are never served, even when the build left some behind:
 * they would publish the client's source.
 */
import express, { type RequestHandler, type Router } from "express";
import { existsSync } from "node:fs";
import { join } from "node:path";

/** Null when `dir` holds no index.html (client not built). */
export function clientRouter(dir: string): Router | null {
  const indexHtml = join(dir, "index.html");
  if (!existsSync(indexHtml)) return null;
  const router = express.Router();
  const noSourceMaps: RequestHandler = (req, res, next) => {
    let path = req.path;
    try {
      path = decodeURIComponent(path);
    } catch {
      // express.static refuses a malformed path itself.
    }
    if (/\.map$/i.test(path.trim())) {
      res.status(404).type("text/plain").send("Not found");
      return;
    }
    next();
  };
  router.use(noSourceMaps);
  // Vite puts content-hashed files under assets/: cache them for a year.
  router.use(
    "/assets",
    express.static(join(dir, "assets"), { immutable: true, maxAge: "365d", fallthrough: true }),
  );
  router.use(express.static(dir, { index: false }));
  const spaFallback: RequestHandler = (req, res, next) => {
    if ((req.method !== "GET" && req.method !== "HEAD") || req.path.startsWith("/api/")) {
      next();
      return;
    }
    res.setHeader("Cache-Control", "no-cache");
    res.sendFile(indexHtml);
  };
  router.use(spaFallback);
  return router;
}

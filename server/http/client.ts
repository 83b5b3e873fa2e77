/** Serves the built client (dist/) with a fallback to index.html for the app's own routes. */
import express, { type RequestHandler, type Router } from "express";
import { existsSync } from "node:fs";
import { join } from "node:path";

/** Null when `dir` holds no index.html (client not built). */
export function clientRouter(dir: string): Router | null {
  const indexHtml = join(dir, "index.html");
  if (!existsSync(indexHtml)) return null;
  const router = express.Router();
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

/** One log line per request: method, url, status, milliseconds. */
import type { RequestHandler } from "express";
import type { Logger } from "pino";

export function requestLog(logger: Logger): RequestHandler {
  return (req, res, next) => {
    const started = process.hrtime.bigint();
    res.on("finish", () => {
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      const entry = {
        method: req.method,
        url: req.originalUrl,
        status: res.statusCode,
        ms: Math.round(ms * 10) / 10,
      };
      if (res.statusCode >= 500) logger.error(entry, "request");
      else logger.info(entry, "request");
    });
    next();
  };
}

/** The one error middleware, and the JSON 404 for unknown /api routes. */
import type { ErrorRequestHandler, RequestHandler } from "express";
import type { Logger } from "pino";
import { ZodError } from "zod";
import type { ApiErrorBody } from "@/contracts/common";
import { AppError, invalidInput } from "../domain/errors";

interface HttpLikeError {
  type?: string;
  status?: number;
  statusCode?: number;
  expose?: boolean;
  message?: string;
}

/** Maps body-parser failures to our codes. */
function fromHttpError(error: HttpLikeError): AppError | null {
  switch (error.type) {
    case "entity.parse.failed":
      return new AppError(400, "malformed_json", "the request body is not valid JSON");
    case "entity.too.large":
      return new AppError(413, "payload_too_large", "the request body is too large (limit 1 MB)");
    case "encoding.unsupported":
    case "charset.unsupported":
      return new AppError(415, "unsupported_media_type", "send the body as UTF-8 JSON");
    case "request.aborted":
      return new AppError(400, "request_aborted", "the request was aborted");
  }
  const status = error.status ?? error.statusCode;
  if (typeof status === "number" && status >= 400 && status < 500) {
    return new AppError(
      status,
      "bad_request",
      error.expose && error.message ? error.message : "bad request",
    );
  }
  return null;
}

export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err: unknown, req, res, next) => {
    if (res.headersSent) {
      next(err);
      return;
    }
    let appError: AppError | null = null;
    if (err instanceof AppError) appError = err;
    else if (err instanceof ZodError) appError = invalidInput(err, "input");
    else if (err && typeof err === "object") appError = fromHttpError(err as HttpLikeError);
    if (!appError) {
      logger.error({ err, method: req.method, url: req.originalUrl }, "unhandled error");
      appError = new AppError(500, "internal", "something went wrong on the server");
    }
    const body: ApiErrorBody = { error: { code: appError.code, message: appError.message } };
    if (appError.fields) body.error.fields = appError.fields;
    for (const [name, value] of Object.entries(appError.headers ?? {})) res.setHeader(name, value);
    res.status(appError.status).json(body);
  };
}

/** Anything under /api that no router answered. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(
    new AppError(404, "not_found", `no API route ${req.method} ${req.originalUrl.split("?")[0]}`),
  );
};

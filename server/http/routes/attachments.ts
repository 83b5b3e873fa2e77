/**
 * Field data of a plan: uploads (multipart, see `attachmentUploadRouter`), the list, a file's
 * content, deletion, and the saved first-break picks. See docs/api.md "Field check".
 */
import { Router, type RequestHandler } from "express";
import multer from "multer";
import { idParamSchema } from "@/contracts/common";
import { ATTACHMENT_LIMITS, attachmentFieldsSchema, picksSaveSchema } from "@/contracts/field";
import {
  attachmentContent,
  deleteAttachment,
  getPicks,
  listAttachments,
  requireFieldRole,
  savePicks,
  uploadAttachment,
  type UploadedFile,
} from "../../domain/attachments";
import { AppError, invalidInput } from "../../domain/errors";
import type { RouteContext } from "../context";
import { originCheck } from "../origin";
import { requireActor } from "../session";
import { noQuerySchema, parseBody, parseParams, parseQuery } from "../validate";

/** Largest upload of any kind; each kind's own limit is checked after (ATTACHMENT_LIMITS). */
const MAX_UPLOAD = Math.max(...Object.values(ATTACHMENT_LIMITS));

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_UPLOAD, files: 1, fields: 8, fieldSize: 1024, parts: 10 },
});

/** multer's single-file parser with its errors turned into our JSON errors. */
const receiveFile: RequestHandler = (req, res, next) => {
  upload.single("file")(req, res, (error: unknown) => {
    if (!error) {
      next();
      return;
    }
    if (error instanceof multer.MulterError) {
      if (error.code === "LIMIT_FILE_SIZE") {
        const message = `the file is larger than ${MAX_UPLOAD / (1024 * 1024)} MB, the most any upload may be`;
        next(new AppError(413, "file_too_large", message, { file: [message] }));
        return;
      }
      const message =
        error.code === "LIMIT_UNEXPECTED_FILE" || error.code === "LIMIT_FILE_COUNT"
          ? `send exactly one file, in the form field "file"`
          : `the upload form is not acceptable (${error.message.toLowerCase()})`;
      next(new AppError(400, "invalid_input", `invalid body: ${message}`, { file: [message] }));
      return;
    }
    const status = (error as { status?: number }).status;
    next(
      new AppError(
        status && status >= 400 && status < 500 ? status : 400,
        "invalid_input",
        "invalid body: the multipart form could not be read",
        { file: ["the multipart form could not be read"] },
      ),
    );
  });
};

/** Only multipart/form-data reaches multer; anything else is 415 like every other route. */
const multipartOnly: RequestHandler = (req, _res, next) => {
  if (!req.is("multipart/form-data")) {
    next(
      new AppError(
        415,
        "unsupported_media_type",
        "send the upload as multipart/form-data with a file field named file",
      ),
    );
    return;
  }
  next();
};

/**
 * POST /api/plans/:id/attachments. Mounted on the app ahead of the JSON API router (whose
 * body check accepts JSON only); runs the same Origin check and session middleware itself.
 */
export function attachmentUploadRouter(
  ctx: RouteContext,
  options: { publicUrl: string; extraOrigins?: string[] },
): Router {
  const router = Router();
  const { dataSource } = ctx.services;
  router.post(
    "/plans/:id/attachments",
    (_req, res, next) => {
      res.setHeader("Cache-Control", "no-store");
      next();
    },
    originCheck(options),
    ctx.sessions.middleware,
    (req, res, next) => {
      const actor = requireActor(res);
      requireFieldRole(actor);
      parseParams(idParamSchema, req);
      parseQuery(noQuerySchema, req);
      next();
    },
    multipartOnly,
    receiveFile,
    async (req, res) => {
      const actor = requireActor(res);
      const { id } = parseParams(idParamSchema, req);
      const parsed = attachmentFieldsSchema.safeParse({ ...(req.body ?? {}) });
      if (!parsed.success) throw invalidInput(parsed.error, "body");
      const file = req.file as UploadedFile | undefined;
      res.status(201).json(await uploadAttachment(dataSource, actor, id, parsed.data, file));
    },
  );
  return router;
}

/** The JSON routes of field data (mounted inside /api). */
export function attachmentsRouter(ctx: RouteContext): Router {
  const router = Router();
  const { dataSource } = ctx.services;

  router.get("/plans/:id/attachments", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    parseQuery(noQuerySchema, req);
    res.json(await listAttachments(dataSource, actor, id));
  });

  router.get("/attachments/:id/content", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    parseQuery(noQuerySchema, req);
    const { summary, content } = await attachmentContent(dataSource, actor, id);
    res.setHeader("Content-Type", summary.mediaType);
    res.setHeader("X-Content-Type-Options", "nosniff");
    res.attachment(summary.fileName);
    res.send(content);
  });

  router.delete("/attachments/:id", async (req, res) => {
    const actor = requireActor(res);
    requireFieldRole(actor);
    const { id } = parseParams(idParamSchema, req);
    await deleteAttachment(dataSource, actor, id);
    res.status(204).end();
  });

  router.get("/plans/:id/picks", async (req, res) => {
    const actor = requireActor(res);
    const { id } = parseParams(idParamSchema, req);
    parseQuery(noQuerySchema, req);
    res.json(await getPicks(dataSource, actor, id));
  });

  router.put("/plans/:id/picks", async (req, res) => {
    const actor = requireActor(res);
    requireFieldRole(actor);
    const { id } = parseParams(idParamSchema, req);
    const input = parseBody(picksSaveSchema, req);
    res.json(await savePicks(dataSource, actor, id, input));
  });

  return router;
}

/**
 * Field data of a plan: uploads (multipart, see `attachmentUploadRouter`), the list, a file's
 * content, deletion, and the saved first-break picks. See docs/api.md "Field check".
 */
import { pipeline } from "node:stream/promises";
import { Router, type RequestHandler } from "express";
import multer from "multer";
import { idParamSchema } from "@/contracts/common";
import {
  ATTACHMENT_KIND_LABELS,
  ATTACHMENT_LIMITS,
  attachmentFieldsSchema,
  interpretationSaveSchema,
  picksSaveSchema,
  type AttachmentKind,
} from "@/contracts/field";
import {
  attachmentContent,
  deleteAttachment,
  getPicks,
  listAttachments,
  requireFieldEditor,
  requireFieldRole,
  saveInterpretationChoices,
  savePicks,
  uploadAttachment,
  type UploadedFile,
} from "../../domain/attachments";
import { AppError, invalidInput } from "../../domain/errors";
import { findVisiblePlan } from "../../domain/plan-visibility";
import type { RouteContext } from "../context";
import { originCheck } from "../origin";
import { requireActor } from "../session";
import { noQuerySchema, parseBody, parseParams, parseQuery } from "../validate";

/** Largest upload of any kind; each kind's own limit is checked after (ATTACHMENT_LIMITS). */
const MAX_UPLOAD = Math.max(...Object.values(ATTACHMENT_LIMITS));

/** Room for the multipart framing and the small text fields around the file. */
const FORM_OVERHEAD = 64 * 1024;

const isKind = (value: unknown): value is AttachmentKind =>
  typeof value === "string" && Object.hasOwn(ATTACHMENT_LIMITS, value);

/**
 * multer's memory storage, but the file is refused (413) as soon as it outgrows its kind's
 * limit when the form's `kind` field came before the file (the client sends it first), and the
 * largest limit of any kind otherwise; the rest of the upload is then discarded unread.
 *
 * When the request declares its length, the file is written into one buffer of that size on a
 * SharedArrayBuffer: no list of chunks joined at the end (which held the file twice), and the
 * worker-thread pool reads the same memory instead of a copy.
 */
const kindAwareMemory: multer.StorageEngine = {
  _handleFile(req, file, callback) {
    const kind = (req.body as Record<string, unknown> | undefined)?.kind;
    const limit = isKind(kind) ? ATTACHMENT_LIMITS[kind] : MAX_UPLOAD;
    const declared = Number(req.headers["content-length"]);
    let target: Buffer | null =
      Number.isFinite(declared) && declared > 0
        ? Buffer.from(new SharedArrayBuffer(Math.min(declared, limit + 1)))
        : null;
    const chunks: Buffer[] = [];
    let size = 0;
    let finished = false;
    const finish = (error: Error | null, info?: Partial<Express.Multer.File>) => {
      if (finished) return;
      finished = true;
      callback(error, info);
    };
    file.stream.on("data", (chunk: Buffer) => {
      if (finished) return;
      if (size + chunk.length > limit) {
        const what = isKind(kind)
          ? `a ${ATTACHMENT_KIND_LABELS[kind].toLowerCase()}`
          : "any upload";
        const message = `the file is larger than ${limit / (1024 * 1024)} MB, the most ${what} may be`;
        chunks.length = 0;
        target = null;
        file.stream.resume();
        finish(new AppError(413, "file_too_large", message, { file: [message] }));
        return;
      }
      if (target && size + chunk.length <= target.length) chunk.copy(target, size);
      else {
        // No declared length (or a wrong one): keep the chunks and join them at the end.
        if (target) chunks.push(target.subarray(0, size));
        target = null;
        chunks.push(chunk);
      }
      size += chunk.length;
    });
    file.stream.on("error", (error: Error) => finish(error));
    file.stream.on("end", () => {
      const buffer = target ? target.subarray(0, size) : Buffer.concat(chunks, size);
      finish(null, { buffer, size });
    });
  },
  _removeFile(_req, file, callback) {
    (file as { buffer?: Buffer }).buffer = undefined;
    callback(null);
  },
};

const upload = multer({
  storage: kindAwareMemory,
  limits: { fileSize: MAX_UPLOAD, files: 1, fields: 8, fieldSize: 1024, parts: 10 },
});

/** multer's single-file parser with its errors turned into our JSON errors. */
const receiveFile: RequestHandler = (req, res, next) => {
  upload.single("file")(req, res, (error: unknown) => {
    if (!error) {
      next();
      return;
    }
    if (error instanceof AppError) {
      next(error);
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
    // Cheap checks before a byte of the body is read: role, the plan (visible, editable, not
    // archived), the media type and the declared length.
    async (req, res, next) => {
      const actor = requireActor(res);
      requireFieldRole(actor);
      const { id } = parseParams(idParamSchema, req);
      parseQuery(noQuerySchema, req);
      const plan = await findVisiblePlan(dataSource.manager, actor, id);
      requireFieldEditor(actor, plan);
      const declared = Number(req.headers["content-length"]);
      if (Number.isFinite(declared) && declared > MAX_UPLOAD + FORM_OVERHEAD) {
        const message = `the file is larger than ${MAX_UPLOAD / (1024 * 1024)} MB, the most any upload may be`;
        res.setHeader("Connection", "close");
        throw new AppError(413, "file_too_large", message, { file: [message] });
      }
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
    res.setHeader("Content-Length", String(summary.size));
    // Streamed from the database row or the object store, never buffered whole here.
    await pipeline(content, res);
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

  router.put("/plans/:id/picks/interpretation", async (req, res) => {
    const actor = requireActor(res);
    requireFieldRole(actor);
    const { id } = parseParams(idParamSchema, req);
    const { interpretation } = parseBody(interpretationSaveSchema, req);
    res.json(await saveInterpretationChoices(dataSource, actor, id, interpretation));
  });

  return router;
}

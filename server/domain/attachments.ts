/**
 * Field uploads of a plan: borehole or probe logs and first-break picks as CSV, and SEG-2 shot
 * records. A file is stored only after its content check passed, in one transaction with its
 * audit row, against the plan's latest revision; a refused file writes nothing.
 *
 * Who may do what (design.md): whoever may edit the plan's content uploads and deletes (admin
 * and lead on team plans, the author on a sandbox plan); everyone who sees the plan reads.
 * Uploads are field data, so they are accepted in every status but archived.
 */
import { createHash, randomUUID } from "node:crypto";
import type { Readable } from "node:stream";
import type { DataSource, EntityManager } from "typeorm";
import type { z } from "zod";
import {
  ATTACHMENT_EXTENSIONS,
  ATTACHMENT_KIND_LABELS,
  ATTACHMENT_LIMITS,
  type AttachmentFields,
  type AttachmentKind,
  type AttachmentSummary,
  type AttachmentUploadResponse,
  type InterpretationChoices,
  type PickSetView,
  type picksSaveSchema,
} from "@/contracts/field";
import { Attachment } from "../data/entities/attachment";
import { PickSet } from "../data/entities/pick-set";
import type { Plan } from "../data/entities/plan";
import { PlanRevision } from "../data/entities/plan-revision";
import { fileStoreOf, readAttachmentBytes, removeObjectsQuietly } from "../data/file-store";
import { inTransaction } from "../data/transaction";
import type { Actor } from "./actor";
import { cleanFileName, type CheckedContent } from "./attachment-content";
import { recordAudit } from "./audit";
import { AppError, forbidden, notFound } from "./errors";
import { canEditPlan, findVisiblePlan } from "./plan-visibility";
import { runTask } from "../workers/pool";

export { checkContent, cleanFileName, csvText } from "./attachment-content";

export type PicksSaveOutput = z.output<typeof picksSaveSchema>;

/** A file as multer hands it over (memory storage). */
export interface UploadedFile {
  originalname: string;
  mimetype: string;
  size: number;
  buffer: Buffer;
}

/** 403 unless the actor may change the plan's field data; 409 for an archived plan. */
export function requireFieldEditor(actor: Actor, plan: Plan): void {
  if (!canEditPlan(actor, plan)) {
    throw forbidden(
      plan.sandbox
        ? "this is another member's sandbox plan: you may read its field data, not change it"
        : actor.role === "trainee"
          ? "trainees add field data only to their own sandbox plans"
          : "your role may read field data, not change it",
    );
  }
  if (plan.status === "archived") {
    throw new AppError(409, "plan_locked", "this plan is archived: restore it to add field data");
  }
}

/** Reviewers never change field data: refused before the body is read. */
export function requireFieldRole(actor: Actor): void {
  if (actor.role === "reviewer") throw forbidden("reviewers read and export field data");
}

const MEDIA_TYPES: Record<AttachmentKind, readonly string[]> = {
  borehole: ["text/csv", "text/plain", "application/csv", "application/vnd.ms-excel"],
  picks: ["text/csv", "text/plain", "application/csv", "application/vnd.ms-excel"],
  seg2: ["application/octet-stream", "application/x-seg2", "application/seg2"],
};

const STORED_MEDIA_TYPE: Record<AttachmentKind, string> = {
  borehole: "text/csv",
  picks: "text/csv",
  seg2: "application/octet-stream",
};

const megabytes = (bytes: number) => `${Number((bytes / (1024 * 1024)).toFixed(1))} MB`;

function extensionOf(name: string): string {
  const dot = name.lastIndexOf(".");
  return dot < 0 ? "" : name.slice(dot).toLowerCase();
}

/** 415 when the file's name or declared type does not fit the kind; 413 when it is too large. */
export function checkFileType(kind: AttachmentKind, file: UploadedFile): void {
  const extension = extensionOf(file.originalname);
  const accepted = ATTACHMENT_EXTENSIONS[kind];
  const mediaType = (file.mimetype || "application/octet-stream").toLowerCase().split(";")[0];
  const typeOk =
    MEDIA_TYPES[kind].includes(mediaType) ||
    // Browsers label unknown endings as octet-stream; the content check decides.
    mediaType === "application/octet-stream";
  if (!accepted.includes(extension) || !typeOk) {
    const message = `a ${ATTACHMENT_KIND_LABELS[kind].toLowerCase()} must be a ${accepted.join(", ")} file; '${cleanFileName(file.originalname)}' (${mediaType}) is not`;
    throw new AppError(415, "unsupported_file_type", message, { file: [message] });
  }
  if (file.size > ATTACHMENT_LIMITS[kind]) {
    const message = `the file is ${megabytes(file.size)}; a ${ATTACHMENT_KIND_LABELS[kind].toLowerCase()} may be at most ${megabytes(ATTACHMENT_LIMITS[kind])}`;
    throw new AppError(413, "file_too_large", message, { file: [message] });
  }
  if (file.size === 0) {
    throw new AppError(422, "invalid_file", "the file is empty", { file: ["the file is empty"] });
  }
}

async function checkContentInPool(
  kind: AttachmentKind,
  file: UploadedFile,
  fields: AttachmentFields,
): Promise<CheckedContent> {
  const result = await runTask({
    kind: "check-upload",
    fileKind: kind,
    fileName: file.originalname,
    bytes: new Uint8Array(file.buffer.buffer, file.buffer.byteOffset, file.buffer.byteLength),
    fields,
  });
  if ("error" in result) {
    const { status, code, message, fields: errorFields } = result.error;
    throw new AppError(status, code, message, errorFields);
  }
  return result;
}

type AttachmentRow = Omit<Attachment, "content">;

function toSummary(row: AttachmentRow): AttachmentSummary {
  return {
    id: row.id,
    planId: row.planId,
    revision: row.revision,
    kind: row.kind,
    fileName: row.fileName,
    mediaType: row.mediaType,
    size: row.size,
    sha256: row.sha256,
    facts: row.facts,
    uploadedBy: { id: row.uploadedById, name: row.uploadedBy?.name ?? "" },
    createdAt: row.createdAt.toISOString(),
  };
}

/** Checks and stores one upload. The file is read completely before anything is written. */
export async function uploadAttachment(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  fields: AttachmentFields,
  file: UploadedFile | undefined,
): Promise<AttachmentUploadResponse> {
  requireFieldRole(actor);
  const plan = await findVisiblePlan(dataSource.manager, actor, planId);
  requireFieldEditor(actor, plan);
  if (!file) {
    throw new AppError(400, "invalid_input", "invalid body: file: choose a file to upload", {
      file: ["choose a file to upload"],
    });
  }
  checkFileType(fields.kind, file);
  // Parsing runs in the worker-thread pool: a large or hostile file never holds the event loop.
  const checked = await checkContentInPool(fields.kind, file, fields);
  const id = randomUUID();
  const sha256 = createHash("sha256").update(file.buffer).digest("hex");
  const fileName = cleanFileName(file.originalname);
  // With object storage the bytes are written first (no network inside the transaction); a
  // refused transaction removes them again (file-store.ts sweeps any that stay behind).
  const objectKey = await fileStoreOf(dataSource).put(
    { id, teamId: actor.teamId, planId },
    file.buffer,
    STORED_MEDIA_TYPE[fields.kind],
  );
  await inTransaction(dataSource, async (manager) => {
    // Re-read inside the transaction: the revision must be the latest at the moment of writing.
    const current = await findVisiblePlan(manager, actor, planId);
    requireFieldEditor(actor, current);
    const revision = await manager
      .getRepository(PlanRevision)
      .findOneBy({ planId, number: current.latestRevision });
    if (!revision) throw notFound("plan revision");
    await manager.getRepository(Attachment).insert({
      id,
      teamId: actor.teamId,
      planId,
      revisionId: revision.id,
      revision: revision.number,
      kind: fields.kind,
      fileName,
      mediaType: STORED_MEDIA_TYPE[fields.kind],
      size: file.size,
      sha256,
      facts: checked.facts,
      content: objectKey ? Buffer.alloc(0) : file.buffer,
      objectKey,
      uploadedById: actor.userId,
      createdAt: new Date(),
    });
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "attachment.upload",
      targetType: "plan",
      targetId: planId,
      detail: {
        attachment: id,
        kind: fields.kind,
        fileName,
        size: file.size,
        revision: revision.number,
      },
    });
  }).catch(async (error: unknown) => {
    await removeObjectsQuietly(dataSource, [objectKey]);
    throw error;
  });
  const row = await findAttachmentRow(dataSource.manager, actor, id);
  return {
    attachment: toSummary(row),
    ...(checked.model ? { model: checked.model } : {}),
    ...(checked.picks ? { picks: checked.picks } : {}),
  };
}

async function findAttachmentRow(
  manager: EntityManager,
  actor: Actor,
  id: string,
): Promise<AttachmentRow> {
  const row = await manager.getRepository(Attachment).findOne({
    where: { id, teamId: actor.teamId },
    relations: { uploadedBy: true },
  });
  if (!row) throw notFound("attachment");
  return row;
}

/** The plan's attachments, newest first. */
export async function listAttachments(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
): Promise<AttachmentSummary[]> {
  await findVisiblePlan(dataSource.manager, actor, planId);
  const rows = await dataSource.getRepository(Attachment).find({
    where: { planId, teamId: actor.teamId },
    relations: { uploadedBy: true },
    order: { createdAt: "DESC", id: "ASC" },
  });
  return rows.map(toSummary);
}

/** An attachment the actor may see (its plan visible), else 404. */
async function visibleAttachment(
  manager: EntityManager,
  actor: Actor,
  id: string,
): Promise<{ row: AttachmentRow; plan: Plan }> {
  const row = await findAttachmentRow(manager, actor, id);
  try {
    const plan = await findVisiblePlan(manager, actor, row.planId);
    return { row, plan };
  } catch {
    // A hidden sandbox plan's file is reported exactly like a missing one.
    throw notFound("attachment");
  }
}

/** The file's bytes as a stream (from the database or the object store) with what the
 * response needs. */
export async function attachmentContent(
  dataSource: DataSource,
  actor: Actor,
  id: string,
): Promise<{ summary: AttachmentSummary; content: Readable }> {
  const { row } = await visibleAttachment(dataSource.manager, actor, id);
  return { summary: toSummary(row), content: await readAttachmentBytes(dataSource, row.id) };
}

export async function deleteAttachment(
  dataSource: DataSource,
  actor: Actor,
  id: string,
): Promise<void> {
  requireFieldRole(actor);
  const objectKey = await inTransaction(dataSource, async (manager) => {
    const { row, plan } = await visibleAttachment(manager, actor, id);
    requireFieldEditor(actor, plan);
    await manager.getRepository(Attachment).delete({ id, teamId: actor.teamId });
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "attachment.delete",
      targetType: "plan",
      targetId: row.planId,
      detail: { attachment: id, kind: row.kind, fileName: row.fileName },
    });
    return row.objectKey;
  });
  // After the commit: the object goes too (or, if the store is unreachable, at the next sweep).
  await removeObjectsQuietly(dataSource, [objectKey]);
}

function toPickSetView(planId: string, row: PickSet | null): PickSetView {
  if (!row) {
    return {
      planId,
      revision: null,
      picks: [],
      attachmentId: null,
      picker: null,
      interpretation: null,
      updatedBy: null,
      updatedAt: null,
    };
  }
  return {
    planId,
    revision: row.revision,
    picks: row.picks,
    attachmentId: row.attachmentId,
    picker: row.picker,
    interpretation: row.interpretation ?? null,
    updatedBy: { id: row.updatedById, name: row.updatedBy?.name ?? "" },
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** The plan's saved picks (an empty set when none were saved). */
export async function getPicks(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
): Promise<PickSetView> {
  await findVisiblePlan(dataSource.manager, actor, planId);
  const row = await dataSource
    .getRepository(PickSet)
    .findOne({ where: { planId, teamId: actor.teamId }, relations: { updatedBy: true } });
  return toPickSetView(planId, row);
}

/** Replaces the plan's picks; `attachmentId`, when given, must be one of the plan's files. */
export async function savePicks(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  input: PicksSaveOutput,
): Promise<PickSetView> {
  requireFieldRole(actor);
  await inTransaction(dataSource, async (manager) => {
    const plan = await findVisiblePlan(manager, actor, planId);
    requireFieldEditor(actor, plan);
    const attachmentId = input.attachmentId ?? null;
    if (attachmentId !== null) {
      const found = await manager
        .getRepository(Attachment)
        .existsBy({ id: attachmentId, planId, teamId: actor.teamId });
      if (!found) {
        const message = "no such attachment on this plan";
        throw new AppError(400, "invalid_input", `invalid body: attachmentId: ${message}`, {
          attachmentId: [message],
        });
      }
    }
    const repo = manager.getRepository(PickSet);
    const existing = await repo.findOneBy({ planId, teamId: actor.teamId });
    const values = {
      revision: plan.latestRevision,
      picks: input.picks,
      attachmentId,
      picker: input.picker ?? null,
      // Absent: the stored interpretation choices stay; null clears them.
      ...(input.interpretation !== undefined ? { interpretation: input.interpretation } : {}),
      updatedById: actor.userId,
      updatedAt: new Date(),
    };
    if (existing) await repo.update({ id: existing.id }, values);
    else await repo.insert({ id: randomUUID(), teamId: actor.teamId, planId, ...values });
    const counts = { auto: 0, adjusted: 0, csv: 0 };
    for (const p of input.picks) counts[p.origin] += 1;
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "picks.save",
      targetType: "plan",
      targetId: planId,
      detail: {
        picks: input.picks.length,
        ...counts,
        revision: plan.latestRevision,
        ...(input.interpretation !== undefined
          ? { method: input.interpretation?.method ?? null }
          : {}),
      },
    });
  });
  return getPicks(dataSource, actor, planId);
}

/**
 * Sets (or, with null, clears) the interpretation choices kept with the plan's saved picks;
 * 409 when no picks are saved yet. The picks themselves and their revision stay as they are.
 */
export async function saveInterpretationChoices(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  interpretation: InterpretationChoices | null,
): Promise<PickSetView> {
  requireFieldRole(actor);
  await inTransaction(dataSource, async (manager) => {
    const plan = await findVisiblePlan(manager, actor, planId);
    requireFieldEditor(actor, plan);
    const repo = manager.getRepository(PickSet);
    const existing = await repo.findOneBy({ planId, teamId: actor.teamId });
    if (!existing) {
      throw new AppError(
        409,
        "no_picks",
        "save the plan's picks first: the interpretation choices are kept with them",
      );
    }
    await repo.update(
      { id: existing.id },
      { interpretation, updatedById: actor.userId, updatedAt: new Date() },
    );
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "picks.choose_interpretation",
      targetType: "plan",
      targetId: planId,
      detail: {
        method: interpretation?.method ?? null,
        assignments: interpretation?.assignments?.length ?? null,
      },
    });
  });
  return getPicks(dataSource, actor, planId);
}

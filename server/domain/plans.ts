/**
 * Plans: list per site, read, create, save a revision, rename/archive, duplicate. Every query
 * is scoped to the actor's team; a plan the actor may not see is reported exactly like a
 * missing one (404).
 *
 * Visibility and editing (design.md role table):
 * - team plans (sandbox = false): every member reads; admin and lead edit.
 * - sandbox plans (a trainee's personal scenarios, sandbox = true): visible to their author,
 *   and read-only to admins and reviewers (who supervise and may comment); hidden from leads
 *   and other trainees. Only the author edits, renames or archives them; nobody submits them.
 */
import { randomUUID } from "node:crypto";
import type { DataSource, EntityManager } from "typeorm";
import { can } from "@/contracts/common";
import type { PlanDetail, PlanSummary, RevisionAnalysisSummary } from "@/contracts/plans";
import type { Plan as PlanDocument } from "@engine";
import { Plan } from "../data/entities/plan";
import { PlanRevision } from "../data/entities/plan-revision";
import { Site } from "../data/entities/site";
import { inTransaction } from "../data/transaction";
import type { Actor } from "./actor";
import { recordAudit } from "./audit";
import { AppError, forbidden, notFound } from "./errors";
import { assertDocumentGeometry, summarizeDocument } from "./revisions";
import { archiveTransition } from "./workflow";
import { getPlan, latestRevisionRow, toSummary } from "./plan-view";
import { canEditPlan, EDITABLE_STATUSES, findVisiblePlan, visibleClause } from "./plan-visibility";

// The visibility rules and the plan view live in their own modules (which import no other use
// case); re-exported here for callers that think of them as "plans".
export { canEditPlan, canSeePlan, EDITABLE_STATUSES, findVisiblePlan } from "./plan-visibility";
export { countVisiblePlans, getPlan, planPermissions } from "./plan-view";

export type ArchivedFilter = "true" | "false" | "all";

async function findTeamSite(manager: EntityManager, actor: Actor, siteId: string): Promise<Site> {
  const site = await manager.getRepository(Site).findOneBy({ id: siteId, teamId: actor.teamId });
  if (!site) throw notFound("site");
  return site;
}

/** Plans of a site the actor can see, most recently changed first. */
export async function listPlans(
  dataSource: DataSource,
  actor: Actor,
  siteId: string,
  archived: ArchivedFilter,
): Promise<PlanSummary[]> {
  await findTeamSite(dataSource.manager, actor, siteId);
  const visible = visibleClause(actor);
  const query = dataSource
    .getRepository(Plan)
    .createQueryBuilder("p")
    .leftJoinAndSelect("p.author", "author")
    .where("p.teamId = :teamId AND p.siteId = :siteId", { teamId: actor.teamId, siteId })
    .andWhere(visible.sql, visible.params);
  if (archived === "true") query.andWhere("p.status = 'archived'");
  if (archived === "false") query.andWhere("p.status <> 'archived'");
  const rows = await query.orderBy("p.updatedAt", "DESC").addOrderBy("p.id", "ASC").getMany();
  return rows.map(toSummary);
}

/**
 * A sensible invented starting point: about 4 m of loose sandy soil (600 m/s) over weathered
 * rock (2400 m/s), 24 channels at 3 m with end shots half a spacing beyond each end. Both
 * refractors resolve with this spread.
 */
export function defaultDocument(name: string): PlanDocument {
  return {
    format: "spreadsight-plan/1",
    name,
    models: [
      {
        name: "Soil over weathered rock",
        layers: [
          { name: "loose sandy soil", velocity: 600, thickness: 4 },
          { name: "weathered rock", velocity: 2400 },
        ],
      },
    ],
    spread: {
      spacing: 3,
      channels: 24,
      firstGeophone: 0,
      shots: [
        // End shots follow the spread (shot-anchors.ts) as a crew would keep them.
        { position: -1.5, label: "end A", anchor: { to: "start", offset: -1.5 } },
        { position: 70.5, label: "end B", anchor: { to: "end", offset: 1.5 } },
      ],
    },
    criteria: { minGeophones: 2, pickError: 0.0005, depthTolerance: 1 },
  };
}

interface NewRevision {
  document: PlanDocument;
  summary: RevisionAnalysisSummary | null;
  message: string | null;
}

async function insertRevision(
  manager: EntityManager,
  actor: Actor,
  planId: string,
  number: number,
  revision: NewRevision,
  at: Date,
): Promise<void> {
  await manager.getRepository(PlanRevision).insert({
    id: randomUUID(),
    teamId: actor.teamId,
    planId,
    number,
    document: revision.document,
    summary: revision.summary,
    worstVerdict: revision.summary?.worstVerdict ?? null,
    authorId: actor.userId,
    message: revision.message,
    createdAt: at,
  });
}

/** Inserts a plan with revision 1; a trainee's plan always lands in their sandbox. */
async function insertPlan(
  manager: EntityManager,
  actor: Actor,
  siteId: string,
  name: string,
  revision: NewRevision,
): Promise<string> {
  const id = randomUUID();
  const now = new Date();
  await manager.getRepository(Plan).insert({
    id,
    teamId: actor.teamId,
    siteId,
    name,
    status: "draft",
    statusBeforeArchive: null,
    sandbox: actor.role === "trainee",
    authorId: actor.userId,
    submittedById: null,
    latestRevision: 1,
    worstVerdict: revision.summary?.worstVerdict ?? null,
    createdAt: now,
    updatedAt: now,
  });
  await insertRevision(manager, actor, id, 1, revision, now);
  return id;
}

/** Admin and lead create team plans; a trainee creates a sandbox plan; a reviewer may not. */
export function requireCreator(actor: Actor): void {
  if (!can.editPlans(actor.role) && !can.useSandbox(actor.role)) {
    throw forbidden("reviewers comment and decide; they do not create or edit plans");
  }
}

export async function createPlan(
  dataSource: DataSource,
  actor: Actor,
  siteId: string,
  input: { name: string; document?: PlanDocument },
): Promise<PlanDetail> {
  requireCreator(actor);
  const document = input.document
    ? { ...input.document, name: input.name }
    : defaultDocument(input.name);
  if (input.document) assertDocumentGeometry(document);
  const summary = summarizeDocument(document);
  const id = await inTransaction(dataSource, async (manager) => {
    const site = await findTeamSite(manager, actor, siteId);
    if (site.archivedAt) {
      throw new AppError(409, "site_archived", "the site is archived; restore it to add plans");
    }
    const planId = await insertPlan(manager, actor, siteId, input.name, {
      document,
      summary,
      message: "created",
    });
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "plan.create",
      targetType: "plan",
      targetId: planId,
      detail: { name: input.name, site: site.name, sandbox: actor.role === "trainee" },
    });
    return planId;
  });
  return getPlan(dataSource, actor, id);
}

/** 403 unless the actor may change this plan's content, name or archive state. */
function requireEditor(actor: Actor, plan: Plan): void {
  if (canEditPlan(actor, plan)) return;
  throw forbidden(
    plan.sandbox
      ? "this is another member's sandbox plan: you may read it, not change it"
      : actor.role === "trainee"
        ? "trainees change only their own sandbox plans; duplicate this plan to try changes"
        : "your role may not change plans",
  );
}

/** 409 `plan_locked` unless the plan's document may be saved in its current status. */
export function assertEditableStatus(plan: Plan): void {
  if (EDITABLE_STATUSES.includes(plan.status)) return;
  const why: Record<string, string> = {
    "in-review": "it is in review: wait for the reviewer's decision",
    approved: "it is approved: a lead must reopen it to start a new revision",
    archived: "it is archived: restore it first",
  };
  throw new AppError(409, "plan_locked", `this plan is read-only because ${why[plan.status]}`);
}

/**
 * Saves a new revision. Refused with 409 `revision_conflict` (nothing written) when the plan
 * has moved on since `baseRevision`: the client reloads or saves the document as a copy.
 */
export async function savePlan(
  dataSource: DataSource,
  actor: Actor,
  id: string,
  input: { baseRevision: number; document: PlanDocument; message?: string },
): Promise<PlanDetail> {
  assertDocumentGeometry(input.document);
  const summary = summarizeDocument(input.document);
  await inTransaction(dataSource, async (manager) => {
    const plan = await findVisiblePlan(manager, actor, id);
    requireEditor(actor, plan);
    assertEditableStatus(plan);
    if (input.baseRevision !== plan.latestRevision) {
      const latest = plan.latestRevision;
      const message =
        `the plan was saved by someone else meanwhile (you edited revision ${input.baseRevision}, ` +
        `the latest is ${latest}): reload it to see their changes, or save yours as a copy`;
      throw new AppError(409, "revision_conflict", message, {
        baseRevision: [message],
        latestRevision: [String(latest)],
      });
    }
    const number = plan.latestRevision + 1;
    const now = new Date();
    await insertRevision(
      manager,
      actor,
      plan.id,
      number,
      { document: input.document, summary, message: input.message || null },
      now,
    );
    await manager
      .getRepository(Plan)
      .update(
        { id: plan.id },
        { latestRevision: number, worstVerdict: summary?.worstVerdict ?? null, updatedAt: now },
      );
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "plan.save",
      targetType: "plan",
      targetId: plan.id,
      detail: {
        name: plan.name,
        revision: number,
        message: input.message || null,
        worstVerdict: summary?.worstVerdict ?? null,
      },
    });
  });
  return getPlan(dataSource, actor, id);
}

/** Rename, archive (from any status) or restore (to the status before archiving). */
export async function updatePlan(
  dataSource: DataSource,
  actor: Actor,
  id: string,
  input: { name?: string; archived?: boolean },
): Promise<PlanDetail> {
  await inTransaction(dataSource, async (manager) => {
    const plan = await findVisiblePlan(manager, actor, id);
    requireEditor(actor, plan);
    const changes: Partial<Plan> = {};
    const audits: { action: string; detail: Record<string, string | null> }[] = [];
    if (input.name !== undefined && input.name !== plan.name) {
      changes.name = input.name;
      audits.push({ action: "plan.rename", detail: { from: plan.name, to: input.name } });
    }
    const isArchived = plan.status === "archived";
    if (input.archived !== undefined && input.archived !== isArchived) {
      const next = archiveTransition(plan, input.archived);
      changes.status = next.status;
      changes.statusBeforeArchive = next.statusBeforeArchive;
      audits.push({
        action: input.archived ? "plan.archive" : "plan.restore",
        detail: { name: input.name ?? plan.name, from: plan.status, to: next.status },
      });
    }
    if (audits.length === 0) return;
    await manager.getRepository(Plan).update({ id }, { ...changes, updatedAt: new Date() });
    for (const audit of audits) {
      await recordAudit(manager, {
        teamId: actor.teamId,
        actorId: actor.userId,
        action: audit.action,
        targetType: "plan",
        targetId: id,
        detail: audit.detail,
      });
    }
  });
  return getPlan(dataSource, actor, id);
}

const copyName = (name: string) => `Copy of ${name}`.slice(0, 120).trim();

/**
 * A new draft plan on the same site from the source's latest revision, owned by the actor
 * (a trainee's copy lands in their sandbox, so trainees may copy any plan they can see).
 */
export async function duplicatePlan(
  dataSource: DataSource,
  actor: Actor,
  id: string,
  input: { name?: string },
): Promise<PlanDetail> {
  requireCreator(actor);
  const newId = await inTransaction(dataSource, async (manager) => {
    const source = await findVisiblePlan(manager, actor, id);
    const site = await findTeamSite(manager, actor, source.siteId);
    if (site.archivedAt) {
      throw new AppError(409, "site_archived", "the site is archived; restore it to add plans");
    }
    const revision = await latestRevisionRow(manager, source);
    const name = input.name ?? copyName(source.name);
    const planId = await insertPlan(manager, actor, source.siteId, name, {
      document: { ...revision.document, name },
      summary: revision.summary,
      message: `copied from ${source.name}, revision ${revision.number}`,
    });
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "plan.duplicate",
      targetType: "plan",
      targetId: planId,
      detail: {
        name,
        fromPlan: source.id,
        fromName: source.name,
        fromRevision: revision.number,
        sandbox: actor.role === "trainee",
      },
    });
    return planId;
  });
  return getPlan(dataSource, actor, newId);
}

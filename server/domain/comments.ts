/**
 * Comments: threads on a plan revision (a first comment and its replies), optionally
 * anchored to a layer, a refractor or a shot of that revision; resolve and reopen a thread;
 * @mentions of team members. Admin, lead and reviewer comment on any plan they see; a trainee
 * comments only on their own sandbox scenario (to ask a reviewer a question).
 */
import { randomUUID } from "node:crypto";
import type { DataSource, EntityManager } from "typeorm";
import { can, mayCommentOn } from "@/contracts/common";
import type { CommentAnchor, CommentView } from "@/contracts/plans";
import { PlanComment } from "../data/entities/comment";
import { Membership } from "../data/entities/membership";
import type { Plan } from "../data/entities/plan";
import { PlanRevision } from "../data/entities/plan-revision";
import { inTransaction } from "../data/transaction";
import type { Actor } from "./actor";
import { recordAudit } from "./audit";
import { AppError, forbidden, notFound } from "./errors";
import { deliverMail, notify, type PendingMail } from "./notifications";
import { findVisiblePlan } from "./plan-visibility";
import type { Services } from "./services";

export interface MentionCandidate {
  userId: string;
  name: string;
  email: string;
}

const WORD = /[\p{L}\p{N}_-]/u;

/**
 * Ids of the members mentioned in `body`: `@` followed by a member's full name or the local
 * part of their e-mail address, case-insensitive, at a word boundary (so `a@b.test` is no
 * mention and `@pip.galloway` does not mention a member whose local part is `pip`). The
 * longest match wins; a name two members share mentions both.
 */
export function findMentions(body: string, members: MentionCandidate[]): string[] {
  const lower = body.toLowerCase();
  const found = new Set<string>();
  const tokens = members.flatMap((m) => [
    { userId: m.userId, token: m.name.trim().toLowerCase() },
    { userId: m.userId, token: m.email.split("@")[0].toLowerCase() },
  ]);
  for (let i = lower.indexOf("@"); i >= 0; i = lower.indexOf("@", i + 1)) {
    if (i > 0 && (WORD.test(lower[i - 1]) || lower[i - 1] === ".")) continue;
    const rest = lower.slice(i + 1);
    let best = 0;
    let ids: string[] = [];
    for (const { userId, token } of tokens) {
      if (!token || !rest.startsWith(token)) continue;
      const next = rest[token.length];
      const after = rest[token.length + 1];
      const boundary =
        next === undefined || (!WORD.test(next) && !(next === "." && after && WORD.test(after)));
      if (!boundary) continue;
      if (token.length > best) {
        best = token.length;
        ids = [userId];
      } else if (token.length === best && !ids.includes(userId)) ids.push(userId);
    }
    for (const id of ids) found.add(id);
  }
  return [...found];
}

function toView(row: PlanComment): CommentView {
  return {
    id: row.id,
    parentId: row.parentId,
    revision: row.revision,
    author: { id: row.authorId, name: row.author?.name ?? "", role: row.authorRole },
    body: row.body,
    anchor: row.anchor,
    resolved: row.resolvedAt !== null,
    mentions: row.mentions,
    resolvedBy:
      row.resolvedAt && row.resolvedBy
        ? { id: row.resolvedBy.id, name: row.resolvedBy.name }
        : null,
    resolvedAt: row.resolvedAt ? row.resolvedAt.toISOString() : null,
    createdAt: row.createdAt.toISOString(),
  };
}

/** Comments of a plan, oldest first; with `revision`, only the threads on that revision. */
export async function listComments(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  revision?: number,
): Promise<CommentView[]> {
  await findVisiblePlan(dataSource.manager, actor, planId);
  const rows = await dataSource.getRepository(PlanComment).find({
    where: { planId, teamId: actor.teamId, ...(revision === undefined ? {} : { revision }) },
    relations: { author: true, resolvedBy: true },
    order: { createdAt: "ASC", id: "ASC" },
  });
  return rows.map(toView);
}

const badField = (field: string, message: string) =>
  new AppError(400, "invalid_input", `invalid body: ${field}: ${message}`, { [field]: [message] });

function checkAnchor(anchor: CommentAnchor, document: PlanRevision["document"], revision: number) {
  if (anchor.kind === "shot") {
    const shots = document.spread.shots.length;
    if (anchor.index >= shots) {
      throw badField("anchor.index", `revision ${revision} has ${shots} shot(s); index is 0-based`);
    }
    return;
  }
  const model = document.models[anchor.model];
  if (!model) {
    throw badField(
      "anchor.model",
      `revision ${revision} has ${document.models.length} ground model(s); index is 0-based`,
    );
  }
  const layers = model.layers.length;
  if (anchor.kind === "layer" && anchor.index >= layers) {
    throw badField(
      "anchor.index",
      `model “${model.name}” has ${layers} layer(s); index is 0-based`,
    );
  }
  if (anchor.kind === "refractor" && (anchor.index < 1 || anchor.index >= layers)) {
    throw badField(
      "anchor.index",
      `a refractor is the top of layer index 1 to ${layers - 1} of model “${model.name}”`,
    );
  }
}

async function teamCandidates(manager: EntityManager, teamId: string) {
  const members = await manager
    .getRepository(Membership)
    .find({ where: { teamId }, relations: { user: true } });
  return members
    .filter((m) => m.user)
    .map((m) => ({ userId: m.userId, name: m.user!.name, email: m.user!.email }));
}

const TRAINEE_COMMENTS =
  "a trainee comments only on their own sandbox scenario; team plans are read-only to trainees";

/**
 * 403 unless the actor may comment on the plan (before the body is read): a no-op for admins,
 * leads and reviewers; a trainee must be the author of this sandbox scenario (404 for a plan
 * they cannot see).
 */
export async function requireMayComment(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
): Promise<void> {
  if (can.comment(actor.role)) return;
  const plan = await findVisiblePlan(dataSource.manager, actor, planId);
  if (!mayCommentOn(actor, plan)) throw forbidden(TRAINEE_COMMENTS);
}

/**
 * Adds a comment (a new thread, or a reply when `parentId` names any comment of a thread:
 * replies join that thread). Notifies the mentioned and, for a reply, the thread's earlier
 * participants (each person once; never the writer).
 */
export async function createComment(
  services: Services,
  actor: Actor,
  planId: string,
  input: { body: string; revision?: number; parentId?: string; anchor?: CommentAnchor },
): Promise<CommentView> {
  const { dataSource } = services;
  const { id, mail } = await inTransaction(dataSource, async (manager) => {
    const plan = await findVisiblePlan(manager, actor, planId);
    if (!mayCommentOn(actor, plan)) throw forbidden(TRAINEE_COMMENTS);
    if (plan.status === "archived") {
      throw new AppError(409, "plan_locked", "this plan is archived: restore it to comment");
    }
    const repo = manager.getRepository(PlanComment);
    let root: PlanComment | null = null;
    if (input.parentId) {
      const parent = await repo.findOneBy({ id: input.parentId, planId, teamId: actor.teamId });
      if (!parent) throw badField("parentId", "no comment with this id on this plan");
      root = parent.parentId ? await repo.findOneByOrFail({ id: parent.parentId }) : parent;
      if (input.anchor) throw badField("anchor", "a reply belongs to its thread's anchor");
      if (input.revision !== undefined && input.revision !== root.revision) {
        throw badField("revision", `this thread is on revision ${root.revision}`);
      }
    }
    const revision = root?.revision ?? input.revision ?? plan.latestRevision;
    const revisionRow = await manager
      .getRepository(PlanRevision)
      .findOneBy({ planId, number: revision });
    if (!revisionRow) {
      throw badField("revision", `the plan has revisions 1 to ${plan.latestRevision}`);
    }
    if (input.anchor) checkAnchor(input.anchor, revisionRow.document, revision);
    const candidates = await teamCandidates(manager, actor.teamId);
    const mentions = findMentions(input.body, candidates).filter((u) => u !== actor.userId);
    const id = randomUUID();
    await repo.insert({
      id,
      teamId: actor.teamId,
      planId,
      revision,
      parentId: root?.id ?? null,
      authorId: actor.userId,
      authorRole: actor.role,
      body: input.body,
      anchor: input.anchor ?? null,
      mentions,
      resolvedAt: null,
      resolvedById: null,
      createdAt: new Date(),
    });
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: root ? "comment.reply" : "comment.create",
      targetType: "plan",
      targetId: planId,
      detail: {
        name: plan.name,
        comment: id,
        thread: root?.id ?? id,
        revision,
        anchor: input.anchor ? `${input.anchor.kind} ${input.anchor.index}` : null,
        mentions: mentions.length,
      },
    });
    const mail = await commentNotifications(manager, services, actor, plan, root, mentions);
    return { id, mail };
  });
  deliverMail(services, mail);
  const row = await dataSource
    .getRepository(PlanComment)
    .findOneOrFail({ where: { id }, relations: { author: true, resolvedBy: true } });
  return toView(row);
}

async function commentNotifications(
  manager: EntityManager,
  services: Services,
  actor: Actor,
  plan: Plan,
  root: PlanComment | null,
  mentions: string[],
): Promise<PendingMail[]> {
  const mail = await notify(manager, services, {
    teamId: actor.teamId,
    plan,
    actor,
    kind: "mention",
    recipients: mentions,
    text: `${actor.name} mentioned you in a review note on “${plan.name}”.`,
  });
  if (!root) return mail;
  const replies = await manager
    .getRepository(PlanComment)
    .findBy({ parentId: root.id, teamId: actor.teamId });
  const participants = [root.authorId, ...replies.map((r) => r.authorId)].filter(
    (u) => !mentions.includes(u),
  );
  const replyMail = await notify(manager, services, {
    teamId: actor.teamId,
    plan,
    actor,
    kind: "reply",
    recipients: participants,
    text: `${actor.name} replied to a review note on “${plan.name}”.`,
  });
  return [...mail, ...replyMail];
}

/**
 * Resolves or reopens a thread (sent to its first comment). Allowed to the thread's author,
 * the plan's author, reviewers and admins.
 */
export async function setThreadResolved(
  dataSource: DataSource,
  actor: Actor,
  commentId: string,
  resolved: boolean,
): Promise<CommentView> {
  await inTransaction(dataSource, async (manager) => {
    const repo = manager.getRepository(PlanComment);
    const comment = await repo.findOneBy({ id: commentId, teamId: actor.teamId });
    if (!comment) throw notFound("comment");
    const plan = await findVisiblePlan(manager, actor, comment.planId).catch(() => {
      throw notFound("comment");
    });
    const allowed =
      comment.authorId === actor.userId ||
      plan.authorId === actor.userId ||
      actor.role === "reviewer" ||
      actor.role === "admin";
    if (!allowed) {
      throw forbidden(
        "only the thread's author, the plan's author, a reviewer or an admin may resolve it",
      );
    }
    if (comment.parentId !== null) {
      throw new AppError(
        400,
        "invalid_input",
        `invalid path: id: only a thread's first comment is resolved or reopened (${comment.parentId})`,
        { id: ["only a thread's first comment is resolved or reopened"] },
      );
    }
    if (plan.status === "archived") {
      throw new AppError(409, "plan_locked", "this plan is archived: restore it first");
    }
    if (resolved === (comment.resolvedAt !== null)) return;
    await repo.update(
      { id: commentId },
      resolved
        ? { resolvedAt: new Date(), resolvedById: actor.userId }
        : { resolvedAt: null, resolvedById: null },
    );
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: resolved ? "comment.resolve" : "comment.reopen",
      targetType: "plan",
      targetId: plan.id,
      detail: { name: plan.name, comment: commentId, revision: comment.revision },
    });
  });
  const row = await dataSource
    .getRepository(PlanComment)
    .findOneOrFail({ where: { id: commentId }, relations: { author: true, resolvedBy: true } });
  return toView(row);
}

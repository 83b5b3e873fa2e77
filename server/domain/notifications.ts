/**
 * Notifications: an in-app inbox row for every event that concerns a member, and its e-mail
 * twin when the member's setting for that kind is on (default on). Inbox rows and the e-mails'
 * outbox rows (server/mail/outbox.ts) are written in the caller's transaction; the e-mails are
 * sent after it commits (`deliverMail`), so a refused request sends nothing, a slow SMTP server
 * never holds a transaction open, and an e-mail left unsent by a crash or an SMTP failure is
 * sent by the outbox sweep.
 */
import { randomUUID } from "node:crypto";
import { In, IsNull, type DataSource, type EntityManager } from "typeorm";
import type { Role } from "@/contracts/common";
import {
  DEFAULT_NOTIFICATION_SETTINGS,
  type NotificationKind,
  type NotificationSettings,
  type NotificationView,
} from "@/contracts/plans";
import { Membership } from "../data/entities/membership";
import { PlanNotification } from "../data/entities/notification";
import { NotificationSetting } from "../data/entities/notification-setting";
import type { Plan } from "../data/entities/plan";
import type { OutgoingMail } from "../mail/mailer";
import { enqueueMail, sendOutbox } from "../mail/outbox";
import type { Actor } from "./actor";
import { notFound } from "./errors";
import { canSeePlan } from "./plan-visibility";
import type { Services } from "./services";

/** In-app path of a plan's Review screen (the client's paths.planReview). */
export const reviewPath = (planId: string) => `/plans/${planId}/review`;

export interface PendingMail {
  userId: string;
  mail: OutgoingMail;
  /** The e-mail's outbox row (written in the same transaction). */
  outboxId: string;
}

export interface NotifyInput {
  teamId: string;
  plan: Pick<Plan, "id" | "name" | "teamId" | "sandbox" | "authorId">;
  actor: Actor;
  kind: NotificationKind;
  /** User ids; the actor, duplicates and members who cannot see the plan are dropped. */
  recipients: string[];
  /** One sentence for the inbox and the e-mail. */
  text: string;
}

const SUBJECTS: Record<NotificationKind, (plan: string) => string> = {
  submitted: (plan) => `Review requested: ${plan}`,
  decision: (plan) => `Review decision: ${plan}`,
  mention: (plan) => `You were mentioned on ${plan}`,
  reply: (plan) => `New reply on ${plan}`,
};

const REASONS: Record<NotificationKind, string> = {
  submitted: "a plan of your team was submitted for review",
  decision: "a reviewer decided on a plan you wrote or submitted",
  mention: "someone mentioned you in a comment",
  reply: "someone replied in a comment thread you took part in",
};

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function notificationMail(
  services: Services,
  input: NotifyInput,
  to: { email: string; name: string },
): OutgoingMail {
  const link = `${services.publicUrl}${reviewPath(input.plan.id)}`;
  const text = [
    `Hello ${to.name},`,
    "",
    input.text,
    "",
    "Open the plan's review:",
    link,
    "",
    `You receive this because ${REASONS[input.kind]}. Turn these e-mails off in Spreadsight's settings.`,
  ].join("\n");
  const html =
    `<p>Hello ${escapeHtml(to.name)},</p><p>${escapeHtml(input.text)}</p>` +
    `<p><a href="${escapeHtml(link)}">Open the plan's review</a></p>` +
    `<p>You receive this because ${REASONS[input.kind]}. Turn these e-mails off in Spreadsight's settings.</p>`;
  return {
    to: to.email,
    subject: SUBJECTS[input.kind](input.plan.name),
    text,
    html,
    teamId: input.teamId,
  };
}

/** Team members (user ids) holding any of the roles. */
export async function teamMembersWithRole(
  manager: EntityManager,
  teamId: string,
  roles: Role[],
): Promise<string[]> {
  const rows = await manager.getRepository(Membership).findBy({ teamId, role: In(roles) });
  return rows.map((m) => m.userId);
}

async function settingsOf(
  manager: EntityManager,
  userIds: string[],
): Promise<Map<string, NotificationSettings>> {
  const rows =
    userIds.length === 0
      ? []
      : await manager.getRepository(NotificationSetting).findBy({ userId: In(userIds) });
  const map = new Map<string, NotificationSettings>();
  for (const row of rows) {
    map.set(row.userId, {
      submitted: row.submitted,
      decision: row.decision,
      mention: row.mention,
      reply: row.reply,
    });
  }
  return map;
}

/**
 * Writes one inbox row per recipient (with `manager`, inside the caller's transaction) and
 * returns the e-mails to send once it commits.
 */
export async function notify(
  manager: EntityManager,
  services: Services,
  input: NotifyInput,
): Promise<PendingMail[]> {
  const wanted = [...new Set(input.recipients)].filter((id) => id !== input.actor.userId);
  if (wanted.length === 0) return [];
  const members = await manager.getRepository(Membership).find({
    where: { teamId: input.teamId, userId: In(wanted) },
    relations: { user: true },
  });
  const recipients = members.filter(
    (m) => m.user && canSeePlan({ teamId: m.teamId, userId: m.userId, role: m.role }, input.plan),
  );
  if (recipients.length === 0) return [];
  const now = new Date();
  await manager.getRepository(PlanNotification).insert(
    recipients.map((m) => ({
      id: randomUUID(),
      teamId: input.teamId,
      userId: m.userId,
      kind: input.kind,
      planId: input.plan.id,
      actorId: input.actor.userId,
      text: input.text,
      readAt: null,
      createdAt: now,
    })),
  );
  const settings = await settingsOf(
    manager,
    recipients.map((m) => m.userId),
  );
  const mails = recipients
    .filter((m) => (settings.get(m.userId) ?? DEFAULT_NOTIFICATION_SETTINGS)[input.kind])
    .map((m) => ({ userId: m.userId, mail: notificationMail(services, input, m.user!) }));
  const ids = await enqueueMail(
    manager,
    mails.map((m) => ({ ...m.mail, userId: m.userId })),
  );
  return mails.map((m, i) => ({ ...m, outboxId: ids[i] }));
}

const inFlight = new WeakMap<object, Set<Promise<void>>>();

/**
 * Sends the e-mails in the background once their transaction has committed: the request that
 * caused them answers at once, and a slow or failing SMTP server never delays or undoes it (a
 * failure is logged and retried by the outbox sweep). `notificationMailSettled` waits for them
 * (tests, shutdown).
 */
export function deliverMail(services: Services, pending: PendingMail[]): void {
  if (pending.length === 0) return;
  const set = inFlight.get(services.dataSource) ?? new Set<Promise<void>>();
  inFlight.set(services.dataSource, set);
  const job = sendOutbox(
    services,
    pending.map((p) => p.outboxId),
  ).then(() => undefined);
  set.add(job);
  void job.finally(() => set.delete(job));
}

/** Resolves once every notification e-mail started for this database has been handed to SMTP. */
export async function notificationMailSettled(dataSource: DataSource): Promise<void> {
  const set = inFlight.get(dataSource);
  while (set && set.size > 0) await Promise.all([...set]);
}

function toView(row: PlanNotification): NotificationView {
  return {
    id: row.id,
    kind: row.kind,
    planId: row.planId,
    planName: row.plan?.name ?? "",
    actorName: row.actor?.name ?? "",
    text: row.text,
    link: reviewPath(row.planId),
    read: row.readAt !== null,
    createdAt: row.createdAt.toISOString(),
  };
}

/** The actor's inbox, newest first. */
export async function listNotifications(
  dataSource: DataSource,
  actor: Actor,
  options: { unread: boolean; limit: number },
): Promise<NotificationView[]> {
  const rows = await dataSource.getRepository(PlanNotification).find({
    where: {
      userId: actor.userId,
      teamId: actor.teamId,
      ...(options.unread ? { readAt: IsNull() } : {}),
    },
    relations: { plan: true, actor: true },
    order: { createdAt: "DESC", id: "ASC" },
    take: options.limit,
  });
  return rows.map(toView);
}

/** Marks one of the actor's notifications read (404 for anyone else's). */
export async function markRead(
  dataSource: DataSource,
  actor: Actor,
  id: string,
): Promise<NotificationView> {
  const repo = dataSource.getRepository(PlanNotification);
  const row = await repo.findOne({
    where: { id, userId: actor.userId, teamId: actor.teamId },
    relations: { plan: true, actor: true },
  });
  if (!row) throw notFound("notification");
  if (row.readAt === null) {
    row.readAt = new Date();
    await repo.update({ id }, { readAt: row.readAt });
  }
  return toView(row);
}

/** Marks every unread notification of the actor read; returns how many changed. */
export async function markAllRead(dataSource: DataSource, actor: Actor): Promise<number> {
  const result = await dataSource
    .getRepository(PlanNotification)
    .update(
      { userId: actor.userId, teamId: actor.teamId, readAt: IsNull() },
      { readAt: new Date() },
    );
  return result.affected ?? 0;
}

export async function getNotificationSettings(
  dataSource: DataSource,
  actor: Actor,
): Promise<NotificationSettings> {
  return (
    (await settingsOf(dataSource.manager, [actor.userId])).get(actor.userId) ?? {
      ...DEFAULT_NOTIFICATION_SETTINGS,
    }
  );
}

export async function saveNotificationSettings(
  dataSource: DataSource,
  actor: Actor,
  settings: NotificationSettings,
): Promise<NotificationSettings> {
  await dataSource
    .getRepository(NotificationSetting)
    .upsert({ userId: actor.userId, ...settings, updatedAt: new Date() }, ["userId"]);
  return getNotificationSettings(dataSource, actor);
}

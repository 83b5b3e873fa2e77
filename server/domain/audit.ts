/** The audit trail: one row per sign-in, invitation, membership change and site change. */
import { randomUUID } from "node:crypto";
import type { DataSource, EntityManager } from "typeorm";
import type { AuditEventSummary } from "@/contracts/audit";
import { AuditEvent, type AuditDetail } from "../data/entities/audit-event";
import { Plan } from "../data/entities/plan";
import { Site } from "../data/entities/site";
import type { Actor } from "./actor";
import { canSeePlan } from "./plan-visibility";

export interface AuditEntry {
  teamId: string;
  actorId: string | null;
  action: string;
  targetType: string;
  targetId?: string | null;
  detail?: AuditDetail;
}

/** Inserts an audit row with `manager`, so it commits or rolls back with the change it records. */
export async function recordAudit(manager: EntityManager, entry: AuditEntry): Promise<void> {
  await manager.getRepository(AuditEvent).insert({
    id: randomUUID(),
    teamId: entry.teamId,
    actorId: entry.actorId,
    action: entry.action,
    targetType: entry.targetType,
    targetId: entry.targetId ?? null,
    detail: entry.detail ?? {},
    createdAt: new Date(),
  });
}

/**
 * The actor's team's events, newest first. Events about plans the actor may not see (another
 * trainee's sandbox) are left out, as in the CSV export.
 */
export async function listAudit(
  dataSource: DataSource,
  actor: Actor,
  limit: number,
): Promise<AuditEventSummary[]> {
  const rows = await dataSource.getRepository(AuditEvent).find({
    where: { teamId: actor.teamId },
    relations: { actor: true },
    order: { createdAt: "DESC", id: "ASC" },
    take: limit,
  });
  const { visible, plans } = await withoutHiddenPlans(dataSource, actor, rows);
  const sites = await dataSource.getRepository(Site).find({ where: { teamId: actor.teamId } });
  const siteNames = new Map(sites.map((site) => [site.id, site.name]));
  // The plan's or site's name today, so the activity list can name what was acted on.
  const targetName = (row: AuditEvent): string | null => {
    if (!row.targetId) return null;
    if (row.targetType === "plan") return plans.get(row.targetId)?.name ?? null;
    if (row.targetType === "site") return siteNames.get(row.targetId) ?? null;
    return null;
  };
  return visible.map((row) => ({
    id: row.id,
    action: row.action,
    actor: row.actor ? { id: row.actor.id, name: row.actor.name } : null,
    targetType: row.targetType,
    targetId: row.targetId,
    targetName: targetName(row),
    detail: row.detail,
    createdAt: row.createdAt.toISOString(),
  }));
}

/**
 * Drops events about plans the actor may not see (another trainee's sandbox). Also returns the
 * team's plans by id, for naming the rest.
 */
export async function withoutHiddenPlans(
  dataSource: DataSource,
  actor: Actor,
  rows: AuditEvent[],
): Promise<{ visible: AuditEvent[]; plans: Map<string, Plan> }> {
  const all = await dataSource.getRepository(Plan).find({ where: { teamId: actor.teamId } });
  const plans = new Map(all.map((plan) => [plan.id, plan]));
  const visible = rows.filter((row) => {
    if (row.targetType !== "plan" || !row.targetId) return true;
    const plan = plans.get(row.targetId);
    return !plan || canSeePlan(actor, plan);
  });
  return { visible, plans };
}

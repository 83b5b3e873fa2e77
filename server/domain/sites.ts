/** Sites: list, read, create, rename/describe, archive. Every query is scoped to the actor's team. */
import { randomUUID } from "node:crypto";
import { IsNull, Not, type DataSource, type EntityManager, type FindOptionsWhere } from "typeorm";
import type { SiteSummary } from "@/contracts/sites";
import type { AuditDetail } from "../data/entities/audit-event";
import { Site } from "../data/entities/site";
import { inTransaction } from "../data/transaction";
import type { Actor } from "./actor";
import { requirePermission } from "./actor";
import { recordAudit } from "./audit";
import { AppError, notFound } from "./errors";
import { countVisiblePlans } from "./plans";

export type ArchivedFilter = "true" | "false" | "all";

function toSummary(site: Site, planCount = 0): SiteSummary {
  return {
    id: site.id,
    name: site.name,
    description: site.description,
    archived: site.archivedAt !== null,
    createdBy: site.createdBy?.name ?? "",
    createdAt: site.createdAt.toISOString(),
    updatedAt: site.updatedAt.toISOString(),
    // Non-archived plans the viewer can see (server/domain/plans.ts countVisiblePlans).
    planCount,
  };
}

export async function listSites(
  dataSource: DataSource,
  actor: Actor,
  archived: ArchivedFilter,
): Promise<SiteSummary[]> {
  const where: FindOptionsWhere<Site> = { teamId: actor.teamId };
  if (archived === "true") where.archivedAt = Not(IsNull());
  if (archived === "false") where.archivedAt = IsNull();
  const rows = await dataSource.getRepository(Site).find({
    where,
    relations: { createdBy: true },
    order: { name: "ASC", id: "ASC" },
  });
  const counts = await countVisiblePlans(
    dataSource,
    actor,
    rows.map((r) => r.id),
  );
  return rows.map((row) => toSummary(row, counts.get(row.id)));
}

async function findTeamSite(dataSource: DataSource, actor: Actor, id: string): Promise<Site> {
  const site = await dataSource.getRepository(Site).findOne({
    where: { id, teamId: actor.teamId },
    relations: { createdBy: true },
  });
  // Another team's site is reported exactly like a missing one.
  if (!site) throw notFound("site");
  return site;
}

export async function getSite(
  dataSource: DataSource,
  actor: Actor,
  id: string,
): Promise<SiteSummary> {
  const site = await findTeamSite(dataSource, actor, id);
  const counts = await countVisiblePlans(dataSource, actor, [id]);
  return toSummary(site, counts.get(id));
}

/** 409 when another site of the team already has this name (compared case-insensitively). */
async function assertNameFree(
  manager: EntityManager,
  teamId: string,
  name: string,
  exceptId: string | null,
): Promise<void> {
  const clash = await manager
    .getRepository(Site)
    .createQueryBuilder("s")
    .where("s.teamId = :teamId AND lower(s.name) = lower(:name)", { teamId, name })
    .andWhere(exceptId ? "s.id <> :exceptId" : "1 = 1", { exceptId })
    .getExists();
  if (clash) {
    throw new AppError(409, "site_name_taken", "the team already has a site with this name", {
      name: ["the team already has a site with this name"],
    });
  }
}

export async function createSite(
  dataSource: DataSource,
  actor: Actor,
  input: { name: string; description: string },
): Promise<SiteSummary> {
  requirePermission(actor, "editSites");
  const now = new Date();
  const id = randomUUID();
  await inTransaction(dataSource, async (manager) => {
    await assertNameFree(manager, actor.teamId, input.name, null);
    await manager.getRepository(Site).insert({
      id,
      teamId: actor.teamId,
      name: input.name,
      description: input.description,
      archivedAt: null,
      createdById: actor.userId,
      createdAt: now,
      updatedAt: now,
    });
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "site.create",
      targetType: "site",
      targetId: id,
      detail: { name: input.name },
    });
  });
  return getSite(dataSource, actor, id);
}

export async function updateSite(
  dataSource: DataSource,
  actor: Actor,
  id: string,
  input: { name?: string; description?: string; archived?: boolean },
): Promise<SiteSummary> {
  requirePermission(actor, "editSites");
  await inTransaction(dataSource, async (manager) => {
    const repo = manager.getRepository(Site);
    const site = await repo.findOneBy({ id, teamId: actor.teamId });
    if (!site) throw notFound("site");
    const changes: Partial<Site> = {};
    const audits: { action: string; detail: AuditDetail }[] = [];
    if (input.name !== undefined && input.name !== site.name) {
      await assertNameFree(manager, actor.teamId, input.name, id);
      changes.name = input.name;
      audits.push({ action: "site.rename", detail: { from: site.name, to: input.name } });
    }
    if (input.description !== undefined && input.description !== site.description) {
      changes.description = input.description;
      audits.push({ action: "site.describe", detail: { name: input.name ?? site.name } });
    }
    if (input.archived !== undefined && input.archived !== (site.archivedAt !== null)) {
      changes.archivedAt = input.archived ? new Date() : null;
      audits.push({
        action: input.archived ? "site.archive" : "site.unarchive",
        detail: { name: input.name ?? site.name },
      });
    }
    if (audits.length === 0) return;
    await repo.update({ id, teamId: actor.teamId }, { ...changes, updatedAt: new Date() });
    for (const audit of audits) {
      await recordAudit(manager, {
        teamId: actor.teamId,
        actorId: actor.userId,
        action: audit.action,
        targetType: "site",
        targetId: id,
        detail: audit.detail,
      });
    }
  });
  return getSite(dataSource, actor, id);
}

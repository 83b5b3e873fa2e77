/** How a plan reads to an actor: its summary, its permissions and the full detail. */
import { In, type DataSource, type EntityManager } from "typeorm";
import { can, mayCommentOn } from "@/contracts/common";
import type { PlanDetail, PlanSummary } from "@/contracts/plans";
import { Plan } from "../data/entities/plan";
import { PlanRevision } from "../data/entities/plan-revision";
import type { Actor } from "./actor";
import { canEditPlan, EDITABLE_STATUSES, findVisiblePlan, visibleClause } from "./plan-visibility";

export function planPermissions(actor: Actor, plan: Plan): PlanDetail["permissions"] {
  const editor = canEditPlan(actor, plan);
  const team = !plan.sandbox;
  return {
    edit: editor && EDITABLE_STATUSES.includes(plan.status),
    submit: team && can.submitPlans(actor.role) && EDITABLE_STATUSES.includes(plan.status),
    decide: team && can.decidePlans(actor.role) && plan.status === "in-review",
    comment: mayCommentOn(actor, plan) && plan.status !== "archived",
    reopen: team && can.submitPlans(actor.role) && plan.status === "approved",
    archive: editor,
    duplicate: can.editPlans(actor.role) || can.useSandbox(actor.role),
  };
}

export function toSummary(plan: Plan): PlanSummary {
  return {
    id: plan.id,
    siteId: plan.siteId,
    name: plan.name,
    status: plan.status,
    sandbox: plan.sandbox,
    author: { id: plan.authorId, name: plan.author?.name ?? "" },
    revision: plan.latestRevision,
    worstVerdict: plan.worstVerdict,
    updatedAt: plan.updatedAt.toISOString(),
    createdAt: plan.createdAt.toISOString(),
  };
}

/** Non-archived plans the actor can see, per site (for SiteSummary.planCount). */
export async function countVisiblePlans(
  dataSource: DataSource,
  actor: Actor,
  siteIds: string[],
): Promise<Map<string, number>> {
  const counts = new Map<string, number>();
  if (siteIds.length === 0) return counts;
  const visible = visibleClause(actor);
  const rows = await dataSource
    .getRepository(Plan)
    .createQueryBuilder("p")
    .select("p.siteId", "siteId")
    .addSelect("COUNT(*)", "n")
    .where("p.teamId = :teamId", { teamId: actor.teamId })
    .andWhere({ siteId: In(siteIds) })
    .andWhere("p.status <> 'archived'")
    .andWhere(visible.sql, visible.params)
    .groupBy("p.siteId")
    .getRawMany<{ siteId: string; n: number | string }>();
  for (const row of rows) counts.set(row.siteId, Number(row.n));
  return counts;
}

export async function latestRevisionRow(manager: EntityManager, plan: Plan): Promise<PlanRevision> {
  const row = await manager
    .getRepository(PlanRevision)
    .findOneBy({ planId: plan.id, number: plan.latestRevision });
  // Every plan is created with revision 1 in the same transaction.
  if (!row) throw new Error(`plan ${plan.id} has no revision ${plan.latestRevision}`);
  return row;
}

export async function getPlan(
  dataSource: DataSource,
  actor: Actor,
  id: string,
): Promise<PlanDetail> {
  const plan = await findVisiblePlan(dataSource.manager, actor, id);
  const revision = await latestRevisionRow(dataSource.manager, plan);
  return {
    ...toSummary(plan),
    siteName: plan.site?.name ?? "",
    document: revision.document,
    permissions: planPermissions(actor, plan),
    statusBeforeArchive: plan.statusBeforeArchive,
  };
}

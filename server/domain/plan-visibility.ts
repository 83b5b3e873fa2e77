/**
 * Who may see and change a plan: the one module of plan-visibility rules that plans, audit,
 * notifications, revisions, workflow, comments, activity, exports and attachments depend on.
 * It imports no other use-case module, so the domain has no import circle (checked by
 * server/architecture.test.ts).
 */
import type { EntityManager } from "typeorm";
import { can } from "@/contracts/common";
import type { PlanStatus } from "@/contracts/plans";
import { Plan } from "../data/entities/plan";
import type { Actor } from "./actor";
import { notFound } from "./errors";

/** Roles that see every sandbox plan of the team (read-only). */
export const SANDBOX_READERS = new Set(["admin", "reviewer"]);

/** True when the actor may see the plan at all (same team, and sandbox rule). */
export function canSeePlan(
  actor: Pick<Actor, "teamId" | "userId" | "role">,
  plan: Pick<Plan, "teamId" | "sandbox" | "authorId">,
): boolean {
  if (plan.teamId !== actor.teamId) return false;
  if (!plan.sandbox) return true;
  return plan.authorId === actor.userId || SANDBOX_READERS.has(actor.role);
}

/** True when the actor may change the plan's content, name or archive state (status aside). */
export function canEditPlan(actor: Actor, plan: Pick<Plan, "sandbox" | "authorId">): boolean {
  if (plan.sandbox) return plan.authorId === actor.userId && actor.role !== "reviewer";
  return can.editPlans(actor.role);
}

/** The statuses in which a plan's document may be saved. */
export const EDITABLE_STATUSES: readonly PlanStatus[] = ["draft", "changes-requested"];

/** The plan if the actor may see it, else 404 (another team's and a hidden sandbox plan alike). */
export async function findVisiblePlan(
  manager: EntityManager,
  actor: Actor,
  id: string,
): Promise<Plan> {
  const plan = await manager.getRepository(Plan).findOne({
    where: { id, teamId: actor.teamId },
    relations: { author: true, site: true },
  });
  if (!plan || !canSeePlan(actor, plan)) throw notFound("plan");
  return plan;
}

/** The query part that hides sandbox plans the actor may not see (alias `p`). */
export function visibleClause(actor: Actor): { sql: string; params: Record<string, unknown> } {
  if (SANDBOX_READERS.has(actor.role)) return { sql: "1 = 1", params: {} };
  return {
    sql: "(p.sandbox = :no OR p.authorId = :viewer)",
    params: { no: false, viewer: actor.userId },
  };
}

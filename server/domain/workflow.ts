/**
 * The review workflow: draft → in-review → changes-requested → in-review → approved, with
 * reopen (approved → draft) and archive/restore from any status. One table says which step
 * is allowed from which status and by which roles; everything else is 409
 * `illegal_transition` naming the current status.
 */
import type { Role } from "@/contracts/common";
import {
  PLAN_STATUS_LABELS,
  type NotificationKind,
  type PlanDetail,
  type PlanStatus,
} from "@/contracts/plans";
import { Plan } from "../data/entities/plan";
import { inTransaction } from "../data/transaction";
import { requireRole, type Actor } from "./actor";
import { recordAudit } from "./audit";
import { AppError, forbidden } from "./errors";
import { deliverMail, notify, teamMembersWithRole, type PendingMail } from "./notifications";
import { getPlan } from "./plan-view";
import { findVisiblePlan } from "./plan-visibility";
import type { Services } from "./services";

export type WorkflowStep = "submit" | "approve" | "request-changes" | "reopen";

export interface StepRule {
  from: readonly PlanStatus[];
  to: PlanStatus;
  roles: readonly Role[];
  /** Audit action. */
  action: string;
  /** Past-tense phrase for messages: "submitted …". */
  verb: string;
}

/** design.md: only a lead (or admin) submits and reopens; only a reviewer (or admin) decides. */
export const WORKFLOW: Record<WorkflowStep, StepRule> = {
  submit: {
    from: ["draft", "changes-requested"],
    to: "in-review",
    roles: ["admin", "lead"],
    action: "plan.submit",
    verb: "submitted",
  },
  approve: {
    from: ["in-review"],
    to: "approved",
    roles: ["admin", "reviewer"],
    action: "plan.approve",
    verb: "signed off for mobilisation",
  },
  "request-changes": {
    from: ["in-review"],
    to: "changes-requested",
    roles: ["admin", "reviewer"],
    action: "plan.request_changes",
    verb: "returned with notes",
  },
  reopen: {
    from: ["approved"],
    to: "draft",
    roles: ["admin", "lead"],
    action: "plan.reopen",
    verb: "reopened",
  },
};

const label = (status: PlanStatus) => PLAN_STATUS_LABELS[status].toLowerCase();

function illegal(step: string, status: PlanStatus, allowed: readonly PlanStatus[]): AppError {
  const from = allowed.map(label).join(" or ");
  return new AppError(
    409,
    "illegal_transition",
    `cannot ${step.replace("-", " ")} a plan that is ${label(status)}` +
      (from ? ` (only from ${from})` : ""),
  );
}

/** The new status fields for archive (from any status but archived) or restore. */
export function archiveTransition(
  plan: Pick<Plan, "status" | "statusBeforeArchive">,
  archive: boolean,
): { status: PlanStatus; statusBeforeArchive: PlanStatus | null } {
  if (archive) {
    if (plan.status === "archived") throw illegal("archive", plan.status, []);
    return { status: "archived", statusBeforeArchive: plan.status };
  }
  if (plan.status !== "archived") throw illegal("restore", plan.status, ["archived"]);
  return { status: plan.statusBeforeArchive ?? "draft", statusBeforeArchive: null };
}

/** Role check before anything else is parsed (403 for a role the table does not list). */
export function requireStepRole(actor: Actor, step: WorkflowStep): void {
  requireRole(actor, ...WORKFLOW[step].roles);
}

const NOTIFY_KIND: Record<WorkflowStep, NotificationKind | null> = {
  submit: "submitted",
  approve: "decision",
  "request-changes": "decision",
  reopen: null,
};

/**
 * Runs a workflow step: 403 for the wrong role or a sandbox plan, 404 for a plan the actor
 * cannot see, 409 `illegal_transition` from a status the table does not allow. Records the
 * audit row and notifies (submit → reviewers and admins; decision → author and submitter).
 */
export async function runStep(
  services: Services,
  actor: Actor,
  id: string,
  step: WorkflowStep,
  note: string | undefined,
): Promise<PlanDetail> {
  const rule = WORKFLOW[step];
  requireStepRole(actor, step);
  const { dataSource } = services;
  const mail: PendingMail[] = await inTransaction(dataSource, async (manager) => {
    const plan = await findVisiblePlan(manager, actor, id);
    if (plan.sandbox) {
      throw forbidden("sandbox plans are personal scenarios: they are not submitted or decided");
    }
    if (!rule.from.includes(plan.status)) throw illegal(step, plan.status, rule.from);
    const now = new Date();
    const update: Partial<Plan> = { status: rule.to, updatedAt: now };
    if (step === "submit") update.submittedById = actor.userId;
    await manager.getRepository(Plan).update({ id }, update);
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: rule.action,
      targetType: "plan",
      targetId: id,
      detail: {
        name: plan.name,
        revision: plan.latestRevision,
        from: plan.status,
        to: rule.to,
        note: note || null,
      },
    });
    const kind = NOTIFY_KIND[step];
    if (!kind) return [];
    let recipients: string[];
    if (kind === "submitted") {
      recipients = await teamMembersWithRole(manager, actor.teamId, ["reviewer", "admin"]);
    } else {
      recipients = [plan.authorId, plan.submittedById].filter((u): u is string => u !== null);
    }
    const noteText = note ? ` Note: ${note}` : "";
    return notify(manager, services, {
      teamId: actor.teamId,
      plan,
      actor,
      kind,
      recipients: recipients.filter((u) => u !== actor.userId),
      text: `${actor.name} ${rule.verb} “${plan.name}” (revision ${plan.latestRevision}).${noteText}`,
    });
  });
  deliverMail(services, mail);
  return getPlan(dataSource, actor, id);
}

/** Audit actions in plain words for the activity lists ("plan.request_changes" → "returned the plan with notes"). */
import { PLAN_STATUS_LABELS, PLAN_STATUSES, type PlanStatus } from "@/contracts/plans";

const ACTIONS: Record<string, string> = {
  "plan.create": "created the plan",
  "plan.save": "saved a new revision",
  "plan.revise": "saved a new revision",
  "plan.rename": "renamed the plan",
  "plan.duplicate": "made a copy",
  "plan.archive": "archived the plan",
  "plan.unarchive": "restored the plan",
  "plan.restore": "restored the plan",
  "plan.submit": "submitted the plan for review",
  "plan.approve": "signed the plan off for mobilisation",
  "plan.request_changes": "returned the plan to the lead with notes",
  "plan.reopen": "started a new revision",
  "comment.create": "wrote a review note",
  "comment.reply": "replied to a review note",
  "comment.resolve": "closed a review note",
  "comment.reopen": "reopened a review note",
  "auth.sign_in": "signed in",
  "auth.password_reset": "reset their password",
  "invitation.create": "invited a member",
  "invitation.revoke": "withdrew an invitation",
  "invitation.accept": "joined the team",
  "member.role_change": "changed a member's role",
  "member.remove": "removed a member",
  "site.create": "created a site",
  "site.rename": "renamed a site",
  "site.describe": "edited a site's description",
  "site.archive": "archived a site",
  "site.unarchive": "restored a site",
};

/** A verb phrase for an audit action; unknown actions read as their words ("x.do_it" → "x: do it"). */
export function describeAction(action: string): string {
  const known = ACTIONS[action];
  if (known) return known;
  const [target, verb] = action.includes(".") ? action.split(".", 2) : ["", action];
  const words = verb.replace(/[_-]+/g, " ");
  return target ? `${target}: ${words}` : words;
}

const SHOWN = ["name", "revision", "message", "note", "email", "role"];

const isStatus = (value: unknown): value is PlanStatus =>
  typeof value === "string" && (PLAN_STATUSES as readonly string[]).includes(value);

/**
 * The useful parts of an event's detail, e.g. "In review → Changes requested · revision: 3 ·
 * note: tighten the spacing". Workflow statuses read in our own words.
 */
export function describeDetail(detail: Record<string, unknown> | null): string {
  if (!detail) return "";
  const parts: string[] = [];
  const { from, to } = detail;
  if (isStatus(from) && isStatus(to)) {
    parts.push(`${PLAN_STATUS_LABELS[from]} → ${PLAN_STATUS_LABELS[to]}`);
  } else if (
    (typeof from === "string" || typeof from === "number") &&
    (typeof to === "string" || typeof to === "number")
  ) {
    parts.push(`${from} → ${to}`);
  }
  for (const key of SHOWN) {
    const value = detail[key];
    if (value === undefined || value === null || value === "") continue;
    if (typeof value === "object") continue;
    const text = String(value);
    parts.push(`${key}: ${text.length > 140 ? `${text.slice(0, 139)}…` : text}`);
  }
  return parts.join(" · ");
}

export interface DecisionNote {
  kind: "submitted" | "approved" | "changes-requested";
  actorName: string | null;
  /** The note given with the step; null when none was given. */
  note: string | null;
  createdAt: string;
}

const DECISIONS: Array<[RegExp, DecisionNote["kind"] | "reopened"]> = [
  [/^plan\.request[_-]?changes$/, "changes-requested"],
  [/^plan\.approve$/, "approved"],
  [/^plan\.submit$/, "submitted"],
  [/^plan\.reopen$/, "reopened"],
];

/**
 * The newest workflow step (submit, approve, request changes) with its note, if any, so the
 * Decision card never credits an approval to the submitter; null when there is none yet or the
 * newest step started a new revision (the earlier decision is then history). Events may come in
 * any order.
 */
export function latestDecisionNote(
  events: ReadonlyArray<{
    action: string;
    actorName: string | null;
    detail: Record<string, unknown> | null;
    createdAt: string;
  }>,
): DecisionNote | null {
  let best: { kind: DecisionNote["kind"] | "reopened"; event: (typeof events)[number] } | null =
    null;
  for (const event of events) {
    const kind = DECISIONS.find(([pattern]) => pattern.test(event.action))?.[1];
    if (!kind) continue;
    if (!best || event.createdAt > best.event.createdAt) best = { kind, event };
  }
  if (!best || best.kind === "reopened") return null;
  const note = best.event.detail?.note;
  return {
    kind: best.kind,
    actorName: best.event.actorName,
    note: typeof note === "string" && note.trim() !== "" ? note : null,
    createdAt: best.event.createdAt,
  };
}

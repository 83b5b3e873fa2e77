/** Audit actions in plain words for the activity lists ("plan.request_changes" → "returned the plan with notes"). */
import { PLAN_STATUS_LABELS, PLAN_STATUSES, type PlanStatus } from "@/contracts/plans";
import { ROLE_LABELS, ROLES, type Role } from "@/contracts/common";

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
  "team.channels_change": "set the team's seismograph channel count",
  "site.create": "created a site",
  "site.rename": "renamed a site",
  "site.describe": "edited a site's description",
  "site.archive": "archived a site",
  "site.unarchive": "restored a site",
  "attachment.upload": "uploaded a file",
  "attachment.delete": "deleted a file",
  "picks.save": "saved first-break picks",
  "picks.choose_interpretation": "chose how the picks are interpreted under the line",
};

/** A verb phrase for an audit action; unknown actions read as their words ("x.do_it" → "x: do it"). */
export function describeAction(action: string): string {
  const known = ACTIONS[action];
  if (known) return known;
  const [target, verb] = action.includes(".") ? action.split(".", 2) : ["", action];
  const words = verb.replace(/[_-]+/g, " ");
  return target ? `${target}: ${words}` : words;
}

const SHOWN = ["name", "fileName", "revision", "message", "note", "email", "role", "method"];
/** The interpretation methods under the line, as the Field check names them. */
const METHOD_WORDS: Record<string, string> = {
  "plus-minus": "plus-minus",
  "delay-time": "delay-time",
  grm: "generalized reciprocal method",
};
/** How a detail key reads. */
const KEY_WORDS: Record<string, string> = { fileName: "file" };

const isStatus = (value: unknown): value is PlanStatus =>
  typeof value === "string" && (PLAN_STATUSES as readonly string[]).includes(value);
const isRole = (value: unknown): value is Role =>
  typeof value === "string" && (ROLES as readonly string[]).includes(value);

/**
 * The useful parts of an event's detail, e.g. "In review → Changes requested · revision: 3 ·
 * note: tighten the spacing". Workflow statuses and roles read in our own words ("Reviewer →
 * Trainee", not the stored "reviewer → trainee").
 */
export function describeDetail(detail: Record<string, unknown> | null): string {
  if (!detail) return "";
  const parts: string[] = [];
  const { from, to } = detail;
  if (isStatus(from) && isStatus(to)) {
    parts.push(`${PLAN_STATUS_LABELS[from]} → ${PLAN_STATUS_LABELS[to]}`);
  } else if (isRole(from) && isRole(to)) {
    parts.push(`${ROLE_LABELS[from]} → ${ROLE_LABELS[to]}`);
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
    const text =
      key === "role" && isRole(value)
        ? ROLE_LABELS[value]
        : key === "method"
          ? (METHOD_WORDS[String(value)] ?? String(value))
          : String(value);
    parts.push(`${KEY_WORDS[key] ?? key}: ${text.length > 140 ? `${text.slice(0, 139)}…` : text}`);
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

/** Kinds of team activity a reader can filter by. */
export type ActivityKind = "plans" | "review" | "files" | "sign-ins" | "team" | "sites";

export const ACTIVITY_KINDS: Array<{ value: ActivityKind; label: string }> = [
  { value: "plans", label: "Plans and revisions" },
  { value: "review", label: "Review and notes" },
  { value: "files", label: "Field files and picks" },
  { value: "sign-ins", label: "Sign-ins" },
  { value: "team", label: "Team and invitations" },
  { value: "sites", label: "Sites" },
];

/** Which kind an audit action belongs to ("attachment.upload" → files). */
export function activityKind(action: string): ActivityKind {
  if (/^plan\.(submit|approve|request_changes|reopen)$/.test(action)) return "review";
  if (action.startsWith("comment.")) return "review";
  if (action.startsWith("plan.")) return "plans";
  if (action.startsWith("attachment.") || action.startsWith("picks.")) return "files";
  if (action.startsWith("auth.")) return "sign-ins";
  if (action.startsWith("site.")) return "sites";
  return "team";
}

/** An event as the team activity list needs it (a subset of `AuditEventSummary`). */
export interface TrailEvent {
  id: string;
  action: string;
  actor: { id: string; name: string } | null;
  targetType: string;
  targetId: string | null;
  targetName?: string | null;
  detail: Record<string, unknown> | null;
  createdAt: string;
}

/** One row of the list: an event, or a run of sign-ins by one person folded into one row. */
export interface TrailRow<E extends TrailEvent = TrailEvent> {
  event: E;
  /** How many events the row stands for (1 unless sign-ins were folded). */
  count: number;
  /** The oldest folded event's time (equals `event.createdAt` when count is 1). */
  since: string;
}

/**
 * Folds each run of consecutive sign-ins by the same person into one row (newest first, as the
 * trail comes); everything else stays one row per event.
 */
export function foldSignIns<E extends TrailEvent>(events: readonly E[]): TrailRow<E>[] {
  const rows: TrailRow<E>[] = [];
  for (const event of events) {
    const last = rows.at(-1);
    if (
      last &&
      event.action === "auth.sign_in" &&
      last.event.action === "auth.sign_in" &&
      (last.event.actor?.id ?? null) === (event.actor?.id ?? null)
    ) {
      last.count += 1;
      last.since = event.createdAt;
      continue;
    }
    rows.push({ event, count: 1, since: event.createdAt });
  }
  return rows;
}

/** Events of one kind and/or one person (`null` for any). */
export function filterTrail<E extends TrailEvent>(
  events: readonly E[],
  kind: ActivityKind | null,
  personId: string | null,
): E[] {
  return events.filter(
    (e) =>
      (kind === null || activityKind(e.action) === kind) &&
      (personId === null || e.actor?.id === personId),
  );
}

/**
 * What an event was about, for the list: the plan or site by name, the file by name
 * ("shot-12.sg2"), the member by name. Empty when there is nothing to name.
 */
export function describeObject(event: TrailEvent): string {
  const detail = event.detail ?? {};
  const text = (key: string) => {
    const value = detail[key];
    return typeof value === "string" && value !== "" ? value : null;
  };
  const parts: string[] = [];
  const fileName = text("fileName");
  if (fileName) parts.push(fileName);
  const name =
    event.targetName ??
    (event.targetType === "plan" || event.targetType === "site" ? text("name") : null);
  if (event.targetType === "plan" && name) parts.push(`${fileName ? "on " : ""}plan “${name}”`);
  else if (event.targetType === "site" && name) parts.push(`site “${name}”`);
  else if (event.targetType === "user" && text("name")) parts.push(text("name")!);
  else if (event.targetType === "invitation" && text("email")) parts.push(text("email")!);
  return parts.join(" ");
}

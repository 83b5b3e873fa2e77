/**
 * Plans, their revisions, the review workflow, comments and notifications: request bodies and
 * responses shared by the client and the server. A plan's `document` is the engine's plan
 * schema (workers/engine/plan-schema.ts), stored in SI units.
 */
import { z } from "zod";
import { planSchema, type Plan } from "../../workers/engine/plan-schema";
import type { Role } from "./common";

export const PLAN_STATUSES = [
  "draft",
  "in-review",
  "changes-requested",
  "approved",
  "archived",
] as const;
export type PlanStatus = (typeof PLAN_STATUSES)[number];

export const PLAN_STATUS_LABELS: Record<PlanStatus, string> = {
  draft: "Draft",
  "in-review": "In review",
  "changes-requested": "Changes requested",
  approved: "Approved",
  archived: "Archived",
};

/** Worst resolvability verdict over every model, shot and refractor of a revision. */
export type Verdict = "resolved" | "under-sampled" | "blind" | "inverted";

const planName = z
  .string({ error: "name is required" })
  .trim()
  .min(1, "name is required")
  .max(120, "name must be at most 120 characters");

/** POST /api/sites/:siteId/plans — a trainee's plan always lands in their own sandbox. */
export const planCreateSchema = z.strictObject({
  name: planName,
  /** Optional starting document; the server fills a sensible two-layer default when absent. */
  document: planSchema.optional(),
});
export type PlanCreateInput = z.input<typeof planCreateSchema>;

/** PUT /api/plans/:id — saves a new revision. 409 `revision_conflict` when baseRevision is not the latest. */
export const planSaveSchema = z.strictObject({
  baseRevision: z.number().int().min(1),
  document: planSchema,
  /** Optional one-line description of the change, shown in the history. */
  message: z.string().trim().max(300).optional(),
});
export type PlanSaveInput = z.input<typeof planSaveSchema>;

/** PATCH /api/plans/:id — rename or archive/restore without a new revision. */
export const planUpdateSchema = z
  .strictObject({ name: planName, archived: z.boolean() })
  .partial()
  .refine((v) => Object.keys(v).length > 0, "nothing to change");

/** POST /api/plans/:id/duplicate */
export const planDuplicateSchema = z.strictObject({ name: planName.optional() });

/** POST /api/plans/:id/request-changes — the note is required. */
export const requestChangesSchema = z.strictObject({
  note: z.string().trim().min(1, "say what needs to change").max(4000),
});
/** POST /api/plans/:id/approve and /submit — an optional note. */
export const decisionNoteSchema = z.strictObject({ note: z.string().trim().max(4000).optional() });

export const commentAnchorSchema = z.strictObject({
  kind: z.enum(["layer", "refractor", "shot"]),
  /** Index of the candidate ground model (0-based). Ignored for shots. */
  model: z.number().int().min(0).max(7).default(0),
  /** 0-based layer index, refractor layer index, or shot index. */
  index: z.number().int().min(0).max(100),
});
export type CommentAnchor = z.infer<typeof commentAnchorSchema>;

/** POST /api/plans/:id/comments */
export const commentCreateSchema = z.strictObject({
  body: z.string().trim().min(1, "write a comment").max(4000, "comment is too long"),
  /** Revision commented on; defaults to the latest. */
  revision: z.number().int().min(1).optional(),
  /** Reply to a thread: the id of its first comment. */
  parentId: z.uuid().optional(),
  anchor: commentAnchorSchema.optional(),
});
export type CommentCreateInput = z.input<typeof commentCreateSchema>;

/** PATCH /api/comments/:id — resolve or reopen a thread (on its first comment). */
export const commentUpdateSchema = z.strictObject({ resolved: z.boolean() });

export const notificationSettingsSchema = z.strictObject({
  submitted: z.boolean(),
  decision: z.boolean(),
  mention: z.boolean(),
  reply: z.boolean(),
});
export type NotificationSettings = z.infer<typeof notificationSettingsSchema>;

export interface PlanSummary {
  id: string;
  siteId: string;
  name: string;
  status: PlanStatus;
  /** True for a trainee's personal sandbox plan (visible to its author, admins and reviewers only as read). */
  sandbox: boolean;
  author: { id: string; name: string };
  revision: number;
  worstVerdict: Verdict | null;
  updatedAt: string;
  createdAt: string;
}

export interface PlanDetail extends PlanSummary {
  siteName: string;
  document: Plan;
  /** What the signed-in user may do with this plan right now (server-computed). */
  permissions: {
    edit: boolean;
    submit: boolean;
    decide: boolean;
    comment: boolean;
    reopen: boolean;
    archive: boolean;
  };
}

export interface RevisionSummary {
  number: number;
  author: { id: string; name: string };
  createdAt: string;
  message: string | null;
  worstVerdict: Verdict | null;
}

export interface RevisionDetail extends RevisionSummary {
  document: Plan;
  /** Analysis summary stored with the revision: per model, per refractor status and depth error. */
  summary: unknown;
}

export interface CommentView {
  id: string;
  parentId: string | null;
  revision: number;
  author: { id: string; name: string; role: Role };
  body: string;
  anchor: CommentAnchor | null;
  resolved: boolean;
  mentions: string[];
  createdAt: string;
}

export type NotificationKind = "submitted" | "decision" | "mention" | "reply";

export interface NotificationView {
  id: string;
  kind: NotificationKind;
  planId: string;
  planName: string;
  actorName: string;
  text: string;
  link: string;
  read: boolean;
  createdAt: string;
}

export interface ActivityView {
  id: string;
  actorName: string | null;
  action: string;
  targetType: string;
  targetId: string | null;
  detail: Record<string, unknown> | null;
  createdAt: string;
}

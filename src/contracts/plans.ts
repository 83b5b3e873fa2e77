/**
 * Plans, their revisions, the review workflow, comments and notifications: request bodies and
 * responses shared by the client and the server. A plan's `document` is the engine's plan
 * schema (workers/engine/plan-schema.ts), stored in SI units.
 */
import { z } from "zod";
import { planSchema, type Layer, type Plan, type Shot } from "../../workers/engine/plan-schema";
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
  "changes-requested": "Returned with notes",
  approved: "Signed off",
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

/** GET /api/sites/:siteId/plans?archived= — default "false" (archived plans hidden). */
export const planListQuerySchema = z.strictObject({
  archived: z
    .enum(["true", "false", "all"], { error: "archived must be true, false or all" })
    .default("false"),
});

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

/** GET /api/plans/:id/comments?revision= — only the threads on that revision. */
export const commentListQuerySchema = z.strictObject({
  revision: z.coerce
    .number({ error: "revision must be a number" })
    .int("revision must be a whole number")
    .min(1, "revision must be at least 1")
    .optional(),
});

const revisionNumber = (label: string) =>
  z.coerce
    .number({ error: `${label} must be a revision number` })
    .int(`${label} must be a whole number`)
    .min(1, `${label} must be at least 1`);

/** GET /api/plans/:id/diff?from=a&to=b */
export const diffQuerySchema = z.strictObject({
  from: revisionNumber("from"),
  to: revisionNumber("to"),
});

/** GET /api/notifications?unread=true&limit= */
export const notificationListQuerySchema = z.strictObject({
  unread: z.enum(["true", "false"], { error: "unread must be true or false" }).default("false"),
  limit: z.coerce
    .number({ error: "limit must be a number" })
    .int("limit must be a whole number")
    .min(1, "limit must be at least 1")
    .max(500, "limit must be at most 500")
    .default(100),
});

/** GET /api/plans/:id/activity (and .csv) and GET /api/audit.csv */
export const activityQuerySchema = z.strictObject({
  limit: z.coerce
    .number({ error: "limit must be a number" })
    .int("limit must be a whole number")
    .min(1, "limit must be at least 1")
    .max(5000, "limit must be at most 5000")
    .default(1000),
});

export const notificationSettingsSchema = z.strictObject({
  submitted: z.boolean(),
  decision: z.boolean(),
  mention: z.boolean(),
  reply: z.boolean(),
});
export type NotificationSettings = z.infer<typeof notificationSettingsSchema>;
/** Every kind of e-mail is on until the user turns it off. */
export const DEFAULT_NOTIFICATION_SETTINGS: NotificationSettings = {
  submitted: true,
  decision: true,
  mention: true,
  reply: true,
};

/** Error codes of the plan routes (beside the common ones in docs/api.md). */
export const PLAN_ERROR_CODES = {
  /** 409: the save was based on an older revision. `fields.latestRevision = ["<n>"]`. */
  revisionConflict: "revision_conflict",
  /** 409: the plan is in review, approved or archived and cannot be saved. */
  locked: "plan_locked",
  /** 409: the workflow step is not allowed from the plan's current status. */
  illegalTransition: "illegal_transition",
} as const;

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
    /** May make a copy (a trainee's copy lands in their sandbox). */
    duplicate: boolean;
  };
  /** For an archived plan: the status it returns to when restored; otherwise null. */
  statusBeforeArchive: PlanStatus | null;
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
  summary: RevisionAnalysisSummary | null;
}

/** One refractor of a model in a revision's stored analysis (depths in m, under the first shot). */
export interface RefractorSummary {
  /** 1-based number of the layer whose top this refractor is. */
  layer: number;
  name: string | null;
  status: Verdict;
  /** True depth to the refractor, m. */
  trueDepth: number;
  /** Depth the intercept-time method would give, m; null when the refractor is not resolved. */
  interpretedDepth: number | null;
  /** interpretedDepth − trueDepth, m (positive: too deep); null when not interpreted. */
  error: number | null;
  /** |error| exceeds the plan's depth tolerance. */
  exceedsTolerance: boolean;
  /** Thinnest this layer may be and still be resolved with the spread, m; null when none / half-space. */
  minimumThickness: number | null;
}

/** The compact analysis stored with every revision (computed by the server with `analyzePlan`). */
export interface RevisionAnalysisSummary {
  format: "spreadsight-revision-summary/1";
  worstVerdict: Verdict;
  models: {
    name: string;
    worstStatus: Verdict;
    /** The direct wave's verdict ("resolved" or "under-sampled"). */
    direct: Verdict;
    refractors: RefractorSummary[];
    /** The engine's recommendation sentence for this model. */
    recommendation: string;
  }[];
  recommendation: {
    maxSpacing: number | null;
    spreadLength: number;
    channels: number;
    text: string;
  };
}

/** A value in a diff: numbers in SI units, text, or null when absent. */
export type DiffValue = number | string | boolean | null;

export interface FieldChange {
  /** Field name, e.g. "velocity", "thickness", "spacing", "minGeophones". */
  field: string;
  from: DiffValue;
  to: DiffValue;
}

export interface LayerDiff {
  /** "added": only in `to`; "removed": only in `from`; "changed": in both with field changes. */
  change: "added" | "removed" | "changed";
  /** 0-based index in the older revision (null when added). */
  fromIndex: number | null;
  /** 0-based index in the newer revision (null when removed). */
  toIndex: number | null;
  from: Layer | null;
  to: Layer | null;
  /** The fields that differ (every field of the layer for added/removed). */
  fields: FieldChange[];
}

export interface ModelDiff {
  change: "added" | "removed" | "changed";
  /** Model name in the older / newer revision (null when absent). Models are matched by name, then by position. */
  fromName: string | null;
  toName: string | null;
  fromIndex: number | null;
  toIndex: number | null;
  /** Only the layers that differ, aligned by the cheapest edit: a layer with few changed fields is
   * "changed"; an inserted or deleted layer is "added"/"removed" (so indexes may shift). */
  layers: LayerDiff[];
}

export interface VerdictChange {
  /** Model name in the newer revision (older name for a removed model). */
  model: string;
  /** Refractor layer number (1-based); null for the model's worst verdict. */
  layer: number | null;
  from: Verdict | null;
  to: Verdict | null;
  /** Depth errors (m) before and after, when interpreted. */
  errorFrom: number | null;
  errorTo: number | null;
}

/** GET /api/plans/:id/diff?from=a&to=b — what changed from revision a to revision b. */
export interface PlanDiff {
  planId: string;
  from: number;
  to: number;
  /** Changes of the document's own name, if any. */
  name: FieldChange | null;
  /** Only models that differ. */
  models: ModelDiff[];
  /** spacing, channels, firstGeophone. */
  spread: FieldChange[];
  shots: { added: Shot[]; removed: Shot[] };
  /** minGeophones, pickError, depthTolerance. */
  criteria: FieldChange[];
  worstVerdict: { from: Verdict | null; to: Verdict | null } | null;
  verdicts: VerdictChange[];
  /** True when nothing at all differs. */
  identical: boolean;
}

export interface CommentView {
  id: string;
  parentId: string | null;
  revision: number;
  author: { id: string; name: string; role: Role };
  body: string;
  anchor: CommentAnchor | null;
  resolved: boolean;
  /** Ids of the mentioned team members. */
  mentions: string[];
  /** Who resolved the thread and when (thread roots only; null while open). */
  resolvedBy: { id: string; name: string } | null;
  resolvedAt: string | null;
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
  /** In-app path of the plan's Review screen, e.g. "/plans/<id>/review" (e-mails carry the absolute URL). */
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

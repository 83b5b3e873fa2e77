/** Shapes shared by the client and the server: roles, errors, ids. */
import { z } from "zod";

export const ROLES = ["admin", "lead", "reviewer", "trainee"] as const;
export const roleSchema = z.enum(ROLES, { error: "role must be admin, lead, reviewer or trainee" });
export type Role = z.infer<typeof roleSchema>;

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Admin",
  lead: "Survey lead",
  reviewer: "Reviewer",
  trainee: "Trainee",
};

/** Route parameter ids are UUIDs. */
export const idParamSchema = z.strictObject({ id: z.uuid({ error: "id must be a UUID" }) });

/** The JSON body of every error response. */
export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string[]> };
}

/** What each role may do (design.md role table). Checked on the server; the client hides what a role cannot do. */
export const can = {
  manageTeam: (role: Role) => role === "admin",
  editSites: (role: Role) => role === "admin" || role === "lead",
  editPlans: (role: Role) => role === "admin" || role === "lead",
  submitPlans: (role: Role) => role === "admin" || role === "lead",
  decidePlans: (role: Role) => role === "admin" || role === "reviewer",
  /** On any plan the role can see; a trainee only on their own sandbox scenario (`mayCommentOn`). */
  comment: (role: Role) => role !== "trainee",
  useSandbox: (role: Role) => role === "trainee",
  exportReports: (role: Role) => role === "admin" || role === "lead" || role === "reviewer",
  readMailbox: (role: Role) => role === "admin",
} as const;

/**
 * Whether `actor` may comment on `plan` (which they can already see): every role but trainee
 * on any such plan; a trainee on their own sandbox scenario only, so they can ask a reviewer a
 * question there; team plans stay read-only to trainees.
 */
export function mayCommentOn(
  actor: { role: Role; userId: string },
  plan: { sandbox: boolean; authorId: string },
): boolean {
  if (can.comment(actor.role)) return true;
  return actor.role === "trainee" && plan.sandbox && plan.authorId === actor.userId;
}

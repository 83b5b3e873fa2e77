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
  comment: (role: Role) => role !== "trainee",
  useSandbox: (role: Role) => role === "trainee",
  exportReports: (role: Role) => role === "admin" || role === "lead" || role === "reviewer",
  readMailbox: (role: Role) => role === "admin",
} as const;

/** Sign-in, invitations and password reset: request bodies and responses. */
import { z } from "zod";
import { roleSchema, type Role } from "./common";

export const emailSchema = z
  .email({ error: "enter a valid e-mail address" })
  .max(200, "e-mail address is too long")
  .transform((v) => v.toLowerCase());

export const passwordSchema = z
  .string({ error: "password is required" })
  .min(10, "password must be at least 10 characters")
  .max(200, "password must be at most 200 characters");

export const signInSchema = z.strictObject({
  email: emailSchema,
  password: z.string({ error: "password is required" }).min(1, "password is required").max(200),
});
export type SignInInput = z.input<typeof signInSchema>;

export const inviteSchema = z.strictObject({ email: emailSchema, role: roleSchema });
export type InviteInput = z.input<typeof inviteSchema>;

export const acceptInvitationSchema = z.strictObject({
  name: z.string().trim().min(1, "name is required").max(100, "name is too long"),
  password: passwordSchema,
});
export type AcceptInvitationInput = z.input<typeof acceptInvitationSchema>;

export const requestResetSchema = z.strictObject({ email: emailSchema });
export const completeResetSchema = z.strictObject({ password: passwordSchema });

export const preferencesSchema = z.strictObject({
  units: z.enum(["metric", "imperial"], { error: "units must be metric or imperial" }),
});
export type Preferences = z.infer<typeof preferencesSchema>;

export interface MeResponse {
  user: { id: string; email: string; name: string };
  team: { id: string; name: string };
  role: Role;
  preferences: Preferences;
  /** True when the server runs in demo mode (fake mailbox available to admins). */
  demo: boolean;
  /** True when the built-in fake mailbox catches outgoing e-mail (no SMTP_URL set); admins may
   * then read it at GET /api/mailbox. Usually equal to `demo`. Always sent by the server. */
  mailbox?: boolean;
}

export interface InvitationSummary {
  id: string;
  email: string;
  role: Role;
  invitedBy: string;
  createdAt: string;
  expiresAt: string;
}

/** GET /api/invitations/:token (public): what the invitee sees before accepting. */
export interface InvitationPreview {
  email: string;
  role: Role;
  teamName: string;
  expiresAt: string;
}

/** POST /api/auth/sign-out takes no fields (an empty body or `{}`). */
export const signOutSchema = z.strictObject({});

/** The team's audit trail (GET /api/audit). */
import { z } from "zod";

export const auditQuerySchema = z.strictObject({
  limit: z.coerce
    .number({ error: "limit must be a number" })
    .int("limit must be a whole number")
    .min(1, "limit must be at least 1")
    .max(500, "limit must be at most 500")
    .default(100),
});

export interface AuditEventSummary {
  id: string;
  /** Dotted verb: auth.sign_in, auth.password_reset, invitation.create, invitation.revoke,
   * invitation.accept, member.role_change, member.remove, team.channels_change (detail
   * { from, to }), site.create, site.rename,
   * site.describe, site.archive, site.unarchive, and every plan action (plan.*, comment.*,
   * attachment.upload, attachment.delete, picks.save). */
  action: string;
  actor: { id: string; name: string } | null;
  targetType: string;
  targetId: string | null;
  /** The plan's or site's current name when the target is one (null otherwise or when gone). */
  targetName?: string | null;
  detail: Record<string, string | number | boolean | null>;
  createdAt: string;
}

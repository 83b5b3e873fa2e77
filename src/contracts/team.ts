/** Team members: list, change role, remove. */
import { z } from "zod";
import { roleSchema, type Role } from "./common";

export const changeRoleSchema = z.strictObject({ role: roleSchema });

export interface MemberSummary {
  userId: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
}

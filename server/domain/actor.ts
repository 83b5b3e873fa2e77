/** Who is asking: the signed-in user with their team and role, and the role checks. */
import { can, type Role } from "@/contracts/common";
import { forbidden } from "./errors";

export interface Actor {
  userId: string;
  name: string;
  email: string;
  teamId: string;
  teamName: string;
  role: Role;
}

export type Permission = keyof typeof can;

/** Throws 403 `forbidden` unless the actor's role has the permission (design.md role table). */
export function requirePermission(actor: Actor, permission: Permission): void {
  if (!can[permission](actor.role)) throw forbidden();
}

/** Throws 403 unless the actor's role is one of `roles`. */
export function requireRole(actor: Actor, ...roles: Role[]): void {
  if (!roles.includes(actor.role)) throw forbidden();
}

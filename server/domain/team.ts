/**
 * Team members (list, change role, remove; admin-only changes, the last admin stays) and team
 * settings (every member reads them, an admin changes them).
 */
import type { DataSource, EntityManager } from "typeorm";
import type { Role } from "@/contracts/common";
import type { MemberSummary, TeamSettings, TeamSettingsUpdate } from "@/contracts/team";
import { Membership } from "../data/entities/membership";
import { Team } from "../data/entities/team";
import { inTransaction } from "../data/transaction";
import { Session } from "../data/entities/session";
import type { Actor } from "./actor";
import { requirePermission } from "./actor";
import { recordAudit } from "./audit";
import { AppError, notFound } from "./errors";

/** Every member of the actor's team (any role may read it: colleagues' names and addresses). */
export async function listMembers(dataSource: DataSource, actor: Actor): Promise<MemberSummary[]> {
  const rows = await dataSource.getRepository(Membership).find({
    where: { teamId: actor.teamId },
    relations: { user: true },
  });
  return rows
    .filter((m) => m.user)
    .map((m) => ({
      userId: m.userId,
      name: m.user!.name,
      email: m.user!.email,
      role: m.role,
      joinedAt: m.createdAt.toISOString(),
    }))
    .sort((a, b) => a.name.localeCompare(b.name) || a.userId.localeCompare(b.userId));
}

async function findMember(manager: EntityManager, actor: Actor, userId: string) {
  const membership = await manager.getRepository(Membership).findOne({
    where: { userId, teamId: actor.teamId },
    relations: { user: true },
  });
  if (!membership?.user) throw notFound("member");
  return membership;
}

async function assertNotLastAdmin(manager: EntityManager, teamId: string, what: string) {
  const admins = await manager.getRepository(Membership).countBy({ teamId, role: "admin" });
  if (admins <= 1) {
    throw new AppError(409, "last_admin", `the team's only admin cannot be ${what}`);
  }
}

export async function changeRole(
  dataSource: DataSource,
  actor: Actor,
  userId: string,
  role: Role,
): Promise<MemberSummary> {
  requirePermission(actor, "manageTeam");
  const result = await inTransaction(dataSource, async (manager) => {
    const member = await findMember(manager, actor, userId);
    if (member.role !== role) {
      if (member.role === "admin") await assertNotLastAdmin(manager, actor.teamId, "demoted");
      await manager.getRepository(Membership).update({ id: member.id }, { role });
      await recordAudit(manager, {
        teamId: actor.teamId,
        actorId: actor.userId,
        action: "member.role_change",
        targetType: "user",
        targetId: userId,
        detail: { name: member.user!.name, from: member.role, to: role },
      });
    }
    return {
      userId,
      name: member.user!.name,
      email: member.user!.email,
      role,
      joinedAt: member.createdAt.toISOString(),
    };
  });
  return result;
}

/** Removes the membership and ends the user's sessions. The user row stays (audit history);
 * without a membership the account cannot sign in, and a new invitation can bring it back. */
export async function removeMember(
  dataSource: DataSource,
  actor: Actor,
  userId: string,
): Promise<void> {
  requirePermission(actor, "manageTeam");
  await inTransaction(dataSource, async (manager) => {
    const member = await findMember(manager, actor, userId);
    if (member.role === "admin") await assertNotLastAdmin(manager, actor.teamId, "removed");
    await manager.getRepository(Membership).delete({ id: member.id });
    await manager.getRepository(Session).delete({ userId });
    await recordAudit(manager, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "member.remove",
      targetType: "user",
      targetId: userId,
      detail: { name: member.user!.name, email: member.user!.email, role: member.role },
    });
  });
}

function toSettings(team: Team): TeamSettings {
  return { seismographChannels: team.seismographChannels };
}

/** The actor's team's settings (any role may read them: the designer needs the channel count). */
export async function getTeamSettings(dataSource: DataSource, actor: Actor): Promise<TeamSettings> {
  const team = await dataSource.getRepository(Team).findOneBy({ id: actor.teamId });
  if (!team) throw notFound("team");
  return toSettings(team);
}

/**
 * Changes the actor's team's settings (admin: design.md gives the team to the admin). A change
 * is recorded as `team.channels_change` with `{ from, to }`; the same value again writes nothing.
 */
export async function updateTeamSettings(
  dataSource: DataSource,
  actor: Actor,
  input: TeamSettingsUpdate,
): Promise<TeamSettings> {
  requirePermission(actor, "manageTeam");
  return inTransaction(dataSource, async (manager) => {
    const teams = manager.getRepository(Team);
    const team = await teams.findOneBy({ id: actor.teamId });
    if (!team) throw notFound("team");
    const from = team.seismographChannels;
    const to = input.seismographChannels;
    if (from !== to) {
      await teams.update({ id: team.id }, { seismographChannels: to });
      await recordAudit(manager, {
        teamId: actor.teamId,
        actorId: actor.userId,
        action: "team.channels_change",
        targetType: "team",
        targetId: actor.teamId,
        detail: { from, to },
      });
    }
    return { seismographChannels: to };
  });
}

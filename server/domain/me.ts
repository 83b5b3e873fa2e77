/** The signed-in user's own view: identity, team, role and preferences. */
import type { DataSource } from "typeorm";
import type { MeResponse, Preferences } from "@/contracts/auth";
import { Membership } from "../data/entities/membership";
import { UserPreference } from "../data/entities/user-preference";
import type { Actor } from "./actor";

const DEFAULT_PREFERENCES: Preferences = { units: "metric" };

/** The user with their team and role, or null when the user has no membership (removed). */
export async function loadActor(dataSource: DataSource, userId: string): Promise<Actor | null> {
  const membership = await dataSource.getRepository(Membership).findOne({
    where: { userId },
    relations: { user: true, team: true },
  });
  if (!membership?.user || !membership.team) return null;
  return {
    userId,
    name: membership.user.name,
    email: membership.user.email,
    teamId: membership.teamId,
    teamName: membership.team.name,
    role: membership.role,
  };
}

export async function loadPreferences(
  dataSource: DataSource,
  userId: string,
): Promise<Preferences> {
  const row = await dataSource.getRepository(UserPreference).findOneBy({ userId });
  return row ? { units: row.units } : { ...DEFAULT_PREFERENCES };
}

export async function savePreferences(
  dataSource: DataSource,
  actor: Actor,
  preferences: Preferences,
): Promise<void> {
  await dataSource
    .getRepository(UserPreference)
    .upsert({ userId: actor.userId, units: preferences.units, updatedAt: new Date() }, ["userId"]);
}

export interface ServerFlags {
  demo: boolean;
  mailbox: boolean;
}

export async function meResponse(
  dataSource: DataSource,
  actor: Actor,
  flags: ServerFlags,
): Promise<MeResponse> {
  return {
    user: { id: actor.userId, email: actor.email, name: actor.name },
    team: { id: actor.teamId, name: actor.teamName },
    role: actor.role,
    preferences: await loadPreferences(dataSource, actor.userId),
    demo: flags.demo,
    mailbox: flags.mailbox,
  };
}

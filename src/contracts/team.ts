/** Team members: list, change role, remove; team settings: read, change. */
import { z } from "zod";
import { MAX_CHANNELS } from "../../workers/engine/plan-schema";
import { roleSchema, type Role } from "./common";

export const changeRoleSchema = z.strictObject({ role: roleSchema });

export interface MemberSummary {
  userId: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
}

/** A new team's seismograph channel count (a common recorder size; common practice). */
export const TEAM_SEISMOGRAPH_CHANNELS_DEFAULT = 48;
/** Fewest channels a seismograph setting may have (one geophone interval). */
export const MIN_SEISMOGRAPH_CHANNELS = 2;
/** Most channels a seismograph setting may have: the plan format's MAX_CHANNELS. */
export const MAX_SEISMOGRAPH_CHANNELS = MAX_CHANNELS;

export const seismographChannelsSchema = z
  .number({ error: "seismographChannels must be a whole number" })
  .int("seismographChannels must be a whole number")
  .min(MIN_SEISMOGRAPH_CHANNELS, `seismographChannels must be at least ${MIN_SEISMOGRAPH_CHANNELS}`)
  .max(MAX_CHANNELS, `seismographChannels must be at most ${MAX_CHANNELS}`);

/** Body of PATCH /api/team/settings. */
export const teamSettingsUpdateSchema = z.strictObject({
  seismographChannels: seismographChannelsSchema,
});
export type TeamSettingsUpdate = z.infer<typeof teamSettingsUpdateSchema>;

/** The team's settings (GET/PATCH /api/team/settings). */
export interface TeamSettings {
  /** Channels the team's seismograph records; the designer flags spreads that need more. */
  seismographChannels: number;
}

import { useCallback, useEffect, useRef } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { can } from "@/contracts/common";
import {
  MAX_SEISMOGRAPH_CHANNELS,
  MIN_SEISMOGRAPH_CHANNELS,
  type TeamSettings,
} from "@/contracts/team";
import { useMe } from "@/features/auth/api/me";
import { saveTeamSettings, teamSettingsQueryOptions } from "@/features/team/api/team-settings";
import { DEFAULT_SEISMOGRAPH_CHANNELS } from "../lib/apply-choices";

/** Quiet time after the last change before it is sent, so typing "96" saves once, not 9 then 96. */
export const SAVE_DELAY_MS = 800;

const isChannelCount = (n: number) =>
  Number.isInteger(n) && n >= MIN_SEISMOGRAPH_CHANNELS && n <= MAX_SEISMOGRAPH_CHANNELS;

/**
 * The team's seismograph channel count, a team setting stored on the server (GET/PATCH
 * /api/team/settings), so every plan's Apply choices flag spreads that need more channels than
 * the recorder has. The default (48, common practice) stands in while it loads or if it fails.
 *
 * The setter shows the new count at once and saves it after a short pause; it does nothing for
 * a role that may not change team settings (only an admin may) or for a count outside 2…1024.
 * The third element says whether this user may change it (screens show the count read-only
 * otherwise).
 */
export function useSeismographChannels(): [number, (n: number) => void, boolean] {
  const { data: me } = useMe();
  const queryClient = useQueryClient();
  const settings = useQuery({ ...teamSettingsQueryOptions, enabled: Boolean(me) });
  const mayChange = me ? can.manageTeam(me.role) : false;
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const pending = useRef<number | null>(null);

  const flush = useCallback(() => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    const n = pending.current;
    pending.current = null;
    // A refusal is undone by the refetch in saveTeamSettings; the Team page shows errors.
    if (n !== null) saveTeamSettings(queryClient, { seismographChannels: n }).catch(() => {});
  }, [queryClient]);

  // Leaving the designer before the pause ends still saves the last count.
  useEffect(() => flush, [flush]);

  const set = useCallback(
    (n: number) => {
      if (!mayChange || !isChannelCount(n)) return;
      const { queryKey } = teamSettingsQueryOptions;
      // A load still under way would overwrite the new count when it lands: cancel it first.
      void queryClient.cancelQueries({ queryKey }).then(() =>
        queryClient.setQueryData(queryKey, (old: TeamSettings | undefined) => ({
          ...old,
          seismographChannels: n,
        })),
      );
      pending.current = n;
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(flush, SAVE_DELAY_MS);
    },
    [mayChange, queryClient, flush],
  );

  return [settings.data?.seismographChannels ?? DEFAULT_SEISMOGRAPH_CHANNELS, set, mayChange];
}

/** GET and PATCH /api/team/settings: the team's settings (the seismograph's channel count). */
import {
  queryOptions,
  useMutation,
  useQuery,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { get, patch } from "@/lib/api-client";
import type { TeamSettings, TeamSettingsUpdate } from "@/contracts/team";

export const teamSettingsQueryOptions = queryOptions({
  queryKey: ["team", "settings"],
  queryFn: () => get<TeamSettings>("/api/team/settings"),
  staleTime: 60_000,
});

export const useTeamSettings = () => useQuery(teamSettingsQueryOptions);

/**
 * Sends a change (admin). The answer replaces the cached settings and the team's activity is
 * refetched; a refusal refetches the settings, so an optimistic value shown meanwhile is undone.
 */
export async function saveTeamSettings(
  queryClient: QueryClient,
  input: TeamSettingsUpdate,
): Promise<TeamSettings> {
  try {
    const settings = await patch<TeamSettings>("/api/team/settings", input);
    queryClient.setQueryData(teamSettingsQueryOptions.queryKey, settings);
    void queryClient.invalidateQueries({ queryKey: ["audit"] });
    return settings;
  } catch (error) {
    void queryClient.invalidateQueries({ queryKey: teamSettingsQueryOptions.queryKey });
    throw error;
  }
}

export function useUpdateTeamSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: TeamSettingsUpdate) => saveTeamSettings(queryClient, input),
  });
}

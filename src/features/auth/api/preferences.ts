import { useMutation, useQueryClient } from "@tanstack/react-query";
import { put } from "@/lib/api-client";
import type { MeResponse, Preferences } from "@/contracts/auth";
import { meQueryOptions } from "./me";

export function useUpdatePreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: Preferences) => put<Preferences>("/api/me/preferences", input),
    onSuccess: (preferences) => {
      queryClient.setQueryData<MeResponse | null>(meQueryOptions.queryKey, (me) =>
        me ? { ...me, preferences } : me,
      );
    },
  });
}

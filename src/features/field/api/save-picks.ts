import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { PickSetView, PicksSaveInput } from "@/contracts/field";
import { put } from "@/lib/api-client";
import { fieldKeys } from "./field-keys";

/** PUT /api/plans/:id/picks — replaces the plan's saved picks. */
export const savePicks = (planId: string, input: PicksSaveInput) =>
  put<PickSetView>(`/api/plans/${encodeURIComponent(planId)}/picks`, input);

export function useSavePicks(planId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PicksSaveInput) => savePicks(planId, input),
    onSuccess: (view) => queryClient.setQueryData(fieldKeys.picks(planId), view),
  });
}

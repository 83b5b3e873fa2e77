import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { InterpretationSaveInput, PickSetView } from "@/contracts/field";
import { put } from "@/lib/api-client";
import { fieldKeys } from "./field-keys";

/**
 * PUT /api/plans/:id/picks/interpretation — keeps (or, with null, clears) the interpretation
 * choices of the "Under the line" card with the plan's saved picks.
 */
export const saveInterpretation = (planId: string, input: InterpretationSaveInput) =>
  put<PickSetView>(`/api/plans/${encodeURIComponent(planId)}/picks/interpretation`, input);

export function useSaveInterpretation(planId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InterpretationSaveInput) => saveInterpretation(planId, input),
    onSuccess: (view) => queryClient.setQueryData(fieldKeys.picks(planId), view),
  });
}

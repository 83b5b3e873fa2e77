import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { PlanDetail } from "@/contracts/plans";
import type { GroundModel } from "@engine";
import { put } from "@/lib/api-client";
import { fieldKeys } from "./field-keys";

/**
 * PUT /api/plans/:id with the plan's document plus one more candidate ground model (a model a
 * borehole log built). 409 `revision_conflict` when the plan was saved meanwhile.
 */
export const addCandidateModel = (plan: PlanDetail, model: GroundModel) =>
  put<PlanDetail>(`/api/plans/${encodeURIComponent(plan.id)}`, {
    baseRevision: plan.revision,
    document: { ...plan.document, models: [...plan.document.models, model] },
    message: `added ground model “${model.name}” from a borehole log`,
  });

export function useAddCandidateModel(plan: PlanDetail | undefined) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (model: GroundModel) => {
      if (!plan) throw new Error("the plan is not loaded yet");
      return addCandidateModel(plan, model);
    },
    onSuccess: (saved) => {
      queryClient.setQueryData(fieldKeys.plan(saved.id), saved);
      return queryClient.invalidateQueries({ queryKey: ["plans"] });
    },
  });
}

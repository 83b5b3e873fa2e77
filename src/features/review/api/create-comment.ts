import { useMutation, useQueryClient } from "@tanstack/react-query";
import { post } from "@/lib/api-client";
import type { CommentCreateInput, CommentView } from "@/contracts/plans";
import { foreignKeys, planUrl, reviewKeys } from "./review-keys";

/** POST /api/plans/:id/comments — a new thread, or a reply when `parentId` is set. */
export const createComment = (planId: string, input: CommentCreateInput) =>
  post<CommentView>(planUrl(planId, "/comments"), input);

export function useCreateComment(planId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CommentCreateInput) => createComment(planId, input),
    onSuccess: (comment) => {
      queryClient.setQueryData<CommentView[]>(reviewKeys.comments(planId), (list) =>
        list && !list.some((c) => c.id === comment.id) ? [...list, comment] : list,
      );
      void queryClient.invalidateQueries({ queryKey: reviewKeys.activity(planId) });
      void queryClient.invalidateQueries({ queryKey: foreignKeys.notifications });
      return queryClient.invalidateQueries({ queryKey: reviewKeys.comments(planId) });
    },
  });
}

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { patch } from "@/lib/api-client";
import type { CommentView } from "@/contracts/plans";
import { reviewKeys } from "./review-keys";

/** PATCH /api/comments/:id — resolve or reopen a thread (sent to its first comment). */
export const updateComment = (commentId: string, resolved: boolean) =>
  patch<CommentView>(`/api/comments/${encodeURIComponent(commentId)}`, { resolved });

export function useUpdateComment(planId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ commentId, resolved }: { commentId: string; resolved: boolean }) =>
      updateComment(commentId, resolved),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: reviewKeys.activity(planId) });
      return queryClient.invalidateQueries({ queryKey: reviewKeys.comments(planId) });
    },
  });
}

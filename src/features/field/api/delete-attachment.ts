import { useMutation, useQueryClient } from "@tanstack/react-query";
import { del } from "@/lib/api-client";
import { fieldKeys } from "./field-keys";

/** DELETE /api/attachments/:id — saved picks made on it stay (their link is cleared). */
export const deleteAttachment = (attachmentId: string) =>
  del<void>(`/api/attachments/${encodeURIComponent(attachmentId)}`);

export function useDeleteAttachment(planId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteAttachment,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: fieldKeys.attachments(planId) }),
        queryClient.invalidateQueries({ queryKey: fieldKeys.picks(planId) }),
      ]),
  });
}

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { post } from "@/lib/api-client";
import type { NotificationView } from "@/contracts/plans";
import { inboxKeys } from "./inbox-keys";

/** POST /api/notifications/:id/read */
export const markRead = (id: string) =>
  post<void>(`/api/notifications/${encodeURIComponent(id)}/read`, {});

export function useMarkRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: markRead,
    onMutate: async (id: string) => {
      // Show it read at once; the refetch below confirms.
      await queryClient.cancelQueries({ queryKey: inboxKeys.all });
      queryClient.setQueryData<NotificationView[]>(inboxKeys.list, (list) =>
        list?.map((n) => (n.id === id ? { ...n, read: true } : n)),
      );
      queryClient.setQueryData<NotificationView[]>(inboxKeys.unread, (list) =>
        list?.filter((n) => n.id !== id),
      );
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: inboxKeys.all }),
  });
}

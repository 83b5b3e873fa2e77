import { useMutation, useQueryClient } from "@tanstack/react-query";
import { post } from "@/lib/api-client";
import type { NotificationView } from "@/contracts/plans";
import { inboxKeys } from "./inbox-keys";

/** POST /api/notifications/read-all */
export const markAllRead = () => post<void>("/api/notifications/read-all", {});

export function useMarkAllRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: markAllRead,
    onSuccess: () => {
      queryClient.setQueryData<NotificationView[]>(inboxKeys.list, (list) =>
        list?.map((n) => ({ ...n, read: true })),
      );
      queryClient.setQueryData<NotificationView[]>(inboxKeys.unread, () => []);
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: inboxKeys.all }),
  });
}

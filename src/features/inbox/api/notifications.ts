import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { NotificationView } from "@/contracts/plans";
import { INBOX_POLL_MS, inboxKeys } from "./inbox-keys";

/** GET /api/notifications — the signed-in user's notices, newest first. */
export const notificationsQueryOptions = queryOptions({
  queryKey: inboxKeys.list,
  queryFn: () => get<NotificationView[]>("/api/notifications?limit=200"),
  refetchInterval: INBOX_POLL_MS,
});

export function useNotifications() {
  return useQuery(notificationsQueryOptions);
}

/** GET /api/notifications?unread=true — only the unread ones, for the header's count. */
export const unreadQueryOptions = queryOptions({
  queryKey: inboxKeys.unread,
  queryFn: () => get<NotificationView[]>("/api/notifications?unread=true&limit=500"),
  refetchInterval: INBOX_POLL_MS,
  select: (list) => list.filter((n) => !n.read).length,
});

/** How many notices are unread (undefined while unknown). */
export function useUnreadCount() {
  return useQuery(unreadQueryOptions);
}

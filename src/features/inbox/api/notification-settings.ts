import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { get, put } from "@/lib/api-client";
import type { NotificationSettings } from "@/contracts/plans";
import { inboxKeys } from "./inbox-keys";

/** GET /api/me/notification-settings — which e-mails the user wants. */
export const notificationSettingsQueryOptions = queryOptions({
  queryKey: inboxKeys.settings,
  queryFn: () => get<NotificationSettings>("/api/me/notification-settings"),
});

export function useNotificationSettings() {
  return useQuery(notificationSettingsQueryOptions);
}

/** PUT /api/me/notification-settings — the whole set each time. */
export function useSaveNotificationSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (settings: NotificationSettings) =>
      put<NotificationSettings>("/api/me/notification-settings", settings),
    onSuccess: (saved) => queryClient.setQueryData(inboxKeys.settings, saved),
  });
}

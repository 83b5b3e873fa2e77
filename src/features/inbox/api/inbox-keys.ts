/** Query keys of the inbox; everything under ["notifications"] is refreshed together. */
export const inboxKeys = {
  all: ["notifications"] as const,
  list: ["notifications", "list"] as const,
  unread: ["notifications", "unread"] as const,
  settings: ["notification-settings"] as const,
};

/** How often the header's unread count asks again, ms. */
export const INBOX_POLL_MS = 30_000;

/** The inbox feature's public surface: the page, the header link with its unread count, settings. */
export { InboxPage } from "./components/inbox-page";
export { InboxLink } from "./components/inbox-link";
export { NotificationSettingsCard } from "./components/notification-settings-card";

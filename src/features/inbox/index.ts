/**
 * The inbox feature's public surface in the first load: the header link with its unread count
 * and the settings card. The page itself (components/inbox-page) is loaded by the router when
 * opened.
 */
export { InboxLink } from "./components/inbox-link";
export { NotificationSettingsCard } from "./components/notification-settings-card";

import { NavLink } from "react-router-dom";
import { paths } from "@/app/paths";
import { useUnreadCount } from "../api/notifications";

/** "Inbox" in the header with the number of notices not yet seen (refreshed every 30 s). */
export function InboxLink() {
  const unread = useUnreadCount();
  const count = unread.data ?? 0;
  return (
    <NavLink
      to={paths.inbox}
      aria-label={count > 0 ? `Inbox, ${count} new` : "Inbox"}
      className={({ isActive }) =>
        `relative inline-flex items-center gap-1.5 rounded-md px-2.5 py-1 text-sm font-medium ${isActive ? "bg-ink text-card" : "text-ink hover:bg-paper-deep"}`
      }
    >
      <svg viewBox="0 0 20 20" className="h-4 w-4" aria-hidden>
        <path
          d="M3 11 L5 4 H15 L17 11 V16 H3 Z M3 11 H7 L8 13 H12 L13 11 H17"
          fill="none"
          stroke="currentColor"
          strokeWidth="1.6"
          strokeLinejoin="round"
        />
      </svg>
      Inbox
      {count > 0 ? (
        <span
          aria-hidden
          data-testid="unread-badge"
          className="min-w-5 rounded-full bg-brick px-1.5 text-center text-xs leading-5 font-semibold text-card"
        >
          {count > 99 ? "99+" : count}
        </span>
      ) : null}
    </NavLink>
  );
}

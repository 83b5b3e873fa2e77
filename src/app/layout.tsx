import { useEffect, useRef, useState } from "react";
import { NavLink, Outlet, useLocation, useNavigate } from "react-router-dom";
import { useMe } from "@/features/auth/api/me";
import { useSignOut } from "@/features/auth/api/sign-in";
import { ROLE_LABELS } from "@/contracts/common";
import { navItems } from "./nav";
import { paths } from "./paths";
import { ErrorBoundary } from "@/components/error-boundary";
import { InboxLink } from "@/features/inbox";

export function Wordmark() {
  return (
    <span className="flex items-center gap-2 text-lg font-semibold tracking-tight text-ink">
      <svg viewBox="0 0 32 32" className="h-6 w-6" aria-hidden>
        <path
          d="M4 24 L12 8 L28 8"
          fill="none"
          stroke="currentColor"
          strokeWidth="3"
          strokeLinecap="round"
          strokeLinejoin="round"
        />
        <circle cx="12" cy="24" r="2.5" fill="var(--color-ochre)" />
        <circle cx="20" cy="24" r="2.5" fill="var(--color-ochre)" />
        <circle cx="28" cy="24" r="2.5" fill="var(--color-brick)" />
      </svg>
      Spreadsight
    </span>
  );
}

/** Initials for the phone's account button: "Morwenna Hale" → "MH". */
function initials(name: string): string {
  const words = name.trim().split(/\s+/).filter(Boolean);
  const letters = words.length > 1 ? [words[0], words[words.length - 1]] : words;
  return letters.map((w) => w[0]?.toUpperCase() ?? "").join("") || "?";
}

/**
 * The signed-in frame: a slim header band with the wordmark, navigation and the user's badge.
 * On a phone (below 640 px) it is two lines: the wordmark, the inbox and an account button
 * (opening the name, role, team and Sign out) on the first, the navigation on the second.
 */
export function AppLayout() {
  const { data: me } = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const location = useLocation();
  const [menuOpen, setMenuOpen] = useState(false);
  const account = useRef<HTMLDivElement>(null);
  // The account menu closes on a new page, a click elsewhere or Escape.
  useEffect(() => setMenuOpen(false), [location.pathname]);
  useEffect(() => {
    if (!menuOpen) return;
    const onPointer = (e: PointerEvent) => {
      if (!account.current?.contains(e.target as Node)) setMenuOpen(false);
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key === "Escape") setMenuOpen(false);
    };
    document.addEventListener("pointerdown", onPointer);
    document.addEventListener("keydown", onKey);
    return () => {
      document.removeEventListener("pointerdown", onPointer);
      document.removeEventListener("keydown", onKey);
    };
  }, [menuOpen]);
  if (!me) return null;
  return (
    <div className="min-h-screen">
      <header className="app-header border-b border-rule bg-card/80 print:hidden">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-8 gap-y-1 px-4 py-2 sm:gap-y-2 sm:px-6 sm:py-3">
          <NavLink
            to={paths.home}
            aria-label="Spreadsight home"
            className="inline-flex min-h-9 items-center"
          >
            <Wordmark />
          </NavLink>
          <nav
            aria-label="Main"
            className="order-last flex w-full flex-wrap gap-0.5 max-sm:-mx-2 sm:order-none sm:w-auto sm:flex-1 sm:gap-1"
          >
            {navItems
              .filter((item) => item.visible(me))
              .map((item) => (
                <NavLink
                  key={item.to}
                  to={item.to}
                  className={({ isActive }) =>
                    `inline-flex min-h-9 items-center rounded-md px-2 text-sm font-medium sm:min-h-0 sm:px-3 sm:py-1.5 ${isActive ? "bg-ink text-card" : "text-ink hover:bg-paper-deep"}`
                  }
                >
                  {item.label}
                </NavLink>
              ))}
          </nav>
          <div
            ref={account}
            className="relative ml-auto flex items-center gap-2 text-sm sm:ml-0 sm:gap-3 max-sm:[&>a]:min-h-9"
          >
            <InboxLink />
            <button
              type="button"
              className="inline-flex h-9 min-w-9 items-center justify-center rounded-full border border-rule px-1 text-xs font-semibold text-ink-deep hover:bg-paper-deep sm:hidden"
              aria-label={`Account: ${me.user.name}`}
              aria-expanded={menuOpen}
              aria-controls="account-menu"
              onClick={() => setMenuOpen((open) => !open)}
            >
              {initials(me.user.name)}
            </button>
            <div
              id="account-menu"
              className={`${menuOpen ? "flex" : "hidden"} absolute top-full right-0 z-30 mt-2 w-64 max-w-[calc(100vw-2rem)] flex-col items-stretch gap-3 rounded-md border border-rule bg-card p-3 shadow-md sm:static sm:mt-0 sm:flex sm:w-auto sm:max-w-none sm:flex-row sm:items-center sm:border-0 sm:bg-transparent sm:p-0 sm:shadow-none`}
            >
              <span className="leading-tight sm:text-right">
                <span className="block font-medium text-ink-deep">{me.user.name}</span>
                <span className="block text-xs text-ink-soft">
                  {ROLE_LABELS[me.role]} · {me.team.name}
                </span>
              </span>
              <button
                type="button"
                className="min-h-9 rounded-md border border-rule px-2.5 py-1 text-xs font-medium whitespace-nowrap text-ink hover:bg-paper-deep sm:min-h-0"
                onClick={() =>
                  signOut.mutate(undefined, { onSuccess: () => navigate(paths.signIn) })
                }
              >
                Sign out
              </button>
            </div>
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-7xl px-4 py-6 sm:px-6 sm:py-8">
        <ErrorBoundary title="This page failed to draw">
          <Outlet />
        </ErrorBoundary>
      </main>
    </div>
  );
}

import { NavLink, Outlet, useNavigate } from "react-router-dom";
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

/** The signed-in frame: a slim header band with the wordmark, navigation and the user's badge. */
export function AppLayout() {
  const { data: me } = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  if (!me) return null;
  return (
    <div className="min-h-screen">
      <header className="app-header border-b border-rule bg-card/80 print:hidden">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-8 gap-y-2 px-4 py-3 sm:px-6">
          <NavLink to={paths.home} aria-label="Spreadsight home">
            <Wordmark />
          </NavLink>
          <nav aria-label="Main" className="flex flex-1 flex-wrap gap-1">
            {navItems
              .filter((item) => item.visible(me))
              .map((item) => (
                <NavLink
                  key={item.to}
                  to={item.to}
                  className={({ isActive }) =>
                    `rounded-md px-3 py-1.5 text-sm font-medium ${isActive ? "bg-ink text-card" : "text-ink hover:bg-paper-deep"}`
                  }
                >
                  {item.label}
                </NavLink>
              ))}
          </nav>
          <div className="flex items-center gap-3 text-sm">
            <InboxLink />
            <span className="text-right leading-tight">
              <span className="block font-medium text-ink-deep">{me.user.name}</span>
              <span className="block text-xs text-ink-soft">
                {ROLE_LABELS[me.role]} · {me.team.name}
              </span>
            </span>
            <button
              type="button"
              className="rounded-md border border-rule px-2.5 py-1 text-xs font-medium whitespace-nowrap text-ink hover:bg-paper-deep"
              onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate(paths.signIn) })}
            >
              Sign out
            </button>
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

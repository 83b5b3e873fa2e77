import type { ReactNode } from "react";
import { Navigate, useLocation } from "react-router-dom";
import { useMe } from "@/features/auth/api/me";
import type { MeResponse } from "@/contracts/auth";
import { ErrorNotice, Loading } from "@/components/feedback";
import { paths } from "./paths";

/** Renders children only for a signed-in user; otherwise sends them to sign in and back. */
export function RequireAuth({ children }: { children: ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <Loading label="Checking your session…" />;
  if (me.isError)
    return (
      <div className="p-8">
        <ErrorNotice error={me.error} onRetry={() => me.refetch()} />
      </div>
    );
  if (!me.data) {
    const next = location.pathname + location.search;
    return <Navigate to={`${paths.signIn}?next=${encodeURIComponent(next)}`} replace />;
  }
  return <>{children}</>;
}

/** Renders children only when the user's role passes; otherwise a plain explanation. */
export function RequireRole({
  allow,
  children,
}: {
  allow: (me: MeResponse) => boolean;
  children: ReactNode;
}) {
  const { data: me } = useMe();
  if (!me) return null;
  if (!allow(me)) {
    return (
      <div
        role="alert"
        className="rounded-md border border-rule bg-card px-4 py-6 text-sm text-ink-soft"
      >
        Your role does not give access to this page.
      </div>
    );
  }
  return <>{children}</>;
}

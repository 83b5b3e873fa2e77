import { useEffect, useState, type ReactNode } from "react";
import { Navigate, useLocation } from "react-router-dom";
import { useQueryClient } from "@tanstack/react-query";
import { meQueryOptions, useMe } from "@/features/auth/api/me";
import { ApiError } from "@/lib/api-client";
import type { MeResponse } from "@/contracts/auth";
import { ErrorNotice, Loading } from "@/components/feedback";
import { paths } from "./paths";

/** The server's answer when the session is gone (ended elsewhere, expired, password reset). */
const sessionEnded = (error: unknown) =>
  error instanceof ApiError && error.status === 401 && error.code === "unauthenticated";

/**
 * Watches every query and mutation: when one is refused because the session has ended, the
 * user is treated as signed out, so the guard sends them to sign in (and back afterwards)
 * instead of leaving "sign in first" errors on a page that still shows their name.
 */
function useSignOutWhenSessionEnds(): boolean {
  const queryClient = useQueryClient();
  const [endedHere, setEndedHere] = useState(false);
  useEffect(() => {
    const ended = () => {
      if (!queryClient.getQueryData(meQueryOptions.queryKey)) return;
      setEndedHere(true);
      queryClient.setQueryData(meQueryOptions.queryKey, null);
    };
    const offQueries = queryClient.getQueryCache().subscribe((event) => {
      if (
        event.type === "updated" &&
        event.action.type === "error" &&
        sessionEnded(event.action.error)
      )
        ended();
    });
    const offMutations = queryClient.getMutationCache().subscribe((event) => {
      if (
        event.type === "updated" &&
        event.action.type === "error" &&
        sessionEnded(event.action.error)
      )
        ended();
    });
    return () => {
      offQueries();
      offMutations();
    };
  }, [queryClient]);
  return endedHere;
}

/** Renders children only for a signed-in user; otherwise sends them to sign in and back. */
export function RequireAuth({ children }: { children: ReactNode }) {
  const me = useMe();
  const location = useLocation();
  const sessionWasEnded = useSignOutWhenSessionEnds();
  if (me.isPending) return <Loading label="Checking your session…" />;
  if (me.isError)
    return (
      <div className="p-8">
        <ErrorNotice error={me.error} onRetry={() => me.refetch()} />
      </div>
    );
  if (!me.data) {
    const next = location.pathname + location.search;
    // A user who was signed in a moment ago is told why they are asked to sign in again.
    return (
      <Navigate
        to={`${paths.signIn}?next=${encodeURIComponent(next)}${sessionWasEnded ? "&ended=1" : ""}`}
        replace
      />
    );
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

import type { ReactNode } from "react";
import { errorMessage } from "@/lib/api-client";

export function Loading({ label = "Loading…" }: { label?: string }) {
  return (
    <div
      role="status"
      aria-live="polite"
      className="flex items-center gap-2 py-6 text-sm text-ink-soft"
    >
      <span className="inline-block h-3 w-3 animate-pulse rounded-full bg-ochre" aria-hidden />
      {label}
    </div>
  );
}

export function ErrorNotice({
  error,
  title = "Something went wrong",
  onRetry,
}: {
  error: unknown;
  title?: string;
  onRetry?: () => void;
}) {
  return (
    <div
      role="alert"
      className="rounded-md border border-brick/40 bg-brick-soft px-4 py-3 text-sm text-brick"
    >
      <p className="font-semibold">{title}</p>
      <p className="mt-0.5">{errorMessage(error)}</p>
      {onRetry ? (
        <button type="button" onClick={onRetry} className="mt-2 text-sm font-medium underline">
          Try again
        </button>
      ) : null}
    </div>
  );
}

export function Notice({
  tone = "info",
  children,
}: {
  tone?: "info" | "caution" | "success";
  children: ReactNode;
}) {
  const toneClass =
    tone === "caution"
      ? "border-ochre/50 bg-ochre-soft text-ink-deep"
      : tone === "success"
        ? "border-moss/40 bg-moss-soft text-ink-deep"
        : "border-rule bg-card text-ink-deep";
  return (
    <div role="status" className={`rounded-md border px-4 py-3 text-sm ${toneClass}`}>
      {children}
    </div>
  );
}

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-rule px-6 py-10 text-center">
      <p className="font-medium text-ink">{title}</p>
      {children ? <div className="mt-1 text-sm text-ink-soft">{children}</div> : null}
    </div>
  );
}

export function PageHeader({
  title,
  subtitle,
  actions,
}: {
  title: string;
  subtitle?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-rule pb-4">
      <div>
        <h1 className="text-2xl font-semibold tracking-tight text-ink-deep">{title}</h1>
        {subtitle ? <p className="mt-1 text-sm text-ink-soft">{subtitle}</p> : null}
      </div>
      {actions ? <div className="flex gap-2">{actions}</div> : null}
    </div>
  );
}

export function Card({ children, className = "" }: { children: ReactNode; className?: string }) {
  return (
    <section
      className={`rounded-lg border border-rule bg-card p-5 shadow-[0_1px_0_rgba(18,72,74,0.06)] ${className}`}
    >
      {children}
    </section>
  );
}

import type { ReactNode } from "react";
import { Wordmark } from "@/app/layout";

/** The frame around the signed-out pages: wordmark, a short line on what the tool is for, the form. */
export function AuthFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="flex min-h-screen items-start justify-center px-4 pt-20">
      <div className="w-full max-w-md">
        <div className="mb-6 flex flex-col items-start gap-2">
          <Wordmark />
          <p className="text-sm text-ink-soft">
            Plan refraction spreads that see every layer: blind-layer checks before the crew
            mobilises.
          </p>
        </div>
        <div className="rounded-lg border border-rule bg-card p-6 shadow-sm">
          <h1 className="mb-4 text-xl font-semibold text-ink-deep">{title}</h1>
          {children}
        </div>
      </div>
    </div>
  );
}

import { useId, useRef, useState } from "react";
import type { PlanDetail } from "@/contracts/plans";
import { ApiError, errorMessage } from "@/lib/api-client";
import { describePlanProblem } from "@/contracts/plan-problems";
import { useImportPlan } from "../api/import-plan";

/** Largest plan file read in the browser, bytes (the API takes JSON bodies up to 1 MB). */
const MAX_BYTES = 1024 * 1024;

/** The problems of a refused import, one per field, counted from 1 ("Model 1, layer 2: …"). */
export function importProblems(error: unknown): string[] {
  if (error instanceof ApiError && error.fields) {
    return Object.entries(error.fields).flatMap(([field, messages]) =>
      messages.map((m) => describePlanProblem(field, m)),
    );
  }
  return [errorMessage(error)];
}

/**
 * Why a chosen file is not a plan, in plain words (never the parser's "Unexpected token"): a
 * CSV table (e.g. a station or borehole file) is named as such.
 */
export function notPlanJson(fileName: string, text: string): string {
  const firstLine = text.trimStart().split(/\r?\n/, 1)[0] ?? "";
  const csv =
    /\.(csv|txt)$/i.test(fileName) || (!/^[[{]/.test(firstLine) && firstLine.includes(","));
  return csv
    ? `${fileName} is not a plan JSON file: it looks like a CSV table. Choose a plan document (.json), such as one exported from a plan's designer.`
    : `${fileName} is not a plan JSON file: its text is not JSON. Choose a plan document (.json), such as one exported from a plan's designer.`;
}

/**
 * "Import plan (JSON)": reads a plan document (docs/plan-format.md) chosen by the user and
 * creates a plan from it in the site (a trainee's lands in their sandbox). Every problem the
 * server names is listed; nothing is created then.
 */
export function ImportPlanButton({
  siteId,
  onImported,
  label = "Import plan (JSON)",
}: {
  siteId: string;
  onImported?: (plan: PlanDetail) => void;
  label?: string;
}) {
  const id = useId();
  const input = useRef<HTMLInputElement | null>(null);
  const importPlan = useImportPlan(siteId);
  const [localError, setLocalError] = useState<string | null>(null);

  const read = async (file: File) => {
    setLocalError(null);
    importPlan.reset();
    if (file.size > MAX_BYTES) {
      setLocalError(`${file.name} is larger than 1 MB; a plan document is much smaller.`);
      return;
    }
    let document: unknown;
    const text = await file.text();
    try {
      document = JSON.parse(text);
    } catch {
      setLocalError(notPlanJson(file.name, text));
      return;
    }
    importPlan.mutate(document, { onSuccess: (plan) => onImported?.(plan) });
  };

  const problems = localError
    ? [localError]
    : importPlan.isError
      ? importProblems(importPlan.error)
      : [];
  return (
    // The button keeps its own width beside "New plan"; the problems wrap below it (at most
    // 28 rem wide) instead of stretching the button across the page.
    <div className="inline-flex max-w-md flex-col items-end gap-2">
      <label
        htmlFor={id}
        className="inline-flex cursor-pointer items-center justify-center gap-1.5 rounded-md border border-ink-soft bg-card px-3.5 py-1.5 text-sm font-medium text-ink hover:bg-paper-deep"
      >
        {importPlan.isPending ? "Importing…" : label}
      </label>
      <input
        id={id}
        ref={input}
        type="file"
        accept=".json,application/json"
        className="sr-only"
        onChange={(e) => {
          const file = e.target.files?.[0];
          if (file) void read(file);
          e.target.value = "";
        }}
      />
      {problems.length > 0 ? (
        <div
          role="alert"
          className="rounded-md border border-brick/40 bg-brick-soft px-3 py-2 text-sm text-brick"
        >
          <p className="font-semibold">The plan was not imported</p>
          <ul className="mt-1 list-disc pl-5 text-xs">
            {problems.map((p) => (
              <li key={p}>{p}</li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}

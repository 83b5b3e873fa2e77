import { useMemo } from "react";
import type { Plan, PlanAnalysis } from "../lib/engine";
import { modeller } from "../lib/modeller-client";
import { useLatestResult, type LatestResult } from "./use-latest-result";

export type PlanAnalysisState = LatestResult<Plan, PlanAnalysis>;

/**
 * The engine's analysis of the plan as typed, run by the modeller (off the main thread) on
 * every change. Null (an invalid form) runs nothing; an answer for an older edit is dropped.
 */
export function usePlanAnalysis(
  plan: Plan | null,
  options: { spread?: number } = {},
): PlanAnalysisState {
  // A roll-along plan's spread to detail (1-based) is part of the request.
  const { spread } = options;
  const key = useMemo(
    () => (plan ? `${spread ?? ""}:${JSON.stringify(plan)}` : null),
    [plan, spread],
  );
  return useLatestResult(plan, key, (p) => modeller().analyze(p, spread ? { spread } : undefined));
}

import { useCallback, useEffect, useRef, useState } from "react";
import type { UseFormReturn } from "react-hook-form";
import type { UnitSystem } from "@/lib/units";
import type { Plan } from "../lib/engine";
import { parsePlanForm, type ExactValues, type PlanForm } from "../lib/plan-form";

/** Structural equality of two parsed plans (small JSON documents, compared once per edit). */
function samePlan(a: Plan | null, b: Plan | null): boolean {
  if (a === b) return true;
  if (a === null || b === null) return false;
  return JSON.stringify(a) === JSON.stringify(b);
}

/**
 * The plan as typed, parsed by the engine's schema (SI), or null while the form is invalid.
 *
 * It subscribes to the form's values (react-hook-form `watch` with a callback) instead of
 * re-rendering the caller on every keystroke: the form is parsed once per change, and the
 * caller re-renders only when the parsed plan differs from the last one (so typing "2.40"
 * after "2.4" runs nothing). There is no debounce: each change is offered to the modeller at
 * once and stale answers are dropped further down (usePlanAnalysis).
 */
export function useLivePlan(
  form: UseFormReturn<PlanForm, unknown, Plan>,
  units: UnitSystem,
  name: string,
  exact: ExactValues,
  /** Called after every change that leaves the form invalid (e.g. to mark all its fields). */
  onInvalid?: () => void,
): Plan | null {
  const parse = useCallback(
    (values: PlanForm) => parsePlanForm(values, units, name, exact),
    [units, name, exact],
  );
  const [plan, setPlan] = useState<Plan | null>(() => parse(form.getValues()));
  const latest = useRef(plan);
  const onInvalidRef = useRef(onInvalid);
  useEffect(() => {
    onInvalidRef.current = onInvalid;
  });

  useEffect(() => {
    const offer = (values: PlanForm) => {
      const next = parse(values);
      if (next === null) onInvalidRef.current?.();
      if (samePlan(next, latest.current)) return;
      latest.current = next;
      setPlan(next);
    };
    offer(form.getValues()); // the name or the exact values changed, e.g. after a save
    const subscription = form.watch((values) => offer(values as PlanForm));
    return () => subscription.unsubscribe();
  }, [form, parse]);

  return plan;
}

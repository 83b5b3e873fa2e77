import { useMemo } from "react";
import { useLatestResult, type LatestResult } from "./use-latest-result";

/**
 * Run one modeller computation for `input` (any JSON-able value), keeping only the newest
 * answer. `input === null` runs nothing.
 */
export function useModellerQuery<I, R>(
  input: I | null,
  run: (input: I) => Promise<R>,
): LatestResult<I, R> {
  const key = useMemo(() => (input === null ? null : JSON.stringify(input)), [input]);
  return useLatestResult(input, key, run);
}

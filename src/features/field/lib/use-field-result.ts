import { keepPreviousData, useQuery } from "@tanstack/react-query";

/**
 * Runs one field-worker computation for `input` (plain data) and keeps only the newest answer:
 * the query key is the input itself, so an answer for an older input never shows as the current
 * one; while a new input is computed the last answer stays on screen (`current` false).
 * `input === null` runs nothing.
 */
export function useFieldResult<I, R>(
  name: string,
  input: I | null,
  run: (input: I) => Promise<R>,
): { data: R | undefined; current: boolean } {
  const query = useQuery({
    queryKey: ["field-worker", name, input],
    queryFn: () => run(input as I),
    enabled: input !== null,
    staleTime: Infinity,
    gcTime: 30_000,
    retry: false,
    placeholderData: keepPreviousData,
  });
  return {
    data: input === null ? undefined : query.data,
    current: input !== null && query.isSuccess && !query.isPlaceholderData,
  };
}

import { useEffect, useRef, useState } from "react";
import { isSuperseded } from "../lib/modeller-client";

export interface LatestResult<I, R> {
  /** The newest result that has arrived, for `resultInput`; null before the first one. */
  result: R | null;
  /** The input the shown result was computed for. */
  resultInput: I | null;
  /** True when `result` belongs to the current input (not an older edit). */
  current: boolean;
  /** True while the current input is being computed. */
  pending: boolean;
  /** The current input's failure, if it failed. */
  error: unknown;
}

/**
 * Runs `run(input)` whenever `key` changes and keeps only the answer for the newest input: an
 * answer that arrives after a newer request was made is dropped, never shown as current.
 * `input === null` (an invalid form) shows nothing as current and runs nothing.
 */
export function useLatestResult<I, R>(
  input: I | null,
  key: string | null,
  run: (input: I) => Promise<R>,
): LatestResult<I, R> {
  const [state, setState] = useState<{
    result: R | null;
    resultInput: I | null;
    resultKey: string | null;
    errorKey: string | null;
    error: unknown;
  }>({ result: null, resultInput: null, resultKey: null, errorKey: null, error: null });
  const sequence = useRef(0);
  const runRef = useRef(run);
  useEffect(() => {
    runRef.current = run;
  });

  useEffect(() => {
    const ticket = ++sequence.current;
    if (input === null || key === null) return;
    const attempt = (retries: number) => {
      runRef
        .current(input)
        .then((result) => {
          if (ticket !== sequence.current) return; // a newer edit was requested meanwhile
          setState({ result, resultInput: input, resultKey: key, errorKey: null, error: null });
        })
        .catch((error: unknown) => {
          if (ticket !== sequence.current) return;
          // Still the newest input, but the modeller let another request of its kind go
          // first: ask again rather than wait forever.
          if (isSuperseded(error)) {
            if (retries > 0) attempt(retries - 1);
            return;
          }
          setState((s) => ({ ...s, errorKey: key, error }));
        });
    };
    attempt(2);
    // The key stands for the input's content.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);

  const current = key !== null && state.resultKey === key;
  const failed = key !== null && state.errorKey === key;
  return {
    result: state.result,
    resultInput: state.resultInput,
    current,
    pending: key !== null && !current && !failed,
    error: failed ? state.error : null,
  };
}

import { useCallback, useSyncExternalStore } from "react";
import { DEFAULT_SEISMOGRAPH_CHANNELS } from "../lib/apply-choices";

const KEY = "spreadsight.seismographChannels";
const listeners = new Set<() => void>();

function read(): number {
  try {
    const n = Number(globalThis.localStorage?.getItem(KEY));
    return Number.isInteger(n) && n >= 2 && n <= 10000 ? n : DEFAULT_SEISMOGRAPH_CHANNELS;
  } catch {
    return DEFAULT_SEISMOGRAPH_CHANNELS;
  }
}

/**
 * The team's seismograph channel count (default 48, common practice), kept in this browser so
 * every plan's Apply choices flag spreads that need more channels than the recorder has.
 */
export function useSeismographChannels(): [number, (n: number) => void] {
  const value = useSyncExternalStore(
    (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    read,
    () => DEFAULT_SEISMOGRAPH_CHANNELS,
  );
  const set = useCallback((n: number) => {
    if (!(Number.isInteger(n) && n >= 2 && n <= 10000)) return;
    try {
      globalThis.localStorage?.setItem(KEY, String(n));
    } catch {
      // storage refused (private mode): keep the default
    }
    listeners.forEach((l) => l());
  }, []);
  return [value, set];
}

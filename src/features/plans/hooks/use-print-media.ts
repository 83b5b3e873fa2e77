import { useEffect, useState } from "react";
import { flushSync } from "react-dom";

/**
 * True while the page is being printed (or print media is emulated): screens that show one
 * tab at a time on screen show every part in print. The state changes synchronously on
 * `beforeprint` and on the print media query, so the printed page already holds the parts.
 */
export function usePrintMedia(): boolean {
  const [printing, setPrinting] = useState(() => printQuery()?.matches ?? false);
  useEffect(() => {
    const query = printQuery();
    if (!query) return;
    const set = (value: boolean) => flushSync(() => setPrinting(value));
    const onChange = () => set(query.matches);
    const onBefore = () => set(true);
    const onAfter = () => set(query.matches);
    query.addEventListener("change", onChange);
    window.addEventListener("beforeprint", onBefore);
    window.addEventListener("afterprint", onAfter);
    return () => {
      query.removeEventListener("change", onChange);
      window.removeEventListener("beforeprint", onBefore);
      window.removeEventListener("afterprint", onAfter);
    };
  }, []);
  return printing;
}

function printQuery(): MediaQueryList | null {
  if (typeof window === "undefined" || typeof window.matchMedia !== "function") return null;
  return window.matchMedia("print");
}

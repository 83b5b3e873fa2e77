import { useEffect, useState } from "react";

/**
 * `flag`, but turned on only once it has stayed on for `delay` ms (off at once). The designer
 * uses it for "this is an earlier version": an answer that comes within a frame or two never
 * dims the results or shifts the layout for an instant.
 */
export function useLateFlag(flag: boolean, delay: number): boolean {
  const [late, setLate] = useState(false);
  useEffect(() => {
    if (!flag) return;
    const timer = setTimeout(() => setLate(true), delay);
    return () => {
      clearTimeout(timer);
      setLate(false);
    };
  }, [flag, delay]);
  return flag && late;
}

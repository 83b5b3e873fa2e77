import { useDeferredValue, useEffect, useState } from "react";
import {
  loadPasswordChecker,
  MIN_PASSWORD_SCORE,
  STRENGTH_LABELS,
  type PasswordChecker,
} from "@/contracts/password-strength";

/**
 * The hint under a new-password field: the length rule, then, once something is typed, how
 * hard the password is to guess (zxcvbn-ts, the same check the server applies) and why. The
 * checker's dictionaries load when the form opens, not with the app.
 */
export function PasswordStrengthHint({
  password,
  userInputs = [],
}: {
  password: string;
  userInputs?: string[];
}) {
  const [checker, setChecker] = useState<PasswordChecker | null>(null);
  const deferred = useDeferredValue(password);
  useEffect(() => {
    let live = true;
    loadPasswordChecker().then(
      (check) => {
        if (live) setChecker(() => check);
      },
      () => undefined,
    );
    return () => {
      live = false;
    };
  }, []);
  if (!deferred || !checker) return <>At least 10 characters, not easy to guess.</>;
  const words = userInputs
    .flatMap((input) => input.toLowerCase().split(/[^a-z0-9]+/))
    .filter(Boolean);
  const strength = checker(deferred.slice(0, 100), words);
  const ok = strength.score >= MIN_PASSWORD_SCORE;
  return (
    <span data-testid="password-strength" data-score={strength.score}>
      Strength:{" "}
      <strong className={ok ? "text-ink" : "text-brick"}>{STRENGTH_LABELS[strength.score]}</strong>
      {ok ? "." : ` (needs ${STRENGTH_LABELS[MIN_PASSWORD_SCORE]}).`}
      {strength.warning ? ` ${strength.warning}` : ""}
      {!ok && strength.suggestions[0] ? ` ${strength.suggestions[0]}` : ""}
    </span>
  );
}

/**
 * Password strength, shared by the server (which refuses weak new passwords) and the sign-up
 * and reset forms (which show a hint while typing). zxcvbn-ts estimates how many guesses a
 * password needs against common passwords, words, names, keyboard patterns, dates and
 * repeats; a new password must score at least 3 of 4 ("safely unguessable", the common bar).
 * The dictionaries are large, so they load on first use (`loadPasswordChecker`), never in the
 * client's first bundle.
 */

/** Lowest zxcvbn score (0–4) a new password may have. */
export const MIN_PASSWORD_SCORE = 3;

export interface PasswordStrength {
  /** zxcvbn score: 0 (guessable at once) to 4 (very hard to guess). */
  score: 0 | 1 | 2 | 3 | 4;
  /** True when the score reaches MIN_PASSWORD_SCORE. */
  acceptable: boolean;
  /** One sentence on why it is weak ("This is a commonly used password."), or null. */
  warning: string | null;
  /** Short hints to make it stronger. */
  suggestions: string[];
}

/** Short words for each score, for the hint under the field. */
export const STRENGTH_LABELS = ["very weak", "weak", "fair", "strong", "very strong"] as const;

export type PasswordChecker = (password: string, userInputs?: string[]) => PasswordStrength;

let checker: Promise<PasswordChecker> | null = null;

/** Loads zxcvbn-ts with its common and English dictionaries once, then checks synchronously. */
export function loadPasswordChecker(): Promise<PasswordChecker> {
  checker ??= (async () => {
    const [{ ZxcvbnFactory }, common, english] = await Promise.all([
      import("@zxcvbn-ts/core"),
      import("@zxcvbn-ts/language-common"),
      import("@zxcvbn-ts/language-en"),
    ]);
    const zxcvbn = new ZxcvbnFactory({
      dictionary: { ...common.dictionary, ...english.dictionary },
      graphs: common.adjacencyGraphs,
      translations: english.translations,
      useLevenshteinDistance: false,
    });
    return (password, userInputs = []) => {
      const result = zxcvbn.check(password, userInputs);
      return {
        score: result.score,
        acceptable: result.score >= MIN_PASSWORD_SCORE,
        warning: result.feedback.warning || null,
        suggestions: result.feedback.suggestions,
      };
    };
  })();
  checker.catch(() => {
    checker = null;
  });
  return checker;
}

/** The sentence shown for a password that is too weak. */
export function weakPasswordMessage(strength: PasswordStrength): string {
  const why = strength.warning ? ` ${strength.warning.replace(/\.?$/, ".")}` : "";
  return `password is too easy to guess (${STRENGTH_LABELS[strength.score]}).${why} Add another word or two, or make it longer.`;
}

/** The one error type the domain and HTTP layers throw; the error middleware turns it into JSON. */
import type { ZodError } from "zod";

export type FieldErrors = Record<string, string[]>;

/**
 * An error with an HTTP status and a stable machine-readable `code`.
 * Written to the client as `{"error":{"code","message","fields"?}}`.
 */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldErrors,
    /** Extra response headers, e.g. Retry-After on 429. */
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = "AppError";
  }
}

export const notFound = (what = "resource") => new AppError(404, "not_found", `${what} not found`);
export const forbidden = (message = "your role may not do this") =>
  new AppError(403, "forbidden", message);
export const unauthenticated = () => new AppError(401, "unauthenticated", "sign in first");

/**
 * Field errors from (key, message) pairs, gathered in a Map so that a key named like a built-in
 * property (`__proto__`, `constructor`, `toString`…) is an ordinary key, then copied into an
 * object without a prototype (JSON.stringify writes it like any other object).
 */
export function collectFields(pairs: Iterable<readonly [string, string]>): FieldErrors {
  const gathered = new Map<string, string[]>();
  for (const [key, message] of pairs) {
    const list = gathered.get(key);
    if (list) list.push(message);
    else gathered.set(key, [message]);
  }
  const fields = Object.create(null) as FieldErrors;
  for (const [key, messages] of gathered) {
    Object.defineProperty(fields, key, {
      value: messages,
      enumerable: true,
      writable: true,
      configurable: true,
    });
  }
  return fields;
}

/** Field errors keyed by the dotted path of each issue ("root" for the object itself). */
export function fieldsFromZod(error: ZodError): FieldErrors {
  const pairs: [string, string][] = [];
  for (const issue of error.issues) {
    const base = issue.path.map(String).join(".");
    if (issue.code === "unrecognized_keys") {
      for (const key of issue.keys) pairs.push([base ? `${base}.${key}` : key, "unknown field"]);
    } else {
      pairs.push([base || "root", issue.message]);
    }
  }
  return collectFields(pairs);
}

/** A 400 `invalid_input` error from a zod failure; `part` names what was parsed (body, query, path). */
export function invalidInput(error: ZodError, part: string): AppError {
  const fields = fieldsFromZod(error);
  const [first] = Object.entries(fields);
  const summary = first ? `${first[0] === "root" ? part : first[0]}: ${first[1][0]}` : "invalid";
  return new AppError(400, "invalid_input", `invalid ${part}: ${summary}`, fields);
}

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

/** Field errors keyed by the dotted path of each issue ("root" for the object itself). */
export function fieldsFromZod(error: ZodError): FieldErrors {
  const fields: FieldErrors = {};
  const add = (key: string, message: string) => {
    (fields[key] ??= []).push(message);
  };
  for (const issue of error.issues) {
    const base = issue.path.map(String).join(".");
    if (issue.code === "unrecognized_keys") {
      for (const key of issue.keys) add(base ? `${base}.${key}` : key, "unknown field");
    } else {
      add(base || "root", issue.message);
    }
  }
  return fields;
}

/** A 400 `invalid_input` error from a zod failure; `part` names what was parsed (body, query, path). */
export function invalidInput(error: ZodError, part: string): AppError {
  const fields = fieldsFromZod(error);
  const [first] = Object.entries(fields);
  const summary = first ? `${first[0] === "root" ? part : first[0]}: ${first[1][0]}` : "invalid";
  return new AppError(400, "invalid_input", `invalid ${part}: ${summary}`, fields);
}

/** Parsing of request bodies, query strings and route parameters with zod. */
import type { Request } from "express";
import { z, type ZodType } from "zod";
import { TOKEN_PATTERN } from "../domain/secrets";
import { invalidInput } from "../domain/errors";

/** Parses `req.body` (an absent body counts as `{}`) or throws 400 `invalid_input`. */
export function parseBody<S extends ZodType>(schema: S, req: Request): z.output<S> {
  const result = schema.safeParse(req.body ?? {});
  if (!result.success) throw invalidInput(result.error, "body");
  return result.data;
}

/** Parses `req.query` (strict schemas reject unknown parameters) or throws 400. */
export function parseQuery<S extends ZodType>(schema: S, req: Request): z.output<S> {
  const result = schema.safeParse({ ...req.query });
  if (!result.success) throw invalidInput(result.error, "query");
  return result.data;
}

/** Parses `req.params` or throws 400. */
export function parseParams<S extends ZodType>(schema: S, req: Request): z.output<S> {
  const result = schema.safeParse({ ...req.params });
  if (!result.success) throw invalidInput(result.error, "path");
  return result.data;
}

export const userIdParamSchema = z.strictObject({
  userId: z.uuid({ error: "userId must be a UUID" }),
});

export const tokenParamSchema = z.strictObject({
  token: z.string().regex(TOKEN_PATTERN, "token must be 32 lower-case base32 characters"),
});

/** For routes that take no query parameters at all. */
export const noQuerySchema = z.strictObject({});

/** Passwords (argon2id) and one-time link tokens (random, stored as SHA-256). */
import { hash, verify } from "@node-rs/argon2";
import { sha256 } from "@oslojs/crypto/sha2";
import { encodeBase32LowerCaseNoPadding, encodeHexLowerCase } from "@oslojs/encoding";
import { randomBytes } from "node:crypto";
import { loadPasswordChecker, weakPasswordMessage } from "@/contracts/password-strength";
import { AppError } from "./errors";

// OWASP's argon2id baseline (19 MiB, 2 passes, 1 lane); @node-rs/argon2 defaults to argon2id.
const ARGON2 = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, ARGON2);
}

/** False (never throws) when the hash is malformed or the password wrong. */
export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

/** A hash of a password nobody knows, verified when the account does not exist so that a
 * failed sign-in takes the same time either way. */
let decoyHash: Promise<string> | null = null;
export function decoyPasswordHash(): Promise<string> {
  decoyHash ??= hashPassword(encodeBase32LowerCaseNoPadding(randomBytes(20)));
  return decoyHash;
}

/** 160 random bits as 32 lower-case base32 characters: the secret in an e-mailed link. */
export function generateToken(): string {
  return encodeBase32LowerCaseNoPadding(randomBytes(20));
}

/** What the database stores instead of the token: lower-case hex SHA-256. */
export function hashToken(token: string): string {
  return encodeHexLowerCase(sha256(new TextEncoder().encode(token)));
}

/** Matches the shape generateToken produces (used to validate route parameters). */
export const TOKEN_PATTERN = /^[a-z2-7]{32}$/;

/**
 * 400 `invalid_input` on `password` when zxcvbn-ts scores the new password below
 * MIN_PASSWORD_SCORE (src/contracts/password-strength.ts). `userInputs` (the e-mail address,
 * the name, the team) count as guessable words. Only the first 100 characters are scored (a
 * longer password is not easier to guess, and the check's cost grows with length).
 */
export async function assertStrongPassword(password: string, userInputs: string[]): Promise<void> {
  const check = await loadPasswordChecker();
  const words = userInputs
    .flatMap((input) => input.toLowerCase().split(/[^a-z0-9]+/))
    .filter(Boolean);
  const strength = check(password.slice(0, 100), words);
  if (strength.acceptable) return;
  const message = weakPasswordMessage(strength);
  throw new AppError(400, "invalid_input", `invalid body: password: ${message}`, {
    password: [message],
  });
}

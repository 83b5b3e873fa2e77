/**
 * Rate limits whose counters live in the database (table rate_limit_counters), so that two app
 * servers on one database share them.
 *
 * Each rule counts events in fixed windows of `windowMs`; the count that is compared with the
 * limit is the usual sliding-window estimate (common practice): this window's count plus the
 * previous window's count weighted by the part of it that still lies inside the sliding window.
 * Every increment is one atomic `INSERT … ON CONFLICT DO UPDATE … RETURNING` statement, so
 * parallel requests (or servers) can never all read "below the limit" before any of them counts.
 *
 * Keys are stored as SHA-256 hex, never as the raw e-mail address or IP address.
 */
import { createHash } from "node:crypto";
import type { DataSource } from "typeorm";
import { AppError } from "../domain/errors";

export interface LimitRule {
  /** How many events are allowed inside the window. */
  limit: number;
  windowMs: number;
}

export interface RateLimitConfig {
  /** Sign-in attempts per account-and-address pair (reserved before the password is hashed). */
  signInPerPair: LimitRule;
  /** Sign-in attempts per client address, whatever the account. */
  signInPerIp: LimitRule;
  /** Failed sign-ins per account (from any address) before the account's slowdown starts. */
  signInPerAccount: LimitRule;
  /** During the slowdown, one attempt per this many ms per account from addresses that never
   * signed in to it; addresses that did (within 30 days) are not slowed. */
  signInSlowdownMs: number;
  /** Password-reset requests per client address (each one may send an e-mail). */
  passwordResetPerIp: LimitRule;
}

const FIFTEEN_MINUTES = 15 * 60 * 1000;
const THIRTY_DAYS = 30 * 24 * 60 * 60 * 1000;

export const DEFAULT_RATE_LIMITS: RateLimitConfig = {
  signInPerPair: { limit: 10, windowMs: FIFTEEN_MINUTES },
  signInPerIp: { limit: 100, windowMs: FIFTEEN_MINUTES },
  signInPerAccount: { limit: 10, windowMs: FIFTEEN_MINUTES },
  signInSlowdownMs: 5000,
  passwordResetPerIp: { limit: 10, windowMs: FIFTEEN_MINUTES },
};

/** Remembers that an account-and-address pair signed in (one "hit" per 30-day window). */
export const KNOWN_PAIR_RULE: LimitRule = { limit: 1, windowMs: THIRTY_DAYS };

export interface Count {
  /** The sliding-window estimate compared with the limit. */
  estimate: number;
  /** Events in the current fixed window only. */
  current: number;
  /** Seconds until the estimate falls back below the limit (at least 1). */
  retryAfter: number;
}

const hashKey = (key: string) => createHash("sha256").update(key).digest("hex");

export class RateLimitStore {
  private hitsSinceSweep = 0;
  private readonly postgres: boolean;

  constructor(
    private readonly dataSource: DataSource,
    private readonly now: () => number = Date.now,
  ) {
    this.postgres = dataSource.options.type === "postgres";
  }

  /** `?` for SQLite, `$n` for PostgreSQL. */
  private sql(text: string): string {
    if (!this.postgres) return text;
    let n = 0;
    return text.replace(/\?/g, () => `$${++n}`);
  }

  private windowOf(rule: LimitRule, at = this.now()) {
    const start = Math.floor(at / rule.windowMs) * rule.windowMs;
    return { start, previous: start - rule.windowMs, into: (at - start) / rule.windowMs };
  }

  private count(rule: LimitRule, start: number, current: number, previous: number): Count {
    const into = (this.now() - start) / rule.windowMs;
    const estimate = current + previous * (1 - into);
    // When the estimate is over, it falls below the limit by the end of this window at the
    // latest (then the previous window no longer counts and this one weighs less than all).
    let retryAfterMs = start + rule.windowMs - this.now();
    if (current < rule.limit && previous > 0) {
      // Only the previous window keeps it over: wait until its weight has shrunk enough.
      const fraction = 1 - (rule.limit - current) / previous;
      retryAfterMs = Math.max(0, start + fraction * rule.windowMs - this.now());
    }
    return { estimate, current, retryAfter: Math.max(1, Math.ceil(retryAfterMs / 1000)) };
  }

  private async previousCount(bucket: string, key: string, start: number): Promise<number> {
    const rows = (await this.dataSource.query(
      this.sql(
        `SELECT "hits" FROM "rate_limit_counters" WHERE "bucket" = ? AND "subject" = ? AND "windowStart" = ?`,
      ),
      [bucket, key, start],
    )) as { hits: number | string }[];
    return rows.length ? Number(rows[0].hits) : 0;
  }

  /** Counts one event (atomically) and returns the count including it. */
  async hit(bucket: string, rawKey: string, rule: LimitRule): Promise<Count> {
    const key = hashKey(rawKey);
    const { start, previous } = this.windowOf(rule);
    const rows = (await this.dataSource.query(
      this.sql(
        `INSERT INTO "rate_limit_counters" ("bucket", "subject", "windowStart", "hits") VALUES (?, ?, ?, 1)
         ON CONFLICT ("bucket", "subject", "windowStart") DO UPDATE SET "hits" = "rate_limit_counters"."hits" + 1
         RETURNING "hits"`,
      ),
      [bucket, key, start],
    )) as { hits: number | string }[];
    const current = Number(rows[0]?.hits ?? 1);
    if (++this.hitsSinceSweep >= 500) {
      this.hitsSinceSweep = 0;
      await this.sweep();
    }
    return this.count(rule, start, current, await this.previousCount(bucket, key, previous));
  }

  /** The count without adding an event. */
  async peek(bucket: string, rawKey: string, rule: LimitRule): Promise<Count> {
    const key = hashKey(rawKey);
    const { start, previous } = this.windowOf(rule);
    const current = await this.previousCount(bucket, key, start);
    return this.count(rule, start, current, await this.previousCount(bucket, key, previous));
  }

  /** Gives back one event of the current window (a reservation that turned out not to count). */
  async release(bucket: string, rawKey: string, rule: LimitRule): Promise<void> {
    const { start } = this.windowOf(rule);
    await this.dataSource.query(
      this.sql(
        `UPDATE "rate_limit_counters" SET "hits" = "hits" - 1 WHERE "bucket" = ? AND "subject" = ? AND "windowStart" = ? AND "hits" > 0`,
      ),
      [bucket, hashKey(rawKey), start],
    );
  }

  /** Forgets every event of the key. */
  async clear(bucket: string, rawKey: string): Promise<void> {
    await this.dataSource.query(
      this.sql(`DELETE FROM "rate_limit_counters" WHERE "bucket" = ? AND "subject" = ?`),
      [bucket, hashKey(rawKey)],
    );
  }

  /** Deletes windows that can no longer count (older than two of the longest window). */
  async sweep(): Promise<void> {
    await this.dataSource.query(
      this.sql(`DELETE FROM "rate_limit_counters" WHERE "windowStart" < ?`),
      [this.now() - 2 * THIRTY_DAYS],
    );
  }
}

/** 429 `rate_limited` with Retry-After (seconds), the wait worded in minutes. */
export function rateLimited(waitSeconds: number): AppError {
  const wait = Math.max(1, Math.ceil(waitSeconds));
  const when = wait <= 60 ? "in a minute" : `in ${Math.ceil(wait / 60)} minutes`;
  return new AppError(
    429,
    "rate_limited",
    `Too many attempts: for your security, try again ${when}.`,
    undefined,
    { "Retry-After": String(wait) },
  );
}

/** Buckets (table column `bucket`). */
export const BUCKETS = {
  signInPair: "sign_in_pair",
  signInIp: "sign_in_ip",
  signInAccount: "sign_in_account",
  signInSlow: "sign_in_slow",
  signInKnown: "sign_in_known",
  resetIp: "reset_ip",
} as const;

/**
 * The sign-in guard. `reserve` runs before the password is hashed and counts the attempt;
 * `succeeded` gives back what a successful sign-in should not be charged for.
 *
 * - per account-and-address pair: a hard limit (10 per 15 minutes);
 * - per address, any account: a hard limit (100 per 15 minutes);
 * - per account, from any address: after 10 failures in 15 minutes a slowdown, not a lock: one
 *   attempt per 5 s for the whole account from addresses that never signed in to it, while an
 *   address that signed in to it within 30 days is not slowed. So guessing stays slow (at most
 *   12 guesses a minute however many addresses are used) and a stranger cannot keep a member
 *   out (their own address is never limited by someone else's failures, and a new address
 *   waits seconds, not 15 minutes). OWASP Authentication Cheat Sheet; common practice.
 */
export class SignInGuard {
  constructor(
    private readonly store: RateLimitStore,
    private readonly config: RateLimitConfig,
  ) {}

  async reserve(email: string, ip: string): Promise<void> {
    const pairKey = `${email}\n${ip}`;
    const pair = await this.store.hit(BUCKETS.signInPair, pairKey, this.config.signInPerPair);
    const byIp = await this.store.hit(BUCKETS.signInIp, ip, this.config.signInPerIp);
    const over = [
      pair.estimate > this.config.signInPerPair.limit ? pair.retryAfter : 0,
      byIp.estimate > this.config.signInPerIp.limit ? byIp.retryAfter : 0,
    ];
    if (Math.max(...over) > 0) throw rateLimited(Math.max(...over));

    const account = await this.store.hit(
      BUCKETS.signInAccount,
      email,
      this.config.signInPerAccount,
    );
    if (account.estimate > this.config.signInPerAccount.limit) {
      const known = await this.store.peek(BUCKETS.signInKnown, pairKey, KNOWN_PAIR_RULE);
      if (known.estimate <= 0) {
        const slow = { limit: 1, windowMs: this.config.signInSlowdownMs };
        const slot = await this.store.hit(BUCKETS.signInSlow, email, slow);
        if (slot.current > 1) {
          await this.store.release(BUCKETS.signInAccount, email, this.config.signInPerAccount);
          throw rateLimited(slot.retryAfter);
        }
      }
    }
  }

  async succeeded(email: string, ip: string): Promise<void> {
    const pairKey = `${email}\n${ip}`;
    await this.store.clear(BUCKETS.signInPair, pairKey);
    await this.store.release(BUCKETS.signInIp, ip, this.config.signInPerIp);
    await this.store.release(BUCKETS.signInAccount, email, this.config.signInPerAccount);
    const known = await this.store.peek(BUCKETS.signInKnown, pairKey, KNOWN_PAIR_RULE);
    if (known.current < 1) await this.store.hit(BUCKETS.signInKnown, pairKey, KNOWN_PAIR_RULE);
  }
}

/** Password-reset requests per address. */
export async function reserveReset(
  store: RateLimitStore,
  config: RateLimitConfig,
  ip: string,
): Promise<void> {
  const byIp = await store.hit(BUCKETS.resetIp, ip, config.passwordResetPerIp);
  if (byIp.estimate > config.passwordResetPerIp.limit) throw rateLimited(byIp.retryAfter);
}

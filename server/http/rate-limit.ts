/** A small in-memory sliding-window counter: enough for one server process. */
import { AppError } from "../domain/errors";

export interface LimitRule {
  /** How many events are allowed inside the window. */
  limit: number;
  windowMs: number;
}

export interface RateLimitConfig {
  /** Failed sign-ins per e-mail address. */
  signInPerAccount: LimitRule;
  /** Failed sign-ins per client IP. */
  signInPerIp: LimitRule;
  /** Password-reset requests per client IP (each one may send an e-mail). */
  passwordResetPerIp: LimitRule;
}

const FIFTEEN_MINUTES = 15 * 60 * 1000;

export const DEFAULT_RATE_LIMITS: RateLimitConfig = {
  signInPerAccount: { limit: 10, windowMs: FIFTEEN_MINUTES },
  signInPerIp: { limit: 30, windowMs: FIFTEEN_MINUTES },
  passwordResetPerIp: { limit: 10, windowMs: FIFTEEN_MINUTES },
};

export class SlidingWindowLimiter {
  private readonly events = new Map<string, number[]>();

  constructor(
    readonly rule: LimitRule,
    private readonly now: () => number = Date.now,
  ) {}

  private recent(key: string): number[] {
    const cutoff = this.now() - this.rule.windowMs;
    const kept = (this.events.get(key) ?? []).filter((t) => t > cutoff);
    if (kept.length) this.events.set(key, kept);
    else this.events.delete(key);
    return kept;
  }

  /** Seconds until another event is allowed; 0 when allowed now. */
  retryAfter(key: string): number {
    const events = this.recent(key);
    if (events.length < this.rule.limit) return 0;
    const oldestThatCounts = events[events.length - this.rule.limit];
    return Math.max(1, Math.ceil((oldestThatCounts + this.rule.windowMs - this.now()) / 1000));
  }

  hit(key: string): void {
    const events = this.recent(key);
    events.push(this.now());
    this.events.set(key, events);
    if (this.events.size > 10_000) this.sweep();
  }

  reset(key: string): void {
    this.events.delete(key);
  }

  private sweep(): void {
    for (const key of [...this.events.keys()]) this.recent(key);
  }
}

/** Throws 429 `rate_limited` with Retry-After when any limiter blocks its key. */
export function assertNotLimited(checks: [SlidingWindowLimiter, string][]): void {
  const wait = Math.max(0, ...checks.map(([limiter, key]) => limiter.retryAfter(key)));
  if (wait > 0) {
    const when = wait <= 60 ? "in a minute" : `in ${Math.ceil(wait / 60)} minutes`;
    throw new AppError(
      429,
      "rate_limited",
      `Too many attempts: for your security, try again ${when}.`,
      undefined,
      { "Retry-After": String(wait) },
    );
  }
}

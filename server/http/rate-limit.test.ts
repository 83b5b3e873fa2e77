import { describe, expect, it } from "vitest";
import { AppError } from "../domain/errors";
import { assertNotLimited, SlidingWindowLimiter } from "./rate-limit";

function clock(start = 1_000_000) {
  let now = start;
  return { now: () => now, advance: (ms: number) => (now += ms) };
}

describe("SlidingWindowLimiter", () => {
  it("allows `limit` events in a window and then asks to wait until the oldest expires", () => {
    const c = clock();
    const limiter = new SlidingWindowLimiter({ limit: 3, windowMs: 60_000 }, c.now);
    for (let i = 0; i < 3; i++) {
      expect(limiter.retryAfter("a")).toBe(0);
      limiter.hit("a");
      c.advance(10_000);
    }
    // Events at t=0, 10 s, 20 s; now t=30 s: the first expires at t=60 s.
    expect(limiter.retryAfter("a")).toBe(30);
    c.advance(30_000);
    expect(limiter.retryAfter("a")).toBe(0);
  });

  it("keeps keys apart and forgets a key on reset", () => {
    const c = clock();
    const limiter = new SlidingWindowLimiter({ limit: 1, windowMs: 1_000 }, c.now);
    limiter.hit("a");
    expect(limiter.retryAfter("a")).toBe(1);
    expect(limiter.retryAfter("b")).toBe(0);
    limiter.reset("a");
    expect(limiter.retryAfter("a")).toBe(0);
  });

  it("assertNotLimited throws 429 with Retry-After from the slowest limiter", () => {
    const c = clock();
    const short = new SlidingWindowLimiter({ limit: 1, windowMs: 5_000 }, c.now);
    const long = new SlidingWindowLimiter({ limit: 1, windowMs: 50_000 }, c.now);
    short.hit("k");
    long.hit("k");
    let caught: unknown;
    try {
      assertNotLimited([
        [short, "k"],
        [long, "k"],
      ]);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(AppError);
    expect((caught as AppError).status).toBe(429);
    expect((caught as AppError).headers).toEqual({ "Retry-After": "50" });
    expect((caught as AppError).message).toBe(
      "Too many attempts: for your security, try again in a minute.",
    );
    expect(() => assertNotLimited([[short, "other"]])).not.toThrow();
  });

  it("words a wait of more than a minute in whole minutes, rounded up", () => {
    const c = clock();
    const limiter = new SlidingWindowLimiter({ limit: 1, windowMs: 900_000 }, c.now);
    limiter.hit("k");
    expect(() => assertNotLimited([[limiter, "k"]])).toThrow("try again in 15 minutes.");
  });
});

import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { DataSource } from "typeorm";
import { openDatabase } from "../data/data-source";
import { AppError } from "../domain/errors";
import { DEFAULT_RATE_LIMITS, RateLimitStore, SignInGuard, rateLimited } from "./rate-limit";

let dir: string;
let dataSource: DataSource;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "spreadsight-limits-"));
  dataSource = await openDatabase({ path: join(dir, "limits.sqlite") });
});
afterAll(async () => {
  await dataSource.destroy();
  rmSync(dir, { recursive: true, force: true });
});

function clock(start = 1_000_000_000) {
  let now = start;
  return { now: () => now, advance: (ms: number) => (now += ms) };
}

async function refusal(work: Promise<unknown>): Promise<AppError | null> {
  try {
    await work;
    return null;
  } catch (error) {
    if (error instanceof AppError) return error;
    throw error;
  }
}

describe("RateLimitStore (counters in the database)", () => {
  it("counts events in a window and weighs the previous window by what still overlaps", async () => {
    const c = clock(60_000 * 1000);
    const store = new RateLimitStore(dataSource, c.now);
    const rule = { limit: 3, windowMs: 60_000 };
    for (let i = 1; i <= 4; i++) expect((await store.hit("t1", "a", rule)).estimate).toBe(i);
    // Half-way into the next window: 4 events of the previous one weigh 4 × 0.5 (sliding
    // window estimate, common practice).
    c.advance(90_000);
    expect((await store.peek("t1", "a", rule)).estimate).toBeCloseTo(2, 10);
    expect((await store.peek("t1", "b", rule)).estimate).toBe(0);
  });

  it("two stores on one database (two app servers) share the counts", async () => {
    const c = clock(60_000 * 2000);
    const one = new RateLimitStore(dataSource, c.now);
    const two = new RateLimitStore(dataSource, c.now);
    const rule = { limit: 2, windowMs: 60_000 };
    await one.hit("t2", "shared", rule);
    await two.hit("t2", "shared", rule);
    expect((await one.hit("t2", "shared", rule)).estimate).toBe(3);
  });

  it("release gives an event back and clear forgets the key", async () => {
    const c = clock(60_000 * 3000);
    const store = new RateLimitStore(dataSource, c.now);
    const rule = { limit: 5, windowMs: 60_000 };
    await store.hit("t3", "k", rule);
    await store.hit("t3", "k", rule);
    await store.release("t3", "k", rule);
    expect((await store.peek("t3", "k", rule)).current).toBe(1);
    await store.clear("t3", "k");
    expect((await store.peek("t3", "k", rule)).current).toBe(0);
  });

  it("stores a hash of the key, never the e-mail address itself", async () => {
    const store = new RateLimitStore(dataSource);
    await store.hit("t4", "someone@example.test", { limit: 1, windowMs: 1000 });
    const rows = (await dataSource.query(
      `SELECT "subject" FROM "rate_limit_counters" WHERE "bucket" = 't4'`,
    )) as { subject: string }[];
    expect(rows[0].subject).toMatch(/^[0-9a-f]{64}$/);
  });
});

describe("SignInGuard", () => {
  const config = {
    ...DEFAULT_RATE_LIMITS,
    signInPerPair: { limit: 3, windowMs: 60_000 },
    signInPerIp: { limit: 100, windowMs: 60_000 },
    signInPerAccount: { limit: 4, windowMs: 60_000 },
    signInSlowdownMs: 5_000,
  };

  it("refuses the pair after its limit, counting before any password is checked", async () => {
    const c = clock(60_000 * 5000);
    const guard = new SignInGuard(new RateLimitStore(dataSource, c.now), config);
    for (let i = 0; i < 3; i++) await guard.reserve("a@x.test", "10.0.0.1");
    const refused = await refusal(guard.reserve("a@x.test", "10.0.0.1"));
    expect(refused?.status).toBe(429);
    expect(refused?.headers?.["Retry-After"]).toMatch(/^\d+$/);
    // Another address is not limited by this pair.
    expect(await refusal(guard.reserve("a@x.test", "10.0.0.2"))).toBeNull();
  });

  it("slows an attacked account to one attempt per interval for unknown addresses, never for a known one", async () => {
    const c = clock(60_000 * 6000);
    const guard = new SignInGuard(new RateLimitStore(dataSource, c.now), config);
    await guard.succeeded("b@x.test", "10.1.0.1"); // the member signed in from here before
    // Four failures from four addresses use up the account's allowance…
    for (let i = 0; i < 4; i++) await guard.reserve("b@x.test", `10.2.0.${i}`);
    // …then one attempt per 5 s goes through from new addresses, the rest get 429 with seconds.
    expect(await refusal(guard.reserve("b@x.test", "10.3.0.1"))).toBeNull();
    const slowed = await refusal(guard.reserve("b@x.test", "10.3.0.2"));
    expect(slowed?.status).toBe(429);
    expect(Number(slowed?.headers?.["Retry-After"])).toBeLessThanOrEqual(5);
    // The member's own address is never slowed by the strangers.
    expect(await refusal(guard.reserve("b@x.test", "10.1.0.1"))).toBeNull();
    c.advance(5_000);
    expect(await refusal(guard.reserve("b@x.test", "10.3.0.3"))).toBeNull();
  });

  it("words the wait in minutes", () => {
    expect(rateLimited(30).message).toBe(
      "Too many attempts: for your security, try again in a minute.",
    );
    expect(rateLimited(900).message).toBe(
      "Too many attempts: for your security, try again in 15 minutes.",
    );
    expect(rateLimited(61).headers).toEqual({ "Retry-After": "61" });
  });
});

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { Session } from "../data/entities/session";
import {
  client,
  createTestContext,
  PUBLIC_URL,
  seedTeam,
  sessionCookie,
  signIn,
  TEST_PASSWORD,
  type TestContext,
  type TestTeam,
} from "../testing/harness";

let ctx: TestContext;
let team: TestTeam;

beforeAll(async () => {
  ctx = await createTestContext({
    rateLimits: {
      signInPerPair: { limit: 3, windowMs: 60_000 },
      signInPerIp: { limit: 1000, windowMs: 60_000 },
    },
  });
  team = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
});
afterAll(() => ctx.close());

describe("sign-in", () => {
  it("returns the member with team, role and preferences and sets an httpOnly Lax cookie", async () => {
    const response = await client(ctx.app)
      .post("/api/auth/sign-in")
      .send({ email: "Lead@Alder.test", password: TEST_PASSWORD });
    expect(response.status).toBe(200);
    expect(response.body).toEqual({
      user: { id: team.users.lead.id, email: "lead@alder.test", name: "alder lead" },
      team: { id: team.id, name: "Alder Test Surveys" },
      role: "lead",
      preferences: { units: "metric" },
      demo: false,
      mailbox: true,
    });
    const cookie = (response.headers["set-cookie"] as unknown as string[])[0];
    expect(cookie).toMatch(/^spreadsight_session=[a-z0-9]+;/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
  });

  it("marks the cookie Secure when the request arrived over HTTPS", async () => {
    // supertest speaks plain HTTP, so exercise the https branch through a trusted proxy header.
    const { createApp } = await import("./app");
    const { createLogger } = await import("../logger");
    const app = createApp({
      dataSource: ctx.dataSource,
      mailer: { send: async () => undefined, close: () => undefined },
      logger: createLogger("silent"),
      publicUrl: PUBLIC_URL,
      trustProxy: true,
    });
    const response = await request(app)
      .post("/api/auth/sign-in")
      .set("Origin", PUBLIC_URL)
      .set("X-Forwarded-Proto", "https")
      .send({ email: "trainee@alder.test", password: TEST_PASSWORD });
    expect(response.status).toBe(200);
    expect(response.headers["set-cookie"]?.[0]).toMatch(/; Secure/i);
  });

  it("answers a wrong password and an unknown address with the same 401", async () => {
    const wrong = await client(ctx.app)
      .post("/api/auth/sign-in")
      .send({ email: "reviewer@alder.test", password: "not-the-password" });
    const unknown = await client(ctx.app)
      .post("/api/auth/sign-in")
      .send({ email: "nobody@alder.test", password: "not-the-password" });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.code).toBe("invalid_credentials");
    expect(wrong.headers["set-cookie"]).toBeUndefined();
  });

  it("records each successful sign-in in the audit trail", async () => {
    const cookie = await signIn(ctx.app, "admin@alder.test");
    const audit = await client(ctx.app, cookie).get("/api/audit?limit=5");
    expect(audit.status).toBe(200);
    expect(audit.body[0]).toMatchObject({
      action: "auth.sign_in",
      actor: { id: team.users.admin.id, name: "alder admin" },
      targetType: "user",
      targetId: team.users.admin.id,
    });
  });
});

describe("session", () => {
  it("GET /api/me is 401 without a cookie and with a forged one", async () => {
    const none = await client(ctx.app).get("/api/me");
    expect(none.status).toBe(401);
    expect(none.body).toEqual({ error: { code: "unauthenticated", message: "sign in first" } });
    const forged = await client(ctx.app, "spreadsight_session=abcdefghijklmnop").get("/api/me");
    expect(forged.status).toBe(401);
    // The stale cookie is cleared.
    expect(forged.headers["set-cookie"]?.[0]).toMatch(/^spreadsight_session=;/);
  });

  it("sign-out ends the session on the server, not just in the browser", async () => {
    const cookie = await signIn(ctx.app, "reviewer@alder.test");
    expect((await client(ctx.app, cookie).get("/api/me")).status).toBe(200);
    const out = await client(ctx.app, cookie).post("/api/auth/sign-out").send({});
    expect(out.status).toBe(204);
    expect(out.headers["set-cookie"]?.[0]).toMatch(/^spreadsight_session=;/);
    expect((await client(ctx.app, cookie).get("/api/me")).status).toBe(401);
    const id = cookie.split("=")[1];
    expect(await ctx.dataSource.getRepository(Session).existsBy({ id })).toBe(false);
  });

  it("signing in again replaces the browser's previous session", async () => {
    const first = await signIn(ctx.app, "trainee@alder.test");
    const again = await client(ctx.app, first)
      .post("/api/auth/sign-in")
      .send({ email: "trainee@alder.test", password: TEST_PASSWORD });
    expect(again.status).toBe(200);
    const second = sessionCookie(again.headers["set-cookie"]);
    expect(second).not.toBe(first);
    expect((await client(ctx.app, first).get("/api/me")).status).toBe(401);
    expect((await client(ctx.app, second).get("/api/me")).status).toBe(200);
  });

  it("stores preferences per user", async () => {
    const cookie = await signIn(ctx.app, "lead@alder.test");
    const put = await client(ctx.app, cookie)
      .put("/api/me/preferences")
      .send({ units: "imperial" });
    expect(put.status).toBe(200);
    expect(put.body).toEqual({ units: "imperial" });
    expect((await client(ctx.app, cookie).get("/api/me")).body.preferences).toEqual({
      units: "imperial",
    });
    const other = await signIn(ctx.app, "admin@alder.test");
    expect((await client(ctx.app, other).get("/api/me")).body.preferences).toEqual({
      units: "metric",
    });
    const bad = await client(ctx.app, cookie).put("/api/me/preferences").send({ units: "cubits" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({ units: ["units must be metric or imperial"] });
  });
});

describe("Origin check on state-changing requests", () => {
  it("refuses a foreign Origin even without a cookie (no login CSRF)", async () => {
    const response = await request(ctx.app)
      .post("/api/auth/sign-in")
      .set("Origin", "http://evil.example")
      .send({ email: "lead@alder.test", password: TEST_PASSWORD });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe("bad_origin");
  });

  it("refuses a request with a session cookie but no Origin", async () => {
    const cookie = await signIn(ctx.app, "lead@alder.test");
    const response = await request(ctx.app)
      .post("/api/sites")
      .set("Cookie", cookie)
      .send({ name: "Forged site" });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe("origin_required");
  });

  it("compares the scheme too: https://host is not the origin of a server reached over http", async () => {
    const response = await request(ctx.app)
      .post("/api/auth/sign-in")
      .set("Origin", "https://spreadsight.test")
      .send({ email: "lead@alder.test", password: TEST_PASSWORD });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe("bad_origin");
  });

  it("accepts an Origin equal to the Host header, and cookie-less requests without Origin", async () => {
    const sameHost = await request(ctx.app)
      .post("/api/auth/sign-in")
      .set("Host", "spreadsight.internal:8080")
      .set("Origin", "http://spreadsight.internal:8080")
      .send({ email: "trainee@alder.test", password: TEST_PASSWORD });
    expect(sameHost.status).toBe(200);
    const noOrigin = await request(ctx.app)
      .post("/api/auth/sign-in")
      .send({ email: "trainee@alder.test", password: TEST_PASSWORD });
    expect(noOrigin.status).toBe(200);
  });

  it("lets GET through with a cookie and no Origin", async () => {
    const cookie = await signIn(ctx.app, "lead@alder.test");
    const response = await request(ctx.app).get("/api/sites").set("Cookie", cookie);
    expect(response.status).toBe(200);
  });
});

describe("sign-in rate limit", () => {
  it("blocks an account-and-address pair after 3 failures (test limit) with 429 and Retry-After, even with the right password", async () => {
    const email = "reviewer@alder.test";
    for (let i = 0; i < 3; i++) {
      const r = await client(ctx.app)
        .post("/api/auth/sign-in")
        .send({ email, password: "wrong-1234" });
      expect(r.status).toBe(401);
    }
    const blocked = await client(ctx.app)
      .post("/api/auth/sign-in")
      .send({ email, password: TEST_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe("rate_limited");
    const retryAfter = Number(blocked.headers["retry-after"]);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(60);
    // Another account from the same address is unaffected.
    const other = await client(ctx.app)
      .post("/api/auth/sign-in")
      .send({ email: "admin@alder.test", password: TEST_PASSWORD });
    expect(other.status).toBe(200);
  });

  it("blocks an IP after too many failures across accounts", async () => {
    const limited = await createTestContext({
      rateLimits: { signInPerIp: { limit: 4, windowMs: 60_000 } },
    });
    try {
      await seedTeam(limited.dataSource, "Rowan Test Surveys", "rowan");
      for (let i = 0; i < 4; i++) {
        const r = await client(limited.app)
          .post("/api/auth/sign-in")
          .send({ email: `guess${i}@rowan.test`, password: "wrong-1234" });
        expect(r.status).toBe(401);
      }
      const blocked = await client(limited.app)
        .post("/api/auth/sign-in")
        .send({ email: "lead@rowan.test", password: TEST_PASSWORD });
      expect(blocked.status).toBe(429);
      expect(blocked.headers["retry-after"]).toBeDefined();
    } finally {
      await limited.close();
    }
  });
});

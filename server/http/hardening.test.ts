/**
 * Issue 12 ("hardening"): one test per finding, each failing on the code before the fix.
 */
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { request as httpRequest } from "node:http";
import type { AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Plan as PlanDocument } from "@engine";
import { inTransaction } from "../data/transaction";
import { createLogger } from "../logger";
import { startServer } from "../start";
import {
  client,
  createTestContext,
  linkToken,
  PUBLIC_URL,
  seedTeam,
  signIn,
  TEST_PASSWORD,
  type TestContext,
  type TestTeam,
} from "../testing/harness";
import { createApp } from "./app";
import { CONTENT_SECURITY_POLICY } from "./security";

let ctx: TestContext;
let team: TestTeam;
let lead: string;

beforeAll(async () => {
  ctx = await createTestContext();
  team = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
  lead = await signIn(ctx.app, "lead@alder.test");
});
afterAll(async () => {
  await ctx.locals.drain();
  await ctx.close();
});

const HOSTILE_KEYS = ["__proto__", "constructor", "toString", "hasOwnProperty", "valueOf"];

describe("1. keys named like built-in properties", () => {
  it.each(HOSTILE_KEYS)(
    "%s in a sign-in body → 400 invalid_input naming the field",
    async (key) => {
      const response = await client(ctx.app)
        .post("/api/auth/sign-in")
        .set("Content-Type", "application/json")
        .send(`{"email":"lead@alder.test","password":"x","${key}":1}`);
      expect(response.status).toBe(400);
      expect(response.body.error.code).toBe("invalid_input");
      expect(Object.keys(response.body.error.fields)).toContain(key);
      expect(response.body.error.fields[key]).toEqual(["unknown field"]);
    },
  );

  it.each(HOSTILE_KEYS)("%s in a reset body and in a query string → 400", async (key) => {
    const reset = await client(ctx.app)
      .post("/api/auth/password-reset")
      .set("Content-Type", "application/json")
      .send(`{"email":"a@b.test","${key}":{"x":1}}`);
    expect(reset.status).toBe(400);
    expect(reset.body.error.code).toBe("invalid_input");
    const query = await client(ctx.app, lead).get(`/api/sites?${key}=1`);
    expect(query.status).toBe(400);
    expect(Object.keys(query.body.error.fields)).toContain(key);
  });
});

describe("2. uploads: cheap checks before the body is read", () => {
  let archivedPlan: string;
  let server: ReturnType<typeof import("node:http").createServer>;
  let port: number;

  beforeAll(async () => {
    const document = JSON.parse(
      readFileSync("docs/examples/two-layer-simple.json", "utf8"),
    ) as PlanDocument;
    const created = await client(ctx.app, lead)
      .post(`/api/sites/${team.sites.active}/plans`)
      .send({ name: "Old line", document });
    archivedPlan = created.body.id;
    const archived = await client(ctx.app, lead)
      .patch(`/api/plans/${archivedPlan}`)
      .send({ archived: true });
    expect(archived.status).toBe(200);
    const { createServer } = await import("node:http");
    server = createServer(ctx.app);
    await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
    port = (server.address() as AddressInfo).port;
  });
  afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

  /** Sends only the headers of a large upload and waits for the answer (never the body). */
  function headersOnly(path: string, length: number): Promise<{ status: number; body: string }> {
    return new Promise((resolve, reject) => {
      const req = httpRequest({
        host: "127.0.0.1",
        port,
        method: "POST",
        path,
        headers: {
          Origin: PUBLIC_URL,
          Cookie: lead,
          "Content-Type": "multipart/form-data; boundary=xyz",
          "Content-Length": String(length),
        },
      });
      req.on("response", (res) => {
        let body = "";
        res.on("data", (c: Buffer) => (body += c.toString()));
        res.on("end", () => {
          req.destroy();
          resolve({ status: res.statusCode ?? 0, body });
        });
      });
      req.on("error", reject);
      req.flushHeaders();
    });
  }

  it("refuses an upload to an archived plan before reading any of it (409)", async () => {
    const answer = await headersOnly(`/api/plans/${archivedPlan}/attachments`, 10 * 1024 * 1024);
    expect(answer.status).toBe(409);
    expect(JSON.parse(answer.body).error.code).toBe("plan_locked");
  });

  it("refuses a declared length over the largest limit before reading it (413)", async () => {
    const created = await client(ctx.app, lead)
      .post(`/api/sites/${team.sites.active}/plans`)
      .send({
        name: "Open line",
        document: JSON.parse(readFileSync("docs/examples/two-layer-simple.json", "utf8")),
      });
    const answer = await headersOnly(`/api/plans/${created.body.id}/attachments`, 50 * 1024 * 1024);
    expect(answer.status).toBe(413);
    expect(JSON.parse(answer.body).error.code).toBe("file_too_large");
  });

  it("refuses a borehole file as soon as it outgrows the borehole limit (2 MB), naming the kind", async () => {
    const created = await client(ctx.app, lead)
      .post(`/api/sites/${team.sites.active}/plans`)
      .send({
        name: "Third line",
        document: JSON.parse(readFileSync("docs/examples/two-layer-simple.json", "utf8")),
      });
    const response = await client(ctx.app, lead)
      .post(`/api/plans/${created.body.id}/attachments`)
      .field("kind", "borehole")
      .attach("file", Buffer.alloc(3 * 1024 * 1024, "1\n"), "log.csv");
    expect(response.status).toBe(413);
    expect(response.body.error.message).toMatch(/most a borehole or probe log \(csv\) may be/);
  });

  it("refuses a CSV of more lines than any real log before parsing it (422 naming the count)", async () => {
    const created = await client(ctx.app, lead)
      .post(`/api/sites/${team.sites.active}/plans`)
      .send({
        name: "Fourth line",
        document: JSON.parse(readFileSync("docs/examples/two-layer-simple.json", "utf8")),
      });
    const lines = "depth_from,depth_to,material\n" + "5\n".repeat(900_000);
    const response = await client(ctx.app, lead)
      .post(`/api/plans/${created.body.id}/attachments`)
      .field("kind", "borehole")
      .attach("file", Buffer.from(lines), "log.csv");
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe("invalid_csv");
    expect(response.body.error.message).toMatch(
      /900,002 lines; a CSV upload may have at most 60,000/,
    );
  });
});

describe("3. sign-in limits", () => {
  it("parallel wrong passwords cannot outrun the pair limit (counted before hashing)", async () => {
    const limited = await createTestContext({
      rateLimits: { signInPerPair: { limit: 5, windowMs: 60_000 } },
    });
    try {
      await seedTeam(limited.dataSource, "Rowan Test Surveys", "rowan");
      const answers = await Promise.all(
        Array.from({ length: 30 }, () =>
          client(limited.app)
            .post("/api/auth/sign-in")
            .send({ email: "lead@rowan.test", password: "wrong-guess-1" }),
        ),
      );
      const statuses = answers.map((a) => a.status);
      expect(statuses.filter((s) => s === 401)).toHaveLength(5);
      expect(statuses.filter((s) => s === 429)).toHaveLength(25);
    } finally {
      await limited.close();
    }
  });

  it("a stranger's failures from elsewhere do not keep the member out", async () => {
    const logger = createLogger("silent");
    const app = createApp({
      dataSource: ctx.dataSource,
      mailer: { send: async () => undefined, close: () => undefined },
      logger,
      publicUrl: PUBLIC_URL,
      trustProxy: true,
    });
    const attempt = (ip: string, password: string) =>
      request(app)
        .post("/api/auth/sign-in")
        .set("Origin", PUBLIC_URL)
        .set("X-Forwarded-For", ip)
        .send({ email: "reviewer@alder.test", password });
    for (let i = 0; i < 12; i++) await attempt("203.0.113.9", `wrong-guess-${i}`);
    const stranger = await attempt("203.0.113.9", "wrong-guess-again");
    expect(stranger.status).toBe(429);
    const member = await attempt("198.51.100.4", TEST_PASSWORD);
    expect(member.status).toBe(200);
  });
});

describe("4. password reset", () => {
  it("answers a known address without waiting for the database (the work is queued)", async () => {
    // Hold the write queue: before the fix the route waited for its own transaction.
    let release!: () => void;
    const held = inTransaction(ctx.dataSource, () => new Promise<void>((r) => (release = r)));
    const answer = await Promise.race([
      client(ctx.app).post("/api/auth/password-reset").send({ email: "trainee@alder.test" }),
      new Promise<"waited">((resolve) => setTimeout(() => resolve("waited"), 2000)),
    ]);
    release();
    await held;
    expect(answer === "waited" ? answer : answer.status).toBe(202);
    const mail = await ctx.mailbox.waitFor((m) => m.to.includes("trainee@alder.test"));
    expect(linkToken(mail.text, "reset")).toMatch(/^[a-z2-7]{32}$/);
  });
});

describe("5. security headers and source maps", () => {
  let dir: string;
  beforeAll(() => {
    dir = mkdtempSync(join(tmpdir(), "spreadsight-client-"));
    mkdirSync(join(dir, "assets"));
    writeFileSync(join(dir, "index.html"), "<!doctype html><title>x</title>");
    writeFileSync(
      join(dir, "assets/index-abc123.js"),
      `console.log(${JSON.stringify("x".repeat(5000))});`,
    );
    writeFileSync(join(dir, "assets/index-abc123.js.map"), '{"version":3}');
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  const appWithClient = () =>
    createApp({
      dataSource: ctx.dataSource,
      mailer: { send: async () => undefined, close: () => undefined },
      logger: createLogger("silent"),
      publicUrl: PUBLIC_URL,
      clientDir: dir,
    });

  it("sends CSP (frame-ancestors 'none', scripts and workers from self), Referrer-Policy and nosniff on pages and the API", async () => {
    const app = appWithClient();
    for (const path of ["/", "/sign-in", "/api/health"]) {
      const response = await request(app).get(path);
      const csp = response.headers["content-security-policy"];
      expect(csp).toContain("frame-ancestors 'none'");
      expect(csp).toContain("script-src 'self'");
      expect(csp).toContain("worker-src 'self'");
      expect(csp).not.toMatch(/script-src[^;]*unsafe/);
      expect(response.headers["referrer-policy"]).toBe("strict-origin-when-cross-origin");
      expect(response.headers["x-content-type-options"]).toBe("nosniff");
      expect(response.headers["x-frame-options"]).toBe("DENY");
    }
    expect(CONTENT_SECURITY_POLICY["object-src"]).toEqual(["'none'"]);
  });

  it("never serves a source map, however the path is written", async () => {
    const app = appWithClient();
    for (const path of [
      "/assets/index-abc123.js.map",
      "/assets/index-abc123.js%2Emap",
      "/assets/INDEX-ABC123.JS.MAP",
    ]) {
      const response = await request(app).get(path);
      expect(response.status, path).toBe(404);
      expect(response.text).not.toContain('"version"');
    }
  });

  it("compresses assets and caches hashed ones as immutable", async () => {
    const response = await request(appWithClient())
      .get("/assets/index-abc123.js")
      .set("Accept-Encoding", "gzip");
    expect(response.status).toBe(200);
    expect(response.headers["content-encoding"]).toBe("gzip");
    expect(response.headers["cache-control"]).toContain("immutable");
  });
});

describe("6. the mailbox", () => {
  it("is off outside demo mode when no SMTP server is set: nobody can read reset links", async () => {
    const dbDir = mkdtempSync(join(tmpdir(), "spreadsight-nomail-"));
    const server = await startServer({
      port: 0,
      dbPath: join(dbDir, "db.sqlite"),
      serveClient: false,
      logger: createLogger("silent"),
    });
    try {
      expect(server.mailbox).toBeNull();
      const health = await fetch(`${server.url}/api/health`);
      expect(health.status).toBe(200);
      const reset = await fetch(`${server.url}/api/auth/password-reset`, {
        method: "POST",
        headers: { "Content-Type": "application/json", Origin: server.url },
        body: JSON.stringify({ email: "someone@example.test" }),
      });
      expect(reset.status).toBe(202);
      const stored = (await server.dataSource.query(
        `SELECT COUNT(*) AS n FROM "mail_messages"`,
      )) as { n: number }[];
      expect(Number(stored[0].n)).toBe(0);
    } finally {
      await server.close();
      rmSync(dbDir, { recursive: true, force: true });
    }
  });
});

describe("7. new passwords", () => {
  it("refuses a common or repetitive password at reset, naming the field", async () => {
    await client(ctx.app).post("/api/auth/password-reset").send({ email: "admin@alder.test" });
    const mail = await ctx.mailbox.waitFor((m) => m.to.includes("admin@alder.test"));
    const token = linkToken(mail.text, "reset");
    for (const password of ["aaaaaaaaaa", "password123", "alderadmin1"]) {
      const response = await client(ctx.app)
        .post(`/api/auth/password-reset/${token}`)
        .send({ password });
      expect(response.status, password).toBe(400);
      expect(response.body.error.code).toBe("invalid_input");
      expect(response.body.error.fields.password[0]).toMatch(/too easy to guess/);
    }
    const strong = await client(ctx.app)
      .post(`/api/auth/password-reset/${token}`)
      .send({ password: "quarry floor geophone lantern" });
    expect(strong.status).toBe(204);
  });
});

/**
 * Two app servers on one PostgreSQL database behave as one (project `server-pg` only: on
 * SQLite, Spreadsight is one process on one machine). Both start at once on an empty database:
 * the migrations and the demo seed run once. Then: a session made on one works on the other,
 * sign-in rate limits count across both, racing saves sent to both give one winner, a
 * password-reset link used on both at once works once, and a comment's e-mail notice goes out
 * once.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestDatabase, testDatabaseKind, type TestDatabase } from "../testing/database";
import { thinLayerDocument } from "../testing/plans";
import { startServer, type RunningServer } from "../start";
import { DEMO_PASSWORD, DEMO_TEAM_NAME } from "./seed-demo";

let database: TestDatabase;
let a: RunningServer;
let b: RunningServer;
const seeded: boolean[] = [];

beforeAll(async () => {
  expect(testDatabaseKind()).toBe("postgres");
  // No tables yet: both servers race the migrations too (one migrates, the other waits).
  database = await createTestDatabase({ empty: true });
  const url = database.options.url!;
  const start = () =>
    startServer({
      port: 0,
      databaseUrl: url,
      demo: true,
      serveClient: false,
      rateLimits: { signInPerPair: { limit: 3, windowMs: 60_000 } },
    });
  [a, b] = await Promise.all([start(), start()]);
  seeded.push(a.seeded, b.seeded);
});
afterAll(async () => {
  await Promise.all([a?.close(), b?.close()]);
  await database?.drop();
});

async function call(
  server: RunningServer,
  method: string,
  path: string,
  options: { cookie?: string; body?: unknown } = {},
) {
  const response = await fetch(`${server.url}${path}`, {
    method,
    headers: {
      "Content-Type": "application/json",
      // Both servers are "the same site" behind a proxy: either's Origin is accepted by itself.
      Origin: server.url,
      ...(options.cookie ? { Cookie: options.cookie } : {}),
    },
    body: options.body === undefined ? undefined : JSON.stringify(options.body),
  });
  const text = await response.text();
  return {
    status: response.status,
    cookie: (response.headers.get("set-cookie") ?? "").split(";")[0],
    body: text ? (JSON.parse(text) as Record<string, unknown>) : {},
  };
}

const signIn = (server: RunningServer, email: string, password = DEMO_PASSWORD) =>
  call(server, "POST", "/api/auth/sign-in", { body: { email, password } });

describe("two app servers on one PostgreSQL database", () => {
  it("seed the demo team once although both started together on an empty database", async () => {
    expect(seeded.filter(Boolean)).toHaveLength(1);
    const [row] = (await a.dataSource.query(`SELECT COUNT(*) AS n FROM "teams" WHERE "name" = $1`, [
      DEMO_TEAM_NAME,
    ])) as { n: number }[];
    expect(row.n).toBe(1);
  });

  it("accept a session made on one on the other, and sign it out everywhere", async () => {
    const session = await signIn(a, "lead@spreadsight.test");
    expect(session.status).toBe(200);
    expect((await call(b, "GET", "/api/me", { cookie: session.cookie })).status).toBe(200);
    expect((await call(b, "POST", "/api/auth/sign-out", { cookie: session.cookie })).status).toBe(
      204,
    );
    expect((await call(a, "GET", "/api/me", { cookie: session.cookie })).status).toBe(401);
  });

  it("count sign-in failures across both (limit 3 per account and address)", async () => {
    const email = "trainee@spreadsight.test";
    const statuses: number[] = [];
    for (const server of [a, b, a]) statuses.push((await signIn(server, email, "wrong-1")).status);
    expect(statuses).toEqual([401, 401, 401]);
    const blocked = await signIn(b, email);
    expect(blocked.status).toBe(429);
    expect((blocked.body.error as { code: string }).code).toBe("rate_limited");
  });

  it("give exactly one winner when saves from the same revision race on both", async () => {
    const lead = await signIn(a, "lead@spreadsight.test");
    const sites = (await call(b, "GET", "/api/sites", { cookie: lead.cookie })).body as unknown as {
      id: string;
    }[];
    const created = await call(a, "POST", `/api/sites/${sites[0].id}/plans`, {
      cookie: lead.cookie,
      body: { name: "Raced across servers" },
    });
    expect(created.status).toBe(201);
    const planId = created.body.id as string;
    const saves = [1.0, 1.5, 2.0, 2.5].map((thickness, i) =>
      call(i % 2 ? b : a, "PUT", `/api/plans/${planId}`, {
        cookie: lead.cookie,
        body: { baseRevision: 1, document: thinLayerDocument(thickness) },
      }),
    );
    const statuses = (await Promise.all(saves)).map((r) => r.status).sort();
    expect(statuses).toEqual([200, 409, 409, 409]);
    const revisions = (await a.dataSource.query(
      `SELECT "number" FROM "plan_revisions" WHERE "planId" = $1 ORDER BY "number"`,
      [planId],
    )) as { number: number }[];
    expect(revisions.map((r) => r.number)).toEqual([1, 2]);
  });

  it("let a password-reset link be used once when both servers receive it at the same time", async () => {
    const email = "admin@spreadsight.test";
    expect((await call(a, "POST", "/api/auth/password-reset", { body: { email } })).status).toBe(
      202,
    );
    const mailText = async () =>
      (
        (await b.dataSource.query(
          `SELECT "text" FROM "mail_messages" WHERE "to" LIKE $1 ORDER BY "receivedAt" DESC`,
          [`%${email}%`],
        )) as { text: string }[]
      )[0]?.text;
    const deadline = Date.now() + 10_000;
    while (!(await mailText()) && Date.now() < deadline) {
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    const token = /\/reset\/([a-z2-7]{32})/.exec((await mailText()) ?? "")?.[1];
    expect(token).toBeDefined();
    const use = (server: RunningServer, password: string) =>
      call(server, "POST", `/api/auth/password-reset/${token}`, { body: { password } });
    const results = await Promise.all([
      use(a, "Quarry-lantern-58-heron"),
      use(b, "Basalt-orchard-73-wren"),
    ]);
    const statuses = results.map((r) => r.status).sort();
    expect(statuses[0]).toBe(204);
    expect(statuses[1]).toBeGreaterThanOrEqual(400);
    // Exactly one of the two passwords now works.
    const signIns = await Promise.all([
      signIn(b, email, "Quarry-lantern-58-heron"),
      signIn(a, email, "Basalt-orchard-73-wren"),
    ]);
    expect(signIns.map((r) => r.status).sort()).toEqual([200, 401]);
  });

  it("send a comment's e-mail notice once", async () => {
    const lead = await signIn(a, "lead@spreadsight.test");
    const reviewer = await signIn(b, "reviewer@spreadsight.test");
    const sites = (await call(a, "GET", "/api/sites", { cookie: lead.cookie })).body as unknown as {
      id: string;
    }[];
    const name = `Mention across servers ${Date.now()}`;
    const created = await call(a, "POST", `/api/sites/${sites[0].id}/plans`, {
      cookie: lead.cookie,
      body: { name },
    });
    const commented = await call(b, "POST", `/api/plans/${created.body.id as string}/comments`, {
      cookie: reviewer.cookie,
      body: { body: "@lead is the second layer's velocity from the borehole?" },
    });
    expect(commented.status).toBe(201);
    const count = async () =>
      (
        (await a.dataSource.query(
          `SELECT COUNT(*) AS n FROM "mail_messages" WHERE "subject" = $1 AND "to" LIKE $2`,
          [`You were mentioned on ${name}`, "%lead@spreadsight.test%"],
        )) as { n: number }[]
      )[0].n;
    const deadline = Date.now() + 10_000;
    while ((await count()) === 0 && Date.now() < deadline) {
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    // Give a second copy (from the other server) every chance to arrive before counting.
    await new Promise((resolve) => setTimeout(resolve, 500));
    expect(await count()).toBe(1);
  });
});

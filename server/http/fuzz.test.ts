/**
 * Property-based fuzzing of the whole HTTP API (issue 12): arbitrary JSON bodies, query
 * strings and path parameters, with keys named like built-in object properties and hostile
 * values, sent to every route listed in docs/api.md as every role (and anonymously).
 *
 * Asserted for every answer: no 5xx; an error is `{"error":{"code","message","fields"?}}`;
 * no stack trace, source path or SQL anywhere in the answer. Seeded and bounded (fast-check
 * `seed`, `numRuns`), so a failure is reproducible and the run stays well under a minute.
 */
import { readFileSync } from "node:fs";
import fc from "fast-check";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ROLES, type Role } from "@/contracts/common";
import {
  createTestContext,
  PUBLIC_URL,
  seedTeam,
  signIn,
  type TestContext,
  type TestTeam,
} from "../testing/harness";

interface Route {
  method: "get" | "post" | "put" | "patch" | "delete";
  path: string;
}

/** Every route of the "Routes at a glance" table of docs/api.md. */
function documentedRoutes(): Route[] {
  const text = readFileSync("docs/api.md", "utf8");
  const routes: Route[] = [];
  for (const match of text.matchAll(/^\| `(GET|POST|PUT|PATCH|DELETE) (\/api\/[^`?\s]+)/gm)) {
    routes.push({ method: match[1].toLowerCase() as Route["method"], path: match[2] });
  }
  return routes;
}

const HOSTILE_KEYS = [
  "__proto__",
  "constructor",
  "prototype",
  "toString",
  "hasOwnProperty",
  "valueOf",
  "isPrototypeOf",
  "__defineGetter__",
  "then",
  "length",
];
const USEFUL_KEYS = [
  "email",
  "password",
  "name",
  "role",
  "units",
  "document",
  "message",
  "body",
  "archived",
  "limit",
  "kind",
  "from",
  "to",
  "picks",
  "status",
  "note",
  "anchor",
  "resolved",
  "description",
  "expectedRevision",
];
const HOSTILE_STRINGS = [
  "",
  "__proto__",
  "constructor",
  "' OR 1=1 --",
  '"; DROP TABLE users; --',
  "%00",
  "\u0000",
  "../../etc/passwd",
  "<script>alert(1)</script>",
  "NaN",
  "Infinity",
  "-1",
  "1e309",
  "9007199254740993",
  "𝒳".repeat(50),
  "x".repeat(5000),
  "[object Object]",
  "true",
  "null",
];

const key = fc.oneof(
  fc.constantFrom(...HOSTILE_KEYS),
  fc.constantFrom(...USEFUL_KEYS),
  fc.string({ maxLength: 12 }),
);
const leaf = fc.oneof(
  fc.constantFrom(...HOSTILE_STRINGS),
  fc.string({ maxLength: 40 }),
  fc.integer(),
  fc.double(),
  fc.boolean(),
  fc.constant(null),
);

/** A JSON value whose objects may carry hostile keys, written as text (so "__proto__" is a
 * plain key in the body, as an attacker would send it). */
const jsonText: fc.Arbitrary<string> = fc.letrec<{ value: string }>((tie) => ({
  value: fc.oneof(
    { depthSize: "small", withCrossShrink: true },
    leaf.map((v) => JSON.stringify(v) ?? "null"),
    fc.array(tie("value"), { maxLength: 4 }).map((items) => `[${items.join(",")}]`),
    fc
      .array(fc.tuple(key, tie("value")), { maxLength: 5 })
      .map((entries) => `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${v}`).join(",")}}`),
  ),
})).value;

const queryString = fc
  .array(
    fc.tuple(key, fc.oneof(fc.constantFrom(...HOSTILE_STRINGS), fc.string({ maxLength: 20 }))),
    {
      maxLength: 4,
    },
  )
  .map((pairs) => new URLSearchParams(pairs).toString());

const STACK = /\n\s+at\s|\bat [\w.<>]+ \(|node_modules|\.ts:\d+|\.js:\d+/;
const SQL =
  /SQLITE_|QueryFailedError|syntax error|\b(SELECT|INSERT|UPDATE)\b[^"]*\b(FROM|INTO|SET|WHERE)\b|\bpg_|duplicate key/i;

let ctx: TestContext;
let team: TestTeam;
const cookies = new Map<Role | "anonymous", string | null>();
let planId: string;

beforeAll(async () => {
  ctx = await createTestContext();
  team = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
  cookies.set("anonymous", null);
  for (const role of ROLES) cookies.set(role, await signIn(ctx.app, `${role}@alder.test`));
  const document = JSON.parse(readFileSync("docs/examples/two-layer-simple.json", "utf8"));
  const created = await request(ctx.app)
    .post(`/api/sites/${team.sites.active}/plans`)
    .set("Origin", PUBLIC_URL)
    .set("Cookie", cookies.get("lead")!)
    .send({ name: "Fuzzed line", document });
  expect(created.status).toBe(201);
  planId = created.body.id;
}, 30_000);
afterAll(async () => {
  await ctx.locals.drain();
  await ctx.close();
});

/** A value for a path parameter: a real id, a random UUID, or something hostile. */
function paramValue(name: string, choice: number, hostile: string): string {
  if (choice === 0) return encodeURIComponent(hostile);
  if (choice === 1) return "00000000-0000-4000-8000-000000000000";
  switch (name) {
    case "id":
      return planId;
    case "siteId":
      return team.sites.active;
    case "token":
      return "a".repeat(32);
    case "n":
      return "1";
    default:
      // :userId and the rest: a random UUID, so no member is ever removed by the fuzzer.
      return "00000000-0000-4000-8000-000000000001";
  }
}

describe("the API under arbitrary input", () => {
  const routes = documentedRoutes();

  it("lists every route of docs/api.md (the table is the fuzzer's source)", () => {
    expect(routes.length).toBeGreaterThanOrEqual(57);
  });

  it("never answers 5xx, always in the error shape, never with a stack or SQL", async () => {
    const who = fc.constantFrom<Role | "anonymous">("anonymous", ...ROLES);
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...routes),
        who,
        jsonText,
        queryString,
        fc.integer({ min: 0, max: 3 }),
        fc.constantFrom(...HOSTILE_STRINGS, ...HOSTILE_KEYS),
        async (route, role, body, query, paramChoice, hostile) => {
          const path = route.path.replace(/:(\w+)/g, (_, name: string) =>
            paramValue(name, paramChoice, hostile),
          );
          const url = query ? `${path}?${query}` : path;
          // Signing out would end the role's session for the rest of the run.
          const cookie = route.path === "/api/auth/sign-out" ? null : cookies.get(role);
          let test = request(ctx.app)[route.method](url).set("Origin", PUBLIC_URL);
          if (cookie) test = test.set("Cookie", cookie);
          if (route.method !== "get" && route.method !== "delete") {
            test = test.set("Content-Type", "application/json").send(body);
          }
          const response = await test;
          const text = response.text ?? "";
          const label = `${route.method.toUpperCase()} ${url.slice(0, 300)} as ${role} with ${body.slice(0, 200)}`;
          expect(response.status, label).toBeLessThan(500);
          expect(text, label).not.toMatch(STACK);
          expect(text, label).not.toMatch(SQL);
          if (response.status >= 400) {
            const error = response.body?.error;
            expect(typeof error?.code, label).toBe("string");
            expect(typeof error?.message, label).toBe("string");
            expect(Object.keys(response.body), label).toEqual(["error"]);
            if (error.fields !== undefined) {
              for (const messages of Object.values(error.fields as Record<string, unknown>)) {
                expect(Array.isArray(messages), label).toBe(true);
              }
            }
          }
        },
      ),
      { seed: 20261202, numRuns: 700, endOnFailure: true },
    );
  }, 90_000);
});

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import {
  client,
  countRows,
  createTestContext,
  PUBLIC_URL,
  seedTeam,
  signIn,
  type TestContext,
  type TestTeam,
} from "../testing/harness";

let ctx: TestContext;
let team: TestTeam;
let lead: string;
let admin: string;

beforeAll(async () => {
  ctx = await createTestContext();
  team = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
  lead = await signIn(ctx.app, "lead@alder.test");
  admin = await signIn(ctx.app, "admin@alder.test");
});
afterAll(() => ctx.close());

/** Sends a raw body as the lead with our Origin. */
function raw(
  method: "post" | "patch" | "put",
  url: string,
  body: string,
  type = "application/json",
) {
  const agent = request(ctx.app);
  return agent[method](url)
    .set("Origin", PUBLIC_URL)
    .set("Cookie", lead)
    .set("Content-Type", type)
    .send(body);
}

interface BadCase {
  name: string;
  send: () => ReturnType<typeof raw>;
  status: number;
  code: string;
  fields?: Record<string, string[]>;
}

const cases: BadCase[] = [
  {
    name: "malformed JSON",
    send: () => raw("post", "/api/sites", '{"name": "Broken",'),
    status: 400,
    code: "malformed_json",
  },
  {
    name: "a JSON string instead of an object",
    send: () => raw("post", "/api/sites", '"just a string"'),
    status: 400,
    code: "malformed_json",
  },
  {
    name: "a JSON array instead of an object",
    send: () => raw("post", "/api/sites", "[1,2,3]"),
    status: 400,
    code: "invalid_input",
  },
  {
    name: "a wrong type",
    send: () => raw("post", "/api/sites", JSON.stringify({ name: 42 })),
    status: 400,
    code: "invalid_input",
    fields: { name: ["Invalid input: expected string, received number"] },
  },
  {
    name: "an unknown field",
    send: () => raw("post", "/api/sites", JSON.stringify({ name: "Fine", owner: "me" })),
    status: 400,
    code: "invalid_input",
    fields: { owner: ["unknown field"] },
  },
  {
    name: "a missing required field",
    send: () => raw("post", "/api/sites", JSON.stringify({ description: "no name" })),
    status: 400,
    code: "invalid_input",
  },
  {
    name: "a blank name after trimming",
    send: () => raw("post", "/api/sites", JSON.stringify({ name: "   " })),
    status: 400,
    code: "invalid_input",
    fields: { name: ["name is required"] },
  },
  {
    name: "a too-long name",
    send: () => raw("post", "/api/sites", JSON.stringify({ name: "x".repeat(121) })),
    status: 400,
    code: "invalid_input",
    fields: { name: ["name must be at most 120 characters"] },
  },
  {
    name: "an empty update",
    send: () => raw("patch", `/api/sites/${team.sites.active}`, "{}"),
    status: 400,
    code: "invalid_input",
    fields: { root: ["nothing to change"] },
  },
  {
    name: "archived as a string",
    send: () =>
      raw("patch", `/api/sites/${team.sites.active}`, JSON.stringify({ archived: "yes" })),
    status: 400,
    code: "invalid_input",
    fields: { archived: ["archived must be true or false"] },
  },
  {
    name: "a body over 1 MB",
    send: () =>
      raw(
        "post",
        "/api/sites",
        JSON.stringify({ name: "Huge", description: "x".repeat(1_100_000) }),
      ),
    status: 413,
    code: "payload_too_large",
  },
  {
    name: "a form-encoded body",
    send: () => raw("post", "/api/sites", "name=Sneaky", "application/x-www-form-urlencoded"),
    status: 415,
    code: "unsupported_media_type",
  },
  {
    name: "a bad UUID in the path",
    send: () => raw("patch", "/api/sites/not-a-uuid", JSON.stringify({ name: "X" })),
    status: 400,
    code: "invalid_input",
    fields: { id: ["id must be a UUID"] },
  },
  {
    name: "a bad user id in the path",
    send: () =>
      request(ctx.app)
        .patch("/api/team/members/12345")
        .set("Origin", PUBLIC_URL)
        .set("Cookie", admin)
        .send({ role: "lead" }),
    status: 400,
    code: "invalid_input",
    fields: { userId: ["userId must be a UUID"] },
  },
  {
    name: "an unknown role",
    send: () =>
      request(ctx.app)
        .patch(`/api/team/members/${team.users.trainee.id}`)
        .set("Origin", PUBLIC_URL)
        .set("Cookie", admin)
        .send({ role: "overlord" }),
    status: 400,
    code: "invalid_input",
    fields: { role: ["role must be admin, lead, reviewer or trainee"] },
  },
  {
    name: "a well-formed but unknown site id",
    send: () =>
      raw(
        "patch",
        "/api/sites/00000000-0000-4000-8000-000000000000",
        JSON.stringify({ name: "X" }),
      ),
    status: 404,
    code: "not_found",
  },
];

describe("bad input is refused with a 4xx JSON error and writes nothing", () => {
  for (const c of cases) {
    it(`${c.name} → ${c.status} ${c.code}`, async () => {
      const before = await countRows(ctx.dataSource);
      const response = await c.send();
      expect(response.status).toBe(c.status);
      expect(response.headers["content-type"]).toMatch(/application\/json/);
      expect(response.body.error.code).toBe(c.code);
      expect(typeof response.body.error.message).toBe("string");
      if (c.fields) expect(response.body.error.fields).toEqual(c.fields);
      expect(await countRows(ctx.dataSource)).toEqual(before);
    });
  }
});

describe("bad query strings", () => {
  it.each([
    ["/api/sites?archived=maybe", "archived"],
    ["/api/sites?archived=true&archived=false", "archived"],
    ["/api/sites?colour=red", "colour"],
    ["/api/audit?limit=0", "limit"],
    ["/api/audit?limit=abc", "limit"],
    ["/api/audit?limit=2.5", "limit"],
    ["/api/audit?limit=100000", "limit"],
  ])("%s → 400 naming %s", async (url, field) => {
    const response = await client(ctx.app, admin).get(url);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("invalid_input");
    expect(Object.keys(response.body.error.fields)).toEqual([field]);
  });

  it("accepts a valid limit and returns at most that many events", async () => {
    const response = await client(ctx.app, admin).get("/api/audit?limit=1");
    expect(response.status).toBe(200);
    expect(response.body).toHaveLength(1);
  });
});

describe("unknown routes", () => {
  it.each(["/api/nothing-here", "/api/sites/x/y/z", "/api"])("GET %s → 404 JSON", async (url) => {
    const response = await client(ctx.app, lead).get(url);
    expect(response.status).toBe(404);
    expect(response.headers["content-type"]).toMatch(/application\/json/);
    expect(response.body.error.code).toBe("not_found");
  });

  it("an unsupported method on a known path is a 404 JSON too", async () => {
    const response = await client(ctx.app, lead).delete(`/api/sites/${team.sites.active}`);
    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe("not_found");
  });
});

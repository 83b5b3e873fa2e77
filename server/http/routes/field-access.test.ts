// Role × route matrix of the field-check and export routes (design.md role table: lead and
// admin upload and edit; reviewer reads and exports; a trainee changes and exports only their
// own sandbox plan; another team's plan is 404).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import type { Response } from "supertest";
import { ROLES, type Role } from "@/contracts/common";
import type { PlanInput } from "@engine";
import {
  client,
  createTestContext,
  seedTeam,
  type TestContext,
  type TestTeam,
} from "../../testing/harness";
import { createPlan, signInTeam, type Api, type TeamApis } from "../../testing/plans";

type Caller = Role | "anonymous" | "other team";
const CALLERS: Caller[] = ["anonymous", ...ROLES, "other team"];

let ctx: TestContext;
let alder: TestTeam;
let apis: TeamApis;
let birchLead: Api;
let anonymous: Api;
let teamPlan: string;
let sandboxPlan: string;
let teamFile: string;
let sandboxFile: string;

const document = JSON.parse(
  readFileSync("docs/examples/two-layer-simple.json", "utf8"),
) as PlanInput;
const picksCsv = Buffer.from("shot_m,geophone_m,time_ms\n-1,0,2\n-1,2,5.5\n");

const api = (caller: Caller): Api =>
  caller === "anonymous" ? anonymous : caller === "other team" ? birchLead : apis[caller];

async function uploadAs(who: Api, planId: string): Promise<Response> {
  return who
    .post(`/api/plans/${planId}/attachments`)
    .field("kind", "picks")
    .attach("file", picksCsv, "picks.csv");
}

beforeAll(async () => {
  ctx = await createTestContext();
  alder = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
  const birch = await seedTeam(ctx.dataSource, "Birch Test Surveys", "birch");
  apis = await signInTeam(ctx.app, alder);
  birchLead = (await signInTeam(ctx.app, birch)).lead;
  anonymous = client(ctx.app);
  teamPlan = (await createPlan(apis.lead, alder.sites.active, "Team line", document)).id;
  sandboxPlan = (await createPlan(apis.trainee, alder.sites.active, "My try", document)).id;
  teamFile = (await uploadAs(apis.lead, teamPlan)).body.attachment.id;
  sandboxFile = (await uploadAs(apis.trainee, sandboxPlan)).body.attachment.id;
}, 60_000);
afterAll(() => ctx.close());

interface Row {
  route: string;
  call: (who: Api) => Promise<Response> | PromiseLike<Response>;
  expect: Record<Caller, number>;
}

const statuses = (values: Partial<Record<Caller, number>>, rest: number) =>
  Object.fromEntries(CALLERS.map((c) => [c, values[c] ?? rest])) as Record<Caller, number>;
const picks = { picks: [{ sourcePosition: -1, receiverPosition: 0, time: 0.002 }] };

const rows: Row[] = [
  {
    route: "POST /api/plans/:id/attachments (team plan)",
    call: (who) => uploadAs(who, teamPlan),
    expect: statuses({ anonymous: 401, admin: 201, lead: 201, "other team": 404 }, 403),
  },
  {
    route: "POST /api/plans/:id/attachments (trainee's sandbox plan)",
    call: (who) => uploadAs(who, sandboxPlan),
    expect: statuses({ anonymous: 401, trainee: 201, lead: 404, "other team": 404 }, 403),
  },
  {
    route: "GET /api/plans/:id/attachments (team plan)",
    call: (who) => who.get(`/api/plans/${teamPlan}/attachments`),
    expect: statuses({ anonymous: 401, "other team": 404 }, 200),
  },
  {
    route: "GET /api/plans/:id/attachments (sandbox plan)",
    call: (who) => who.get(`/api/plans/${sandboxPlan}/attachments`),
    expect: statuses({ anonymous: 401, lead: 404, "other team": 404 }, 200),
  },
  {
    route: "GET /api/attachments/:id/content (team plan)",
    call: (who) => who.get(`/api/attachments/${teamFile}/content`),
    expect: statuses({ anonymous: 401, "other team": 404 }, 200),
  },
  {
    route: "GET /api/attachments/:id/content (sandbox plan)",
    call: (who) => who.get(`/api/attachments/${sandboxFile}/content`),
    expect: statuses({ anonymous: 401, lead: 404, "other team": 404 }, 200),
  },
  {
    route: "DELETE /api/attachments/:id (team plan)",
    call: async (who) => {
      const fresh = (await uploadAs(apis.lead, teamPlan)).body.attachment.id as string;
      return who.delete(`/api/attachments/${fresh}`);
    },
    expect: statuses({ anonymous: 401, admin: 204, lead: 204, "other team": 404 }, 403),
  },
  {
    route: "DELETE /api/attachments/:id (sandbox plan)",
    call: async (who) => {
      const fresh = (await uploadAs(apis.trainee, sandboxPlan)).body.attachment.id as string;
      return who.delete(`/api/attachments/${fresh}`);
    },
    expect: statuses({ anonymous: 401, trainee: 204, lead: 404, "other team": 404 }, 403),
  },
  {
    route: "PUT /api/plans/:id/picks (team plan)",
    call: (who) => who.put(`/api/plans/${teamPlan}/picks`).send(picks),
    expect: statuses({ anonymous: 401, admin: 200, lead: 200, "other team": 404 }, 403),
  },
  {
    route: "PUT /api/plans/:id/picks (sandbox plan)",
    call: (who) => who.put(`/api/plans/${sandboxPlan}/picks`).send(picks),
    expect: statuses({ anonymous: 401, trainee: 200, lead: 404, "other team": 404 }, 403),
  },
  {
    route: "GET /api/plans/:id/picks (team plan)",
    call: (who) => who.get(`/api/plans/${teamPlan}/picks`),
    expect: statuses({ anonymous: 401, "other team": 404 }, 200),
  },
  {
    route: "GET /api/plans/:id/report.pdf (team plan)",
    call: (who) => who.get(`/api/plans/${teamPlan}/report.pdf`),
    expect: statuses({ anonymous: 401, trainee: 403, "other team": 404 }, 200),
  },
  {
    route: "GET /api/plans/:id/report.pdf (sandbox plan)",
    call: (who) => who.get(`/api/plans/${sandboxPlan}/report.pdf`),
    expect: statuses({ anonymous: 401, lead: 404, "other team": 404 }, 200),
  },
  {
    route: "GET /api/plans/:id/stations.csv (team plan)",
    call: (who) => who.get(`/api/plans/${teamPlan}/stations.csv`),
    expect: statuses({ anonymous: 401, trainee: 403, "other team": 404 }, 200),
  },
  {
    route: "GET /api/plans/:id/export.json (team plan)",
    call: (who) => who.get(`/api/plans/${teamPlan}/export.json`),
    expect: statuses({ anonymous: 401, trainee: 403, "other team": 404 }, 200),
  },
  {
    route: "GET /api/plans/:id/export.json (sandbox plan)",
    call: (who) => who.get(`/api/plans/${sandboxPlan}/export.json`),
    expect: statuses({ anonymous: 401, lead: 404, "other team": 404 }, 200),
  },
  {
    route: "POST /api/sites/:siteId/plans/import",
    call: (who) => who.post(`/api/sites/${alder.sites.active}/plans/import`).send(document),
    expect: statuses({ anonymous: 401, reviewer: 403, "other team": 404 }, 201),
  },
];

describe("field and export routes by role", () => {
  for (const row of rows) {
    it(`${row.route}: ${CALLERS.map((c) => `${c} ${row.expect[c]}`).join(", ")}`, async () => {
      const got: Record<string, number> = {};
      for (const caller of CALLERS) got[caller] = (await row.call(api(caller))).status;
      expect(got).toEqual(row.expect);
    });
  }

  it("lands a trainee's import in their sandbox", async () => {
    const response = await apis.trainee
      .post(`/api/sites/${alder.sites.active}/plans/import`)
      .send({ ...document, name: "Imported try" });
    expect(response.status).toBe(201);
    expect(response.body.sandbox).toBe(true);
  });
});

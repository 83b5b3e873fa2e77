/**
 * Role × action matrix for every plan and review route (design.md role table), the sandbox
 * visibility rule, and cross-team attempts. A refused request must write nothing.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Test } from "supertest";
import { ROLES, type Role } from "@/contracts/common";
import type { PlanDetail } from "@/contracts/plans";
import { notificationMailSettled } from "../domain/notifications";
import {
  client,
  createTestContext,
  seedTeam,
  type TestContext,
  type TestTeam,
} from "../testing/harness";
import {
  countPlanRows,
  createPlan,
  signInTeam,
  thinLayerDocument,
  type Api,
  type TeamApis,
} from "../testing/plans";

type Caller = Role | "anonymous";
const CALLERS: Caller[] = ["anonymous", ...ROLES];

let ctx: TestContext;
let alder: TestTeam;
let birch: TestTeam;
let api: TeamApis;
let birchApi: TeamApis;
let adminNotification: string;

beforeAll(async () => {
  ctx = await createTestContext();
  alder = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
  birch = await seedTeam(ctx.dataSource, "Birch Test Surveys", "birch");
  api = await signInTeam(ctx.app, alder);
  birchApi = await signInTeam(ctx.app, birch);
  const plan = await createPlan(api.lead, alder.sites.active, "Notification source");
  await api.lead.post(`/api/plans/${plan.id}/submit`).send({});
  const inbox = await api.admin.get("/api/notifications");
  adminNotification = inbox.body[0].id;
});
afterAll(async () => {
  await notificationMailSettled(ctx.dataSource);
  await ctx.close();
});

/** Everything a row may need: a plan in some state, a thread on it. */
interface Fixture {
  plan: PlanDetail;
  threadId?: string;
}

type Setup = () => Promise<Fixture>;

const teamPlan =
  (state: "draft" | "in-review" | "approved" = "draft"): Setup =>
  async () => {
    const plan = await createPlan(api.lead, alder.sites.active, "Matrix plan");
    if (state !== "draft") await api.lead.post(`/api/plans/${plan.id}/submit`).send({});
    if (state === "approved") await api.reviewer.post(`/api/plans/${plan.id}/approve`).send({});
    return { plan };
  };

const sandboxPlan: Setup = async () => ({
  plan: await createPlan(api.trainee, alder.sites.active, "Trainee scenario"),
});

/** A thread by the reviewer on a plan written by the admin (so the lead is neither). */
const threadOnAdminPlan: Setup = async () => {
  const plan = await createPlan(api.admin, alder.sites.active, "Admin plan");
  const thread = await api.reviewer
    .post(`/api/plans/${plan.id}/comments`)
    .send({ body: "Why 4 m?" });
  return { plan, threadId: thread.body.id };
};

interface Row {
  route: string;
  setup: Setup;
  /** Reuse one fixture for every caller (read-only calls). */
  shared?: boolean;
  call: (a: Api, f: Fixture, caller: Caller) => Test;
  expect: Record<Caller, number>;
}

const expectFor = (
  anonymous: number,
  admin: number,
  lead: number,
  reviewer: number,
  trainee: number,
): Record<Caller, number> => ({ anonymous, admin, lead, reviewer, trainee });

const doc = thinLayerDocument();
const save = (a: Api, f: Fixture) =>
  a.put(`/api/plans/${f.plan.id}`).send({ baseRevision: f.plan.revision, document: doc });

// design.md: admin = lead + team; lead creates/edits/submits; reviewer reads, comments and
// decides but never edits; trainee reads team plans, edits only their own sandbox, cannot
// submit, decide or (Spreadsight's `can.comment`) comment on team plans; they may comment on
// their own sandbox scenario (`mayCommentOn`).
const matrix: Row[] = [
  {
    route: "GET /api/sites/:siteId/plans",
    setup: teamPlan(),
    shared: true,
    call: (a) => a.get(`/api/sites/${alder.sites.active}/plans`),
    expect: expectFor(401, 200, 200, 200, 200),
  },
  {
    route: "POST /api/sites/:siteId/plans",
    setup: async () => ({}) as Fixture,
    shared: true,
    call: (a, _f, caller) =>
      a.post(`/api/sites/${alder.sites.active}/plans`).send({ name: `By ${caller}` }),
    expect: expectFor(401, 201, 201, 403, 201),
  },
  {
    route: "GET /api/plans/:id",
    setup: teamPlan(),
    shared: true,
    call: (a, f) => a.get(`/api/plans/${f.plan.id}`),
    expect: expectFor(401, 200, 200, 200, 200),
  },
  {
    route: "PUT /api/plans/:id",
    setup: teamPlan(),
    call: save,
    expect: expectFor(401, 200, 200, 403, 403),
  },
  {
    route: "PATCH /api/plans/:id (rename)",
    setup: teamPlan(),
    call: (a, f) => a.patch(`/api/plans/${f.plan.id}`).send({ name: "Renamed" }),
    expect: expectFor(401, 200, 200, 403, 403),
  },
  {
    route: "PATCH /api/plans/:id (archive)",
    setup: teamPlan(),
    call: (a, f) => a.patch(`/api/plans/${f.plan.id}`).send({ archived: true }),
    expect: expectFor(401, 200, 200, 403, 403),
  },
  {
    route: "POST /api/plans/:id/duplicate",
    setup: teamPlan(),
    shared: true,
    call: (a, f) => a.post(`/api/plans/${f.plan.id}/duplicate`).send({}),
    expect: expectFor(401, 201, 201, 403, 201),
  },
  {
    route: "GET /api/plans/:id/revisions",
    setup: teamPlan(),
    shared: true,
    call: (a, f) => a.get(`/api/plans/${f.plan.id}/revisions`),
    expect: expectFor(401, 200, 200, 200, 200),
  },
  {
    route: "GET /api/plans/:id/revisions/:n",
    setup: teamPlan(),
    shared: true,
    call: (a, f) => a.get(`/api/plans/${f.plan.id}/revisions/1`),
    expect: expectFor(401, 200, 200, 200, 200),
  },
  {
    route: "GET /api/plans/:id/diff",
    setup: teamPlan(),
    shared: true,
    call: (a, f) => a.get(`/api/plans/${f.plan.id}/diff?from=1&to=1`),
    expect: expectFor(401, 200, 200, 200, 200),
  },
  {
    route: "POST /api/plans/:id/submit",
    setup: teamPlan(),
    call: (a, f) => a.post(`/api/plans/${f.plan.id}/submit`).send({}),
    expect: expectFor(401, 200, 200, 403, 403),
  },
  {
    route: "POST /api/plans/:id/approve",
    setup: teamPlan("in-review"),
    call: (a, f) => a.post(`/api/plans/${f.plan.id}/approve`).send({ note: "fine" }),
    expect: expectFor(401, 200, 403, 200, 403),
  },
  {
    route: "POST /api/plans/:id/request-changes",
    setup: teamPlan("in-review"),
    call: (a, f) =>
      a.post(`/api/plans/${f.plan.id}/request-changes`).send({ note: "add a centre shot" }),
    expect: expectFor(401, 200, 403, 200, 403),
  },
  {
    route: "POST /api/plans/:id/reopen",
    setup: teamPlan("approved"),
    call: (a, f) => a.post(`/api/plans/${f.plan.id}/reopen`).send({}),
    expect: expectFor(401, 200, 200, 403, 403),
  },
  {
    route: "GET /api/plans/:id/comments",
    setup: threadOnAdminPlan,
    shared: true,
    call: (a, f) => a.get(`/api/plans/${f.plan.id}/comments`),
    expect: expectFor(401, 200, 200, 200, 200),
  },
  {
    route: "POST /api/plans/:id/comments",
    setup: teamPlan(),
    shared: true,
    call: (a, f) => a.post(`/api/plans/${f.plan.id}/comments`).send({ body: "Looks thin." }),
    expect: expectFor(401, 201, 201, 201, 403),
  },
  {
    // The lead is neither the thread's author nor the plan's: only admin and reviewer may.
    route: "PATCH /api/comments/:id",
    setup: threadOnAdminPlan,
    call: (a, f) => a.patch(`/api/comments/${f.threadId}`).send({ resolved: true }),
    expect: expectFor(401, 200, 403, 200, 403),
  },
  {
    route: "GET /api/plans/:id/activity",
    setup: teamPlan(),
    shared: true,
    call: (a, f) => a.get(`/api/plans/${f.plan.id}/activity`),
    expect: expectFor(401, 200, 200, 200, 200),
  },
  {
    route: "GET /api/plans/:id/activity.csv",
    setup: teamPlan(),
    shared: true,
    call: (a, f) => a.get(`/api/plans/${f.plan.id}/activity.csv`),
    expect: expectFor(401, 200, 200, 200, 200),
  },
  {
    route: "GET /api/audit.csv",
    setup: async () => ({}) as Fixture,
    shared: true,
    call: (a) => a.get("/api/audit.csv"),
    expect: expectFor(401, 200, 200, 200, 403),
  },
  {
    route: "GET /api/notifications",
    setup: async () => ({}) as Fixture,
    shared: true,
    call: (a) => a.get("/api/notifications?unread=true"),
    expect: expectFor(401, 200, 200, 200, 200),
  },
  {
    route: "POST /api/notifications/read-all",
    setup: async () => ({}) as Fixture,
    shared: true,
    call: (a) => a.post("/api/notifications/read-all").send({}),
    expect: expectFor(401, 200, 200, 200, 200),
  },
  {
    // The admin's own notification: everyone else gets 404.
    route: "POST /api/notifications/:id/read",
    setup: async () => ({}) as Fixture,
    shared: true,
    call: (a) => a.post(`/api/notifications/${adminNotification}/read`).send({}),
    expect: expectFor(401, 200, 404, 404, 404),
  },
  {
    route: "GET /api/me/notification-settings",
    setup: async () => ({}) as Fixture,
    shared: true,
    call: (a) => a.get("/api/me/notification-settings"),
    expect: expectFor(401, 200, 200, 200, 200),
  },
  {
    route: "PUT /api/me/notification-settings",
    setup: async () => ({}) as Fixture,
    shared: true,
    call: (a) =>
      a
        .put("/api/me/notification-settings")
        .send({ submitted: true, decision: true, mention: true, reply: true }),
    expect: expectFor(401, 200, 200, 200, 200),
  },
  // A trainee's sandbox plan: the author edits; admins and reviewers read (and comment);
  // leads and other trainees do not see it.
  {
    route: "GET /api/plans/:id (sandbox)",
    setup: sandboxPlan,
    shared: true,
    call: (a, f) => a.get(`/api/plans/${f.plan.id}`),
    expect: expectFor(401, 200, 404, 200, 200),
  },
  {
    route: "PUT /api/plans/:id (sandbox)",
    setup: sandboxPlan,
    call: save,
    expect: expectFor(401, 403, 404, 403, 200),
  },
  {
    route: "PATCH /api/plans/:id (sandbox rename)",
    setup: sandboxPlan,
    call: (a, f) => a.patch(`/api/plans/${f.plan.id}`).send({ name: "My scenario" }),
    expect: expectFor(401, 403, 404, 403, 200),
  },
  {
    route: "POST /api/plans/:id/duplicate (sandbox)",
    setup: sandboxPlan,
    shared: true,
    call: (a, f) => a.post(`/api/plans/${f.plan.id}/duplicate`).send({}),
    expect: expectFor(401, 201, 404, 403, 201),
  },
  {
    route: "POST /api/plans/:id/submit (sandbox)",
    setup: sandboxPlan,
    call: (a, f) => a.post(`/api/plans/${f.plan.id}/submit`).send({}),
    expect: expectFor(401, 403, 404, 403, 403),
  },
  {
    route: "POST /api/plans/:id/comments (sandbox)",
    setup: sandboxPlan,
    shared: true,
    call: (a, f) => a.post(`/api/plans/${f.plan.id}/comments`).send({ body: "Try 2 m spacing." }),
    // The trainee is this scenario's author: they may ask a reviewer a question (issue 14).
    expect: expectFor(401, 201, 404, 201, 201),
  },
  {
    route: "GET /api/plans/:id/activity (sandbox)",
    setup: sandboxPlan,
    shared: true,
    call: (a, f) => a.get(`/api/plans/${f.plan.id}/activity`),
    expect: expectFor(401, 200, 404, 200, 200),
  },
];

const anonymous = () => client(ctx.app);

describe("plan and review routes: role × action matrix", () => {
  for (const row of matrix) {
    let shared: Promise<Fixture> | null = null;
    for (const caller of CALLERS) {
      it(`${row.route} as ${caller} → ${row.expect[caller]}`, async () => {
        const fixture = await (row.shared ? (shared ??= row.setup()) : row.setup());
        const before = await countPlanRows(ctx.dataSource);
        const response = await row.call(
          caller === "anonymous" ? anonymous() : api[caller],
          fixture,
          caller,
        );
        expect(response.status, JSON.stringify(response.body)).toBe(row.expect[caller]);
        if (response.status >= 400) {
          expect(response.body.error.code).toBe(
            { 401: "unauthenticated", 403: "forbidden", 404: "not_found" }[response.status],
          );
          expect(await countPlanRows(ctx.dataSource)).toEqual(before);
        }
      });
    }
  }
});

it("the matrix covers every plan and review route", () => {
  const covered = new Set(matrix.map((r) => r.route.split(" (")[0]));
  const routes = [
    "GET /api/sites/:siteId/plans",
    "POST /api/sites/:siteId/plans",
    "GET /api/plans/:id",
    "PUT /api/plans/:id",
    "PATCH /api/plans/:id",
    "POST /api/plans/:id/duplicate",
    "GET /api/plans/:id/revisions",
    "GET /api/plans/:id/revisions/:n",
    "GET /api/plans/:id/diff",
    "POST /api/plans/:id/submit",
    "POST /api/plans/:id/approve",
    "POST /api/plans/:id/request-changes",
    "POST /api/plans/:id/reopen",
    "GET /api/plans/:id/comments",
    "POST /api/plans/:id/comments",
    "PATCH /api/comments/:id",
    "GET /api/plans/:id/activity",
    "GET /api/plans/:id/activity.csv",
    "GET /api/audit.csv",
    "GET /api/notifications",
    "POST /api/notifications/read-all",
    "POST /api/notifications/:id/read",
    "GET /api/me/notification-settings",
    "PUT /api/me/notification-settings",
  ];
  expect([...covered].sort()).toEqual([...routes].sort());
});

describe("cross-team attempts", () => {
  let plan: PlanDetail;
  let threadId: string;
  beforeAll(async () => {
    plan = await createPlan(api.lead, alder.sites.active, "Alder only");
    await api.lead.put(`/api/plans/${plan.id}`).send({ baseRevision: 1, document: doc });
    const thread = await api.reviewer.post(`/api/plans/${plan.id}/comments`).send({ body: "Hm." });
    threadId = thread.body.id;
  });

  const calls: [string, (a: Api) => Test][] = [
    ["GET plans of the site", (a) => a.get(`/api/sites/${alder.sites.active}/plans`)],
    [
      "POST a plan on the site",
      (a) => a.post(`/api/sites/${alder.sites.active}/plans`).send({ name: "x" }),
    ],
    ["GET the plan", (a) => a.get(`/api/plans/${plan.id}`)],
    [
      "PUT the plan",
      (a) => a.put(`/api/plans/${plan.id}`).send({ baseRevision: 2, document: doc }),
    ],
    ["PATCH the plan", (a) => a.patch(`/api/plans/${plan.id}`).send({ name: "Taken" })],
    ["duplicate the plan", (a) => a.post(`/api/plans/${plan.id}/duplicate`).send({})],
    ["GET revisions", (a) => a.get(`/api/plans/${plan.id}/revisions`)],
    ["GET revision 1", (a) => a.get(`/api/plans/${plan.id}/revisions/1`)],
    ["GET the diff", (a) => a.get(`/api/plans/${plan.id}/diff?from=1&to=2`)],
    ["submit", (a) => a.post(`/api/plans/${plan.id}/submit`).send({})],
    ["approve", (a) => a.post(`/api/plans/${plan.id}/approve`).send({})],
    ["request changes", (a) => a.post(`/api/plans/${plan.id}/request-changes`).send({ note: "x" })],
    ["reopen", (a) => a.post(`/api/plans/${plan.id}/reopen`).send({})],
    ["GET comments", (a) => a.get(`/api/plans/${plan.id}/comments`)],
    ["POST a comment", (a) => a.post(`/api/plans/${plan.id}/comments`).send({ body: "x" })],
    ["resolve a thread", (a) => a.patch(`/api/comments/${threadId}`).send({ resolved: true })],
    ["GET activity", (a) => a.get(`/api/plans/${plan.id}/activity`)],
    ["GET activity.csv", (a) => a.get(`/api/plans/${plan.id}/activity.csv`)],
    ["read a notification", (a) => a.post(`/api/notifications/${adminNotification}/read`).send({})],
  ];

  for (const [name, call] of calls) {
    it(`${name} from another team's admin → 404, nothing written`, async () => {
      const before = await countPlanRows(ctx.dataSource);
      const response = await call(birchApi.admin);
      expect(response.status).toBe(404);
      expect(response.body.error.code).toBe("not_found");
      expect(await countPlanRows(ctx.dataSource)).toEqual(before);
    });
  }

  it("another team's plans never show in lists, counts, inboxes or CSV", async () => {
    for (const role of ROLES) {
      const sites = await birchApi[role].get("/api/sites?archived=all");
      expect(sites.body.map((s: { id: string }) => s.id)).not.toContain(alder.sites.active);
      const inbox = await birchApi[role].get("/api/notifications");
      expect(inbox.body).toEqual([]);
    }
    const csv = await birchApi.admin.get("/api/audit.csv");
    expect(csv.status).toBe(200);
    expect(csv.text).not.toContain(plan.id);
    expect(csv.text).not.toContain("Alder only");
  });
});

/**
 * Plans: the default document, create/save/rename/archive/duplicate, revisions and their
 * stored analysis, the 409 revision conflict, sandbox visibility and site plan counts, and
 * bad input naming the field with nothing written.
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { PlanDetail, PlanSummary, RevisionDetail } from "@/contracts/plans";
import { analyzePlan, layeredModel, parsePlan, planSchema } from "@engine";
import { Membership } from "../data/entities/membership";
import { User } from "../data/entities/user";
import { notificationMailSettled } from "../domain/notifications";
import {
  client,
  createTestContext,
  seedTeam,
  signIn,
  testPasswordHash,
  type TestContext,
  type TestTeam,
} from "../testing/harness";
import {
  countPlanRows,
  createPlan,
  saveDocument,
  signInTeam,
  thinLayerDocument,
  type Api,
  type TeamApis,
} from "../testing/plans";

let ctx: TestContext;
let team: TestTeam;
let api: TeamApis;
let secondTrainee: Api;

beforeAll(async () => {
  ctx = await createTestContext();
  team = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
  api = await signInTeam(ctx.app, team);
  const id = randomUUID();
  const now = new Date();
  await ctx.dataSource.getRepository(User).insert({
    id,
    email: "trainee2@alder.test",
    name: "Second Trainee",
    passwordHash: await testPasswordHash(),
    createdAt: now,
    updatedAt: now,
  });
  await ctx.dataSource
    .getRepository(Membership)
    .insert({ id: randomUUID(), teamId: team.id, userId: id, role: "trainee", createdAt: now });
  secondTrainee = client(ctx.app, await signIn(ctx.app, "trainee2@alder.test"));
});
afterAll(async () => {
  await notificationMailSettled(ctx.dataSource);
  await ctx.close();
});

const listIds = async (a: Api, siteId = team.sites.active, archived = "false") => {
  const response = await a.get(`/api/sites/${siteId}/plans?archived=${archived}`);
  expect(response.status).toBe(200);
  return (response.body as PlanSummary[]).map((p) => p.id);
};

describe("creating plans", () => {
  it("fills a default two-layer document with a 24-channel spread and end shots", async () => {
    const plan = await createPlan(api.lead, team.sites.active, "Default start");
    expect(plan).toMatchObject({
      name: "Default start",
      status: "draft",
      sandbox: false,
      revision: 1,
      siteId: team.sites.active,
      author: { id: team.users.lead.id, name: team.users.lead.name },
    });
    expect(planSchema.safeParse(plan.document).success).toBe(true);
    expect(parsePlan(plan.document).ok).toBe(true);
    expect(plan.document.models).toHaveLength(1);
    expect(plan.document.models[0].layers).toHaveLength(2);
    expect(plan.document.spread.channels).toBe(24);
    const { spread } = plan.document;
    const last = spread.firstGeophone + (spread.channels - 1) * spread.spacing;
    const shots = spread.shots.map((s) => s.position);
    expect(Math.min(...shots)).toBeLessThanOrEqual(spread.firstGeophone);
    expect(Math.max(...shots)).toBeGreaterThanOrEqual(last);
    // The stored verdict is the engine's, not a constant.
    expect(plan.worstVerdict).toBe(analyzePlan(plan.document).worstStatus);
    expect(plan.permissions).toMatchObject({ edit: true, submit: true, decide: false });
  });

  it("keeps a given document, named after the plan, with its engine summary", async () => {
    const doc = thinLayerDocument();
    const plan = await createPlan(api.admin, team.sites.active, "Lens check", doc);
    expect(plan.document.models[0].layers[1].thickness).toBe(1.2);
    expect(plan.document.name).toBe("Lens check");
    const revision = (await api.admin.get(`/api/plans/${plan.id}/revisions/1`))
      .body as RevisionDetail;
    const analysis = analyzePlan(planSchema.parse(doc));
    expect(revision.summary?.worstVerdict).toBe(analysis.worstStatus);
    expect(plan.worstVerdict).toBe(analysis.worstStatus);
    const model = revision.summary!.models[0];
    expect(model.refractors.map((r) => r.status)).toEqual(
      analysis.models[0].refractors.map((r) => r.status),
    );
    expect(model.refractors.map((r) => r.trueDepth)).toEqual([2.5, 3.7]);
    const interpreted = analysis.models[0].interpretation!.refractors.find((r) => r.layer === 3)!;
    const stored = model.refractors.find((r) => r.layer === 3)!;
    expect(stored.interpretedDepth).toBeCloseTo(interpreted.interpretedDepth!, 3);
    expect(stored.error).toBeCloseTo(interpreted.error!, 3);
  });

  it("puts a trainee's plan in their sandbox", async () => {
    const plan = await createPlan(api.trainee, team.sites.active, "My first scenario");
    expect(plan.sandbox).toBe(true);
    // A trainee may write notes on their own sandbox scenario (to ask a reviewer), not submit it.
    expect(plan.permissions).toMatchObject({ edit: true, submit: false, comment: true });
  });

  it("refuses a plan on another team's or an unknown site (404) and on an archived site (409)", async () => {
    const before = await countPlanRows(ctx.dataSource);
    const unknown = await api.lead.post(`/api/sites/${randomUUID()}/plans`).send({ name: "x" });
    expect(unknown.status).toBe(404);
    const archived = await api.lead
      .post(`/api/sites/${team.sites.archived}/plans`)
      .send({ name: "x" });
    expect(archived.status).toBe(409);
    expect(archived.body.error.code).toBe("site_archived");
    expect(await countPlanRows(ctx.dataSource)).toEqual(before);
  });
});

describe("sandbox visibility", () => {
  let sandbox: PlanDetail;
  let teamPlan: PlanDetail;
  beforeAll(async () => {
    sandbox = await createPlan(api.trainee, team.sites.active, "Sandbox visibility");
    teamPlan = await createPlan(api.lead, team.sites.active, "Team visibility");
  });

  it("lists a sandbox plan for its author, admins and reviewers, not for leads or other trainees", async () => {
    expect(await listIds(api.trainee)).toContain(sandbox.id);
    expect(await listIds(api.admin)).toContain(sandbox.id);
    expect(await listIds(api.reviewer)).toContain(sandbox.id);
    expect(await listIds(api.lead)).not.toContain(sandbox.id);
    expect(await listIds(secondTrainee)).not.toContain(sandbox.id);
    for (const a of [api.trainee, api.admin, api.reviewer, api.lead, secondTrainee]) {
      expect(await listIds(a)).toContain(teamPlan.id);
    }
    expect((await secondTrainee.get(`/api/plans/${sandbox.id}`)).status).toBe(404);
    expect(
      (
        await secondTrainee.put(`/api/plans/${sandbox.id}`).send({
          baseRevision: 1,
          document: thinLayerDocument(),
        })
      ).status,
    ).toBe(404);
  });

  it("shows admins and reviewers a sandbox plan read-only", async () => {
    for (const a of [api.admin, api.reviewer]) {
      const plan = (await a.get(`/api/plans/${sandbox.id}`)).body as PlanDetail;
      expect(plan.permissions).toMatchObject({ edit: false, submit: false, archive: false });
    }
  });

  it("counts only the plans the viewer can see, without archived ones", async () => {
    const site = async (a: Api) =>
      (await a.get(`/api/sites/${team.sites.active}`)).body.planCount as number;
    const visibleTo = async (a: Api) => (await listIds(a)).length;
    for (const a of [api.admin, api.lead, api.reviewer, api.trainee, secondTrainee]) {
      expect(await site(a)).toBe(await visibleTo(a));
    }
    expect(await site(api.admin)).toBeGreaterThan(await site(api.lead));
    const listed = (await api.lead.get("/api/sites")).body.find(
      (s: { id: string }) => s.id === team.sites.active,
    );
    expect(listed.planCount).toBe(await site(api.lead));
    const beforeArchive = await site(api.lead);
    await api.lead.patch(`/api/plans/${teamPlan.id}`).send({ archived: true });
    expect(await site(api.lead)).toBe(beforeArchive - 1);
    await api.lead.patch(`/api/plans/${teamPlan.id}`).send({ archived: false });
    expect(await site(api.lead)).toBe(beforeArchive);
  });
});

describe("saving revisions", () => {
  it("two saves from the same base: the first wins, the second gets 409 and nothing is lost", async () => {
    const plan = await createPlan(api.lead, team.sites.active, "Contested");
    const mine = thinLayerDocument(1.0);
    const theirs = thinLayerDocument(3.0);
    const first = await api.admin
      .put(`/api/plans/${plan.id}`)
      .send({ baseRevision: 1, document: mine, message: "admin's edit" });
    expect(first.status).toBe(200);
    expect(first.body.revision).toBe(2);

    const before = await countPlanRows(ctx.dataSource);
    const second = await api.lead
      .put(`/api/plans/${plan.id}`)
      .send({ baseRevision: 1, document: theirs, message: "lead's edit" });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe("revision_conflict");
    expect(second.body.error.message).toMatch(/reload/);
    expect(second.body.error.message).toMatch(/copy/);
    expect(second.body.error.fields.latestRevision).toEqual(["2"]);
    expect(await countPlanRows(ctx.dataSource)).toEqual(before);

    // The first save is intact…
    const latest = (await api.lead.get(`/api/plans/${plan.id}`)).body as PlanDetail;
    expect(latest.revision).toBe(2);
    expect(latest.document.models[0].layers[1].thickness).toBe(1.0);
    // …and the refused edit can still be kept: on top of the reload, or as a copy.
    const copy = await api.lead
      .post(`/api/plans/${plan.id}/duplicate`)
      .send({ name: "Lead's variant" });
    expect(copy.status).toBe(201);
    const kept = await saveDocument(api.lead, copy.body, theirs, "lead's edit");
    expect(kept.document.models[0].layers[1].thickness).toBe(3.0);
    const onTop = await saveDocument(api.lead, latest, theirs, "lead's edit after reload");
    expect(onTop.revision).toBe(3);
  });

  it("two saves racing from the same base: exactly one wins", async () => {
    const plan = await createPlan(api.lead, team.sites.active, "Race");
    const results = await Promise.all(
      [1.0, 2.0].map((h, i) =>
        (i === 0 ? api.lead : api.admin)
          .put(`/api/plans/${plan.id}`)
          .send({ baseRevision: 1, document: thinLayerDocument(h) }),
      ),
    );
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    const winner = results.find((r) => r.status === 200)!.body as PlanDetail;
    const revisions = (await api.lead.get(`/api/plans/${plan.id}/revisions`)).body;
    expect(revisions).toHaveLength(2);
    const stored = (await api.lead.get(`/api/plans/${plan.id}/revisions/2`)).body as RevisionDetail;
    expect(stored.document).toEqual(winner.document);
  });

  it("keeps every revision immutable and lists them newest first with author and message", async () => {
    const plan = await createPlan(api.lead, team.sites.active, "History");
    const r2 = await saveDocument(api.lead, plan, thinLayerDocument(1.0), "thin lens");
    await saveDocument(api.admin, r2, thinLayerDocument(4.0), "thick lens");
    const list = await api.reviewer.get(`/api/plans/${plan.id}/revisions`);
    expect(list.body.map((r: { number: number }) => r.number)).toEqual([3, 2, 1]);
    expect(list.body[0]).toMatchObject({
      author: { id: team.users.admin.id },
      message: "thick lens",
    });
    const two = (await api.reviewer.get(`/api/plans/${plan.id}/revisions/2`))
      .body as RevisionDetail;
    expect(two.document.models[0].layers[1].thickness).toBe(1.0);
    expect(two.message).toBe("thin lens");
    const missing = await api.reviewer.get(`/api/plans/${plan.id}/revisions/9`);
    expect(missing.status).toBe(404);
  });

  it("PlanSummary.worstVerdict follows the latest revision", async () => {
    const plan = await createPlan(api.lead, team.sites.active, "Verdict follows");
    const thin = await saveDocument(api.lead, plan, thinLayerDocument(0.5));
    const expectedThin = analyzePlan(planSchema.parse(thinLayerDocument(0.5))).worstStatus;
    const expectedThick = analyzePlan(planSchema.parse(thinLayerDocument(6))).worstStatus;
    expect(expectedThin).not.toBe(expectedThick);
    const summary = async () =>
      ((await api.lead.get(`/api/sites/${team.sites.active}/plans`)).body as PlanSummary[]).find(
        (p) => p.id === plan.id,
      )!;
    expect((await summary()).worstVerdict).toBe(expectedThin);
    await saveDocument(api.lead, thin, thinLayerDocument(6));
    expect((await summary()).worstVerdict).toBe(expectedThick);
  });
});

describe("rename, archive, duplicate", () => {
  it("renames and archives; archived plans leave the default list and show under archived=true", async () => {
    const plan = await createPlan(api.lead, team.sites.active, "Old name");
    const renamed = await api.lead.patch(`/api/plans/${plan.id}`).send({ name: "  New name " });
    expect(renamed.status).toBe(200);
    expect(renamed.body.name).toBe("New name");
    expect(renamed.body.revision).toBe(1);
    await api.lead.patch(`/api/plans/${plan.id}`).send({ archived: true });
    expect(await listIds(api.lead)).not.toContain(plan.id);
    expect(await listIds(api.lead, team.sites.active, "true")).toContain(plan.id);
    expect(await listIds(api.lead, team.sites.active, "all")).toContain(plan.id);
  });

  it("refuses to copy a plan onto an archived site (409 site_archived), as creating one there is refused", async () => {
    const site = await api.lead.post("/api/sites").send({ name: "Closed pit, copy check" });
    expect(site.status).toBe(201);
    const plan = await createPlan(api.lead, site.body.id, "On a site soon archived");
    expect(
      (await api.lead.patch(`/api/sites/${site.body.id}`).send({ archived: true })).status,
    ).toBe(200);
    const before = await countPlanRows(ctx.dataSource);
    const copy = await api.lead.post(`/api/plans/${plan.id}/duplicate`).send({});
    expect(copy.status).toBe(409);
    expect(copy.body.error.code).toBe("site_archived");
    expect(await countPlanRows(ctx.dataSource)).toEqual(before);
  });

  it("a trainee's copy of a team plan lands in their sandbox with the same document", async () => {
    const source = await createPlan(api.lead, team.sites.active, "Source", thinLayerDocument());
    const copy = await api.trainee.post(`/api/plans/${source.id}/duplicate`).send({});
    expect(copy.status).toBe(201);
    expect(copy.body).toMatchObject({
      name: "Copy of Source",
      sandbox: true,
      status: "draft",
      revision: 1,
      author: { id: team.users.trainee.id },
    });
    expect(copy.body.document.models).toEqual(source.document.models);
    expect(copy.body.document.spread).toEqual(source.document.spread);
    expect(await listIds(api.lead)).not.toContain(copy.body.id);
  });
});

describe("bad input: clear errors naming the field, nothing written", () => {
  let plan: PlanDetail;
  beforeAll(async () => {
    plan = await createPlan(api.lead, team.sites.active, "Target of bad input");
  });

  const cases: { name: string; send: () => ReturnType<Api["get"]>; field: string }[] = [
    {
      name: "unknown field on create",
      send: () =>
        api.lead.post(`/api/sites/${team.sites.active}/plans`).send({ name: "x", colour: "red" }),
      field: "colour",
    },
    {
      name: "missing name on create",
      send: () => api.lead.post(`/api/sites/${team.sites.active}/plans`).send({}),
      field: "name",
    },
    {
      name: "negative velocity in a document",
      send: () => {
        const doc = thinLayerDocument();
        doc.models[0].layers[0].velocity = -450;
        return api.lead
          .post(`/api/sites/${team.sites.active}/plans`)
          .send({ name: "x", document: doc });
      },
      field: "document.models.0.layers.0.velocity",
    },
    {
      name: "unknown field inside a layer",
      send: () => {
        const doc = thinLayerDocument() as { models: { layers: object[] }[] };
        doc.models[0].layers[1] = { ...doc.models[0].layers[1], density: 1.9 };
        return api.lead.put(`/api/plans/${plan.id}`).send({ baseRevision: 1, document: doc });
      },
      field: "document.models.0.layers.1.density",
    },
    {
      name: "interfaces crossing within the spread",
      send: () => {
        const doc = thinLayerDocument();
        layeredModel(doc.models[0]).layers[0].dip = 20;
        return api.lead.put(`/api/plans/${plan.id}`).send({ baseRevision: 1, document: doc });
      },
      field: "document.models.0.layers.1.dip",
    },
    {
      name: "baseRevision that is not a number",
      send: () =>
        api.lead
          .put(`/api/plans/${plan.id}`)
          .send({ baseRevision: "1", document: thinLayerDocument() }),
      field: "baseRevision",
    },
    {
      name: "a plan id that is not a UUID",
      send: () =>
        api.lead
          .put("/api/plans/not-a-uuid")
          .send({ baseRevision: 1, document: thinLayerDocument() }),
      field: "id",
    },
    {
      name: "a site id that is not a UUID",
      send: () => api.lead.post("/api/sites/42/plans").send({ name: "x" }),
      field: "siteId",
    },
    {
      name: "an unknown list filter",
      send: () => api.lead.get(`/api/sites/${team.sites.active}/plans?archived=maybe`),
      field: "archived",
    },
    {
      name: "an empty PATCH",
      send: () => api.lead.patch(`/api/plans/${plan.id}`).send({}),
      field: "root",
    },
    {
      name: "a revision number that is not a number",
      send: () => api.lead.get(`/api/plans/${plan.id}/revisions/latest`),
      field: "n",
    },
    {
      name: "a diff without `to`",
      send: () => api.lead.get(`/api/plans/${plan.id}/diff?from=1`),
      field: "to",
    },
  ];

  for (const c of cases) {
    it(`${c.name} → 400 naming ${c.field}`, async () => {
      const before = await countPlanRows(ctx.dataSource);
      const response = await c.send();
      expect(response.status).toBe(400);
      expect(response.body.error.code).toBe("invalid_input");
      expect(Object.keys(response.body.error.fields)).toContain(c.field);
      expect(response.body.error.message).toContain(c.field === "root" ? "body" : c.field);
      expect(await countPlanRows(ctx.dataSource)).toEqual(before);
    });
  }

  it("a document that is not JSON-shaped at all is refused without a crash", async () => {
    const before = await countPlanRows(ctx.dataSource);
    const response = await api.lead
      .put(`/api/plans/${plan.id}`)
      .send({ baseRevision: 1, document: { models: "two layers" } });
    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.fields)).toEqual(
      expect.arrayContaining(["document.models", "document.spread"]),
    );
    expect(await countPlanRows(ctx.dataSource)).toEqual(before);
  });
});

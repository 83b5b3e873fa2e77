/**
 * Issue 14, item 9: a trainee may ask a reviewer a question on their own sandbox scenario (and
 * only there); the team trail names the plan an event was about.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { AuditEventSummary } from "@/contracts/audit";
import type { CommentView, PlanDetail } from "@/contracts/plans";
import { notificationMailSettled } from "../domain/notifications";
import { createTestContext, seedTeam, type TestContext, type TestTeam } from "../testing/harness";
import { createPlan, signInTeam, type TeamApis } from "../testing/plans";

let ctx: TestContext;
let team: TestTeam;
let api: TeamApis;

beforeAll(async () => {
  ctx = await createTestContext();
  team = await seedTeam(ctx.dataSource, "Quillon Test Surveys", "quillon");
  api = await signInTeam(ctx.app, team);
});
afterAll(async () => {
  await notificationMailSettled(ctx.dataSource);
  await ctx.close();
});

describe("trainee questions on their own sandbox scenario", () => {
  it("a trainee comments on their own sandbox scenario and a reviewer reads and answers it", async () => {
    const sandbox: PlanDetail = await createPlan(api.trainee, team.sites.active, "My scenario");
    expect(sandbox.sandbox).toBe(true);
    expect(sandbox.permissions.comment).toBe(true);
    const asked = await api.trainee
      .post(`/api/plans/${sandbox.id}/comments`)
      .send({ body: "Is 3 m spacing fine enough for the clay lens?" });
    expect(asked.status).toBe(201);
    const answer = await api.reviewer
      .post(`/api/plans/${sandbox.id}/comments`)
      .send({ body: "Try 2 m and compare.", parentId: (asked.body as CommentView).id });
    expect(answer.status).toBe(201);
    const thread = (await api.trainee.get(`/api/plans/${sandbox.id}/comments`))
      .body as CommentView[];
    expect(thread.map((c) => c.body)).toEqual([
      "Is 3 m spacing fine enough for the clay lens?",
      "Try 2 m and compare.",
    ]);
  });

  it("a trainee still cannot comment on a team plan (403); a lead still can", async () => {
    const teamPlan: PlanDetail = await createPlan(api.lead, team.sites.active, "Team plan");
    const seen = (await api.trainee.get(`/api/plans/${teamPlan.id}`)).body as PlanDetail;
    expect(seen.permissions.comment).toBe(false);
    const refused = await api.trainee
      .post(`/api/plans/${teamPlan.id}/comments`)
      .send({ body: "Can I comment here?" });
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe("forbidden");
    // A lead comments on team plans as before.
    const lead = await api.lead.post(`/api/plans/${teamPlan.id}/comments`).send({ body: "Fine." });
    expect(lead.status).toBe(201);
  });
});

describe("the team trail names what an event was about", () => {
  it("gives the plan's name beside its id", async () => {
    const plan: PlanDetail = await createPlan(api.lead, team.sites.active, "Named in the trail");
    const events = (await api.admin.get("/api/audit?limit=50")).body as AuditEventSummary[];
    const created = events.find((e) => e.action === "plan.create" && e.targetId === plan.id);
    expect(created?.targetName).toBe("Named in the trail");
  });
});

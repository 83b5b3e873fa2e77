/**
 * The review state machine: every (status, step) pair, table-driven. Legal steps move the
 * plan; every other step is 409 `illegal_transition` naming the current status and writes
 * nothing. In-review, approved and archived plans refuse saves (409 `plan_locked`).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PLAN_STATUS_LABELS, type PlanDetail, type PlanStatus } from "@/contracts/plans";
import { notificationMailSettled } from "../domain/notifications";
import { createTestContext, seedTeam, type TestContext, type TestTeam } from "../testing/harness";
import {
  countPlanRows,
  createPlan,
  saveDocument,
  signInTeam,
  thinLayerDocument,
  type TeamApis,
} from "../testing/plans";

let ctx: TestContext;
let team: TestTeam;
let api: TeamApis;

beforeAll(async () => {
  ctx = await createTestContext();
  team = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
  api = await signInTeam(ctx.app, team);
});
afterAll(async () => {
  await notificationMailSettled(ctx.dataSource);
  await ctx.close();
});

type Step = "submit" | "approve" | "request-changes" | "reopen" | "archive" | "restore";
const STEPS: Step[] = ["submit", "approve", "request-changes", "reopen", "archive", "restore"];

/** The admin may take every step, so the table isolates the state machine from roles. */
async function planIn(status: PlanStatus | "archived-from-review"): Promise<PlanDetail> {
  const plan = await createPlan(api.admin, team.sites.active, `Plan ${status}`);
  const go = async (path: string, body: object = {}) => {
    const response = await api.admin.post(`/api/plans/${plan.id}/${path}`).send(body);
    expect(response.status).toBe(200);
  };
  if (status === "in-review" || status === "archived-from-review") await go("submit");
  if (status === "changes-requested") {
    await go("submit");
    await go("request-changes", { note: "add an off-end shot" });
  }
  if (status === "approved") {
    await go("submit");
    await go("approve");
  }
  if (status === "archived" || status === "archived-from-review") {
    const response = await api.admin.patch(`/api/plans/${plan.id}`).send({ archived: true });
    expect(response.status).toBe(200);
  }
  return (await api.admin.get(`/api/plans/${plan.id}`)).body as PlanDetail;
}

function take(plan: PlanDetail, step: Step) {
  if (step === "archive") return api.admin.patch(`/api/plans/${plan.id}`).send({ archived: true });
  if (step === "restore") return api.admin.patch(`/api/plans/${plan.id}`).send({ archived: false });
  const body = step === "request-changes" ? { note: "the clay lens needs a denser spread" } : {};
  return api.admin.post(`/api/plans/${plan.id}/${step}`).send(body);
}

// The workflow of issue 5: draft → in-review → changes-requested → in-review → approved;
// reopen approved → draft; archive from any status, restore to the status before.
// "same" = PATCH to the state it already has: accepted and nothing changes (idempotent).
const TABLE: Record<PlanStatus, Partial<Record<Step, PlanStatus | "same">>> = {
  draft: { submit: "in-review", archive: "archived", restore: "same" },
  "in-review": {
    approve: "approved",
    "request-changes": "changes-requested",
    archive: "archived",
    restore: "same",
  },
  "changes-requested": { submit: "in-review", archive: "archived", restore: "same" },
  approved: { reopen: "draft", archive: "archived", restore: "same" },
  archived: { restore: "draft", archive: "same" },
};

describe("state machine", () => {
  for (const [status, legal] of Object.entries(TABLE) as [
    PlanStatus,
    (typeof TABLE)[PlanStatus],
  ][]) {
    for (const step of STEPS) {
      const outcome = legal[step];
      const title = outcome
        ? `${step} from ${status} → ${outcome === "same" ? "unchanged" : outcome}`
        : `${step} from ${status} → 409 illegal_transition`;
      it(title, async () => {
        const plan = await planIn(status);
        const before = await countPlanRows(ctx.dataSource);
        const response = await take(plan, step);
        if (outcome) {
          expect(response.status).toBe(200);
          expect(response.body.status).toBe(outcome === "same" ? status : outcome);
          if (outcome === "same") expect(await countPlanRows(ctx.dataSource)).toEqual(before);
        } else {
          expect(response.status).toBe(409);
          expect(response.body.error.code).toBe("illegal_transition");
          expect(response.body.error.message).toContain(PLAN_STATUS_LABELS[status].toLowerCase());
          expect(await countPlanRows(ctx.dataSource)).toEqual(before);
          const after = await api.admin.get(`/api/plans/${plan.id}`);
          expect(after.body.status).toBe(status);
        }
      });
    }
  }

  it("restore returns an archived plan to the status it had (in review)", async () => {
    const plan = await planIn("archived-from-review");
    expect(plan.status).toBe("archived");
    expect(plan.statusBeforeArchive).toBe("in-review");
    const restored = await take(plan, "restore");
    expect(restored.status).toBe(200);
    expect(restored.body.status).toBe("in-review");
    expect(restored.body.statusBeforeArchive).toBeNull();
  });

  it("request-changes without a note is refused and the plan stays in review", async () => {
    const plan = await planIn("in-review");
    for (const body of [{}, { note: "   " }]) {
      const response = await api.reviewer.post(`/api/plans/${plan.id}/request-changes`).send(body);
      expect(response.status).toBe(400);
      expect(Object.keys(response.body.error.fields)).toEqual(["note"]);
    }
    expect((await api.admin.get(`/api/plans/${plan.id}`)).body.status).toBe("in-review");
  });
});

describe("read-only statuses", () => {
  const doc = thinLayerDocument();

  for (const status of ["in-review", "approved", "archived"] as const) {
    it(`saving a plan that is ${status} → 409 plan_locked, nothing written`, async () => {
      const plan = await planIn(status);
      const before = await countPlanRows(ctx.dataSource);
      const response = await api.admin
        .put(`/api/plans/${plan.id}`)
        .send({ baseRevision: plan.revision, document: doc });
      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe("plan_locked");
      expect(response.body.error.message).toMatch(/read-only/);
      expect(await countPlanRows(ctx.dataSource)).toEqual(before);
      expect(plan.permissions.edit).toBe(false);
    });
  }

  for (const status of ["draft", "changes-requested"] as const) {
    it(`saving a plan that is ${status} makes a new revision`, async () => {
      const plan = await planIn(status);
      expect(plan.permissions.edit).toBe(true);
      const saved = await saveDocument(api.lead, plan, doc, "thinner lens");
      expect(saved.revision).toBe(plan.revision + 1);
      expect(saved.status).toBe(status);
    });
  }

  it("an approved plan stays read-only until a lead reopens it; the next save is a new revision", async () => {
    const plan = await planIn("approved");
    const locked = await api.lead
      .put(`/api/plans/${plan.id}`)
      .send({ baseRevision: plan.revision, document: doc });
    expect(locked.status).toBe(409);
    expect(locked.body.error.code).toBe("plan_locked");
    expect(locked.body.error.message).toMatch(/reopen/);
    const reopened = await api.lead.post(`/api/plans/${plan.id}/reopen`).send({});
    expect(reopened.status).toBe(200);
    expect(reopened.body.status).toBe("draft");
    expect(reopened.body.revision).toBe(plan.revision);
    expect(reopened.body.permissions.edit).toBe(true);
    const saved = await saveDocument(api.lead, reopened.body, doc, "second season");
    expect(saved.revision).toBe(plan.revision + 1);
    const revisions = await api.lead.get(`/api/plans/${plan.id}/revisions`);
    expect(revisions.body.map((r: { number: number }) => r.number)).toEqual([2, 1]);
  });

  it("permissions follow the status and the role", async () => {
    const plan = await planIn("in-review");
    const asReviewer = (await api.reviewer.get(`/api/plans/${plan.id}`)).body as PlanDetail;
    expect(asReviewer.permissions).toMatchObject({ edit: false, decide: true, submit: false });
    const asLead = (await api.lead.get(`/api/plans/${plan.id}`)).body as PlanDetail;
    expect(asLead.permissions).toMatchObject({ edit: false, decide: false, submit: false });
    const asTrainee = (await api.trainee.get(`/api/plans/${plan.id}`)).body as PlanDetail;
    expect(asTrainee.permissions).toMatchObject({
      edit: false,
      decide: false,
      comment: false,
      archive: false,
      duplicate: true,
    });
  });
});

/**
 * Team review over HTTP: comments and threads, @mentions producing e-mail with a working
 * link, notifications and their settings, the inbox, the diff of two revisions, activity and
 * its CSV export.
 */
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { paths } from "@/app/paths";
import type {
  ActivityView,
  CommentView,
  NotificationView,
  PlanDetail,
  PlanDiff,
} from "@/contracts/plans";
import type { MailboxMessage } from "@/contracts/mailbox";
import { analyzePlan, planSchema } from "@engine";
import { notificationMailSettled } from "../domain/notifications";
import {
  createTestContext,
  PUBLIC_URL,
  seedTeam,
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

beforeAll(async () => {
  ctx = await createTestContext();
  team = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
  api = await signInTeam(ctx.app, team);
});
afterAll(async () => {
  await notificationMailSettled(ctx.dataSource);
  await ctx.close();
});

let serial = 0;
/** A plan by the lead with a unique name (so its e-mails can be told apart), saved once. */
async function leadPlan(label: string): Promise<PlanDetail> {
  const plan = await createPlan(api.lead, team.sites.active, `${label} #${++serial}`);
  return saveDocument(api.lead, plan, thinLayerDocument(), "thin clay lens");
}

const inbox = async (a: Api, query = "") =>
  (await a.get(`/api/notifications${query}`)).body as NotificationView[];

/** Every e-mail so far (after background sends have finished). */
async function mail(): Promise<MailboxMessage[]> {
  await notificationMailSettled(ctx.dataSource);
  return ctx.mailbox.all();
}

const mailFor = async (email: string, planName: string) =>
  (await mail()).filter((m) => m.to.includes(email) && m.subject.includes(planName));

const comment = (a: Api, plan: PlanDetail, body: object) =>
  a.post(`/api/plans/${plan.id}/comments`).send(body);

describe("notifications on submit and decision", () => {
  it("submitting tells every reviewer and admin (not the submitter) in the inbox and by e-mail", async () => {
    const plan = await leadPlan("Submit notice");
    const submitted = await api.lead.post(`/api/plans/${plan.id}/submit`).send({ note: "ready" });
    expect(submitted.status).toBe(200);
    for (const role of ["reviewer", "admin"] as const) {
      const entry = (await inbox(api[role])).find((n) => n.planId === plan.id)!;
      expect(entry).toMatchObject({
        kind: "submitted",
        planName: plan.name,
        actorName: team.users.lead.name,
        read: false,
        link: paths.planReview(plan.id),
      });
      expect(entry.text).toContain("ready");
      const [message] = await mailFor(team.users[role].email, plan.name);
      expect(message.subject).toBe(`Review requested: ${plan.name}`);
      expect(message.text).toContain(`${PUBLIC_URL}${paths.planReview(plan.id)}`);
    }
    for (const role of ["lead", "trainee"] as const) {
      expect((await inbox(api[role])).some((n) => n.planId === plan.id)).toBe(false);
      expect(await mailFor(team.users[role].email, plan.name)).toEqual([]);
    }
  });

  it("a decision tells the plan's author, with the reviewer's note", async () => {
    const plan = await leadPlan("Decision notice");
    await api.lead.post(`/api/plans/${plan.id}/submit`).send({});
    await api.reviewer
      .post(`/api/plans/${plan.id}/request-changes`)
      .send({ note: "Add an off-end shot at 110 m." });
    const entry = (await inbox(api.lead)).find((n) => n.planId === plan.id)!;
    expect(entry.kind).toBe("decision");
    expect(entry.text).toContain("returned with notes");
    expect(entry.text).toContain("Add an off-end shot at 110 m.");
    const [message] = await mailFor(team.users.lead.email, plan.name);
    expect(message.subject).toBe(`Review decision: ${plan.name}`);
    expect(message.text).toContain("Add an off-end shot at 110 m.");
    expect(
      (await inbox(api.reviewer)).filter((n) => n.planId === plan.id).map((n) => n.kind),
    ).toEqual(["submitted"]);
  });
});

describe("comments, mentions and replies", () => {
  it("a mention e-mails the mentioned member a link that opens the plan's review", async () => {
    const plan = await leadPlan("Mention mail");
    const response = await comment(api.reviewer, plan, {
      body: `@${team.users.lead.name.toUpperCase()}, is layer 2 really 1.2 m? cc @trainee.`,
      anchor: { kind: "layer", model: 0, index: 1 },
    });
    expect(response.status).toBe(201);
    const view = response.body as CommentView;
    expect(view.mentions.sort()).toEqual([team.users.lead.id, team.users.trainee.id].sort());
    expect(view).toMatchObject({ revision: 2, parentId: null, resolved: false });
    expect(view.author).toEqual({
      id: team.users.reviewer.id,
      name: team.users.reviewer.name,
      role: "reviewer",
    });

    const [message] = await mailFor(team.users.lead.email, plan.name);
    expect(message.subject).toBe(`You were mentioned on ${plan.name}`);
    const link = /https?:\/\/\S+/.exec(message.text)![0];
    const url = new URL(link);
    expect(url.origin).toBe(PUBLIC_URL);
    expect(url.pathname).toBe(paths.planReview(plan.id));
    // The link's plan id opens the plan for the recipient.
    const planId = url.pathname.split("/")[2];
    const opened = await api.lead.get(`/api/plans/${planId}`);
    expect(opened.status).toBe(200);
    expect(opened.body.name).toBe(plan.name);
    expect(message.html).toContain(`href="${link}"`);
    expect((await inbox(api.trainee)).find((n) => n.planId === plan.id)?.kind).toBe("mention");
  });

  it("a reply tells the thread's earlier participants, never the replier, each once", async () => {
    const plan = await leadPlan("Reply thread");
    const root = (await comment(api.reviewer, plan, { body: "Spacing looks coarse." })).body;
    await comment(api.lead, plan, { body: "Agreed, trying 3 m.", parentId: root.id });
    expect(
      (await inbox(api.reviewer)).filter((n) => n.planId === plan.id).map((n) => n.kind),
    ).toEqual(["reply"]);
    expect((await inbox(api.lead)).filter((n) => n.planId === plan.id)).toEqual([]);

    // The admin replies and mentions the lead: the lead gets one mention, the reviewer a reply.
    await comment(api.admin, plan, { body: "@alder lead see the sweep first.", parentId: root.id });
    expect((await inbox(api.lead)).filter((n) => n.planId === plan.id).map((n) => n.kind)).toEqual([
      "mention",
    ]);
    expect(
      (await inbox(api.reviewer)).filter((n) => n.planId === plan.id).map((n) => n.kind),
    ).toEqual(["reply", "reply"]);
    expect((await inbox(api.admin)).filter((n) => n.planId === plan.id)).toEqual([]);
    expect(await mailFor(team.users.reviewer.email, plan.name)).toHaveLength(2);
  });

  it("threads: replies join the thread's revision; revision filter; replying to a reply", async () => {
    const plan = await leadPlan("Threads");
    const onOne = (await comment(api.reviewer, plan, { body: "On the first draft.", revision: 1 }))
      .body;
    const onTwo = (await comment(api.reviewer, plan, { body: "On revision 2." })).body;
    expect(onOne.revision).toBe(1);
    expect(onTwo.revision).toBe(2);
    const reply = (await comment(api.lead, plan, { body: "Fixed in 2.", parentId: onOne.id })).body;
    expect(reply).toMatchObject({ parentId: onOne.id, revision: 1 });
    const nested = (await comment(api.admin, plan, { body: "Thanks.", parentId: reply.id })).body;
    expect(nested.parentId).toBe(onOne.id);
    const revOne = (await api.trainee.get(`/api/plans/${plan.id}/comments?revision=1`)).body;
    expect(revOne.map((c: CommentView) => c.id)).toEqual([onOne.id, reply.id, nested.id]);
    const all = (await api.trainee.get(`/api/plans/${plan.id}/comments`)).body;
    expect(all).toHaveLength(4);
  });

  const refusals: { name: string; body: (root: string) => object; field: string }[] = [
    { name: "an empty body", body: () => ({ body: "  " }), field: "body" },
    { name: "an unknown field", body: () => ({ body: "x", colour: 1 }), field: "colour" },
    {
      name: "a revision that does not exist",
      body: () => ({ body: "x", revision: 7 }),
      field: "revision",
    },
    {
      name: "a layer the model does not have",
      body: () => ({ body: "x", anchor: { kind: "layer", model: 0, index: 3 } }),
      field: "anchor.index",
    },
    {
      name: "the surface as a refractor",
      body: () => ({ body: "x", anchor: { kind: "refractor", model: 0, index: 0 } }),
      field: "anchor.index",
    },
    {
      name: "a model the plan does not have",
      body: () => ({ body: "x", anchor: { kind: "layer", model: 2, index: 0 } }),
      field: "anchor.model",
    },
    {
      name: "a shot the spread does not have",
      body: () => ({ body: "x", anchor: { kind: "shot", index: 2 } }),
      field: "anchor.index",
    },
    {
      name: "a parent that is not a UUID",
      body: () => ({ body: "x", parentId: "7" }),
      field: "parentId",
    },
    {
      name: "a parent from nowhere",
      body: () => ({ body: "x", parentId: "00000000-0000-4000-8000-000000000000" }),
      field: "parentId",
    },
    {
      name: "an anchor on a reply",
      body: (root) => ({ body: "x", parentId: root, anchor: { kind: "shot", index: 0 } }),
      field: "anchor",
    },
    {
      name: "a reply on another revision than its thread",
      body: (root) => ({ body: "x", parentId: root, revision: 1 }),
      field: "revision",
    },
  ];

  describe("refused comments write nothing", () => {
    let plan: PlanDetail;
    let root: string;
    beforeAll(async () => {
      plan = await leadPlan("Refusals");
      root = (await comment(api.reviewer, plan, { body: "Root." })).body.id;
    });
    for (const r of refusals) {
      it(`${r.name} → 400 naming ${r.field}`, async () => {
        const before = await countPlanRows(ctx.dataSource);
        const response = await comment(api.reviewer, plan, r.body(root));
        expect(response.status).toBe(400);
        expect(Object.keys(response.body.error.fields)).toContain(r.field);
        expect(await countPlanRows(ctx.dataSource)).toEqual(before);
      });
    }

    it("a shot anchor within the spread is accepted", async () => {
      const response = await comment(api.reviewer, plan, {
        body: "Move this shot off-end.",
        anchor: { kind: "shot", index: 1 },
      });
      expect(response.status).toBe(201);
      expect(response.body.anchor).toEqual({ kind: "shot", model: 0, index: 1 });
    });

    it("an archived plan takes no comments (409)", async () => {
      const archived = await leadPlan("Archived comments");
      await api.lead.patch(`/api/plans/${archived.id}`).send({ archived: true });
      const response = await comment(api.reviewer, archived, { body: "Too late?" });
      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe("plan_locked");
    });
  });

  it("resolves and reopens a thread; a reply cannot be resolved on its own", async () => {
    const plan = await leadPlan("Resolve");
    const root = (await comment(api.reviewer, plan, { body: "Check the dip." })).body;
    const reply = (await comment(api.lead, plan, { body: "Flat here.", parentId: root.id })).body;
    const resolved = await api.lead.patch(`/api/comments/${root.id}`).send({ resolved: true });
    expect(resolved.status).toBe(200);
    expect(resolved.body).toMatchObject({
      id: root.id,
      resolved: true,
      resolvedBy: { id: team.users.lead.id, name: team.users.lead.name },
    });
    expect(typeof resolved.body.resolvedAt).toBe("string");
    const replyResolve = await api.reviewer
      .patch(`/api/comments/${reply.id}`)
      .send({ resolved: true });
    expect(replyResolve.status).toBe(400);
    const reopened = await api.reviewer.patch(`/api/comments/${root.id}`).send({ resolved: false });
    expect(reopened.body).toMatchObject({ resolved: false, resolvedBy: null, resolvedAt: null });
    const actions = (
      (await api.lead.get(`/api/plans/${plan.id}/activity`)).body as ActivityView[]
    ).map((a) => a.action);
    expect(actions.slice(0, 4)).toEqual([
      "comment.reopen",
      "comment.resolve",
      "comment.reply",
      "comment.create",
    ]);
  });
});

describe("notification settings and the inbox", () => {
  it("defaults to every e-mail on; turning mentions off keeps the inbox entry but sends no mail", async () => {
    const defaults = await api.lead.get("/api/me/notification-settings");
    expect(defaults.body).toEqual({ submitted: true, decision: true, mention: true, reply: true });
    const off = await api.lead
      .put("/api/me/notification-settings")
      .send({ submitted: true, decision: true, mention: false, reply: true });
    expect(off.body.mention).toBe(false);
    expect((await api.lead.get("/api/me/notification-settings")).body.mention).toBe(false);

    const quiet = await leadPlan("Quiet mentions");
    await comment(api.reviewer, quiet, { body: "@lead have a look" });
    expect((await inbox(api.lead)).find((n) => n.planId === quiet.id)?.kind).toBe("mention");
    expect(await mailFor(team.users.lead.email, quiet.name)).toEqual([]);

    await api.lead
      .put("/api/me/notification-settings")
      .send({ submitted: true, decision: true, mention: true, reply: true });
    const loud = await leadPlan("Loud mentions");
    await comment(api.reviewer, loud, { body: "@lead have a look" });
    expect(await mailFor(team.users.lead.email, loud.name)).toHaveLength(1);
  });

  it("refuses incomplete or unknown settings", async () => {
    for (const body of [
      { mention: false },
      { submitted: true, decision: true, mention: true, reply: true, sms: true },
    ]) {
      const response = await api.lead.put("/api/me/notification-settings").send(body);
      expect(response.status).toBe(400);
    }
  });

  it("lists newest first, filters unread, marks one and then all read", async () => {
    const plan = await leadPlan("Inbox");
    await comment(api.reviewer, plan, { body: "@trainee first" });
    await comment(api.admin, plan, { body: "@trainee second" });
    const mine = (await inbox(api.trainee)).filter((n) => n.planId === plan.id);
    expect(mine.map((n) => n.actorName)).toEqual([team.users.admin.name, team.users.reviewer.name]);
    const read = await api.trainee.post(`/api/notifications/${mine[1].id}/read`).send({});
    expect(read.status).toBe(200);
    expect(read.body.read).toBe(true);
    const unread = (await inbox(api.trainee, "?unread=true")).filter((n) => n.planId === plan.id);
    expect(unread.map((n) => n.id)).toEqual([mine[0].id]);
    const all = await api.trainee.post("/api/notifications/read-all").send({});
    expect(all.body.marked).toBeGreaterThanOrEqual(1);
    expect(await inbox(api.trainee, "?unread=true")).toEqual([]);
    const other = await api.lead.post(`/api/notifications/${mine[0].id}/read`).send({});
    expect(other.status).toBe(404);
  });
});

describe("diff of two revisions", () => {
  it("names the layer added, the fields changed and the verdicts that changed", async () => {
    const plan = await createPlan(api.lead, team.sites.active, "Diff over HTTP");
    // Revision 2: the default model gains a thin, fast-enough middle layer; spacing widens.
    const doc = structuredClone(plan.document);
    doc.models[0].layers.splice(1, 0, { name: "clay lens", velocity: 1200, thickness: 0.8 });
    doc.models[0].layers[0].thickness = 3;
    doc.spread.spacing = 5;
    doc.criteria.minGeophones = 3;
    await saveDocument(api.lead, plan, doc, "lens");
    const response = await api.reviewer.get(`/api/plans/${plan.id}/diff?from=1&to=2`);
    expect(response.status).toBe(200);
    const diff = response.body as PlanDiff;
    expect(diff).toMatchObject({ planId: plan.id, from: 1, to: 2, identical: false });
    expect(diff.models).toHaveLength(1);
    const layers = diff.models[0].layers;
    expect(layers.map((l) => [l.change, l.fromIndex, l.toIndex])).toEqual([
      ["changed", 0, 0],
      ["added", null, 1],
    ]);
    expect(layers[0].fields).toEqual([{ field: "thickness", from: 4, to: 3 }]);
    expect(diff.spread).toEqual([{ field: "spacing", from: 3, to: 5 }]);
    expect(diff.criteria).toEqual([{ field: "minGeophones", from: 2, to: 3 }]);
    expect(diff.shots).toEqual({ added: [], removed: [] });
    // Verdicts: the engine's own statuses for both documents are the reference.
    const status = (d: typeof doc) =>
      analyzePlan(planSchema.parse(d)).models[0].refractors.map((r) => [r.layer, r.status]);
    const [before, after] = [status(plan.document), status(doc)];
    expect(before).toEqual([[2, analyzePlan(planSchema.parse(plan.document)).worstStatus]]);
    const lens = diff.verdicts.find((v) => v.layer === 2)!;
    const afterLens = after.find(([layer]) => layer === 2)![1];
    // Layer 2 of revision 2 is the new lens: it had no refractor before.
    expect(lens).toMatchObject({ model: "Soil over weathered rock", from: null, to: afterLens });
    const rock = after.find(([layer]) => layer === 3)![1];
    const rockChange = diff.verdicts.find((v) => v.layer === 3);
    const worst = (d: typeof doc) => analyzePlan(planSchema.parse(d)).worstStatus;
    const [w1, w2] = [worst(plan.document), worst(doc)];
    expect(diff.worstVerdict).toEqual(w1 === w2 ? null : { from: w1, to: w2 });
    if (rock === before[0][1]) expect(rockChange).toBeUndefined();
    else expect(rockChange).toMatchObject({ from: before[0][1], to: rock });
    const same = (await api.reviewer.get(`/api/plans/${plan.id}/diff?from=2&to=2`))
      .body as PlanDiff;
    expect(same.identical).toBe(true);
    const missing = await api.reviewer.get(`/api/plans/${plan.id}/diff?from=1&to=5`);
    expect(missing.status).toBe(404);
  });
});

describe("activity and CSV", () => {
  it("records every plan action, newest first, with its actor", async () => {
    const plan = await leadPlan("Activity");
    await api.lead.post(`/api/plans/${plan.id}/submit`).send({ note: "ready" });
    await api.reviewer.post(`/api/plans/${plan.id}/approve`).send({ note: "fine" });
    await api.lead.post(`/api/plans/${plan.id}/reopen`).send({});
    await api.lead.patch(`/api/plans/${plan.id}`).send({ name: `${plan.name} (2)` });
    const activity = (await api.trainee.get(`/api/plans/${plan.id}/activity`))
      .body as ActivityView[];
    expect(activity.map((a) => a.action)).toEqual([
      "plan.rename",
      "plan.reopen",
      "plan.approve",
      "plan.submit",
      "plan.save",
      "plan.create",
    ]);
    expect(activity[2]).toMatchObject({
      actorName: team.users.reviewer.name,
      targetType: "plan",
      targetId: plan.id,
      detail: { from: "in-review", to: "approved", note: "fine", revision: 2 },
    });
  });

  it("exports a plan's trail as CSV with a header and proper quoting", async () => {
    const nasty = `Line "A", north\nend =SUM(1)`;
    const plan = await createPlan(api.lead, team.sites.active, nasty);
    await api.lead.patch(`/api/plans/${plan.id}`).send({ name: `${nasty}, renamed` });
    const response = await api.reviewer.get(`/api/plans/${plan.id}/activity.csv`);
    expect(response.status).toBe(200);
    expect(response.headers["content-type"]).toMatch(/^text\/csv/);
    expect(response.headers["content-disposition"]).toMatch(/attachment; filename=".+\.csv"/);
    expect(response.text).toContain(`"Line ""A"", north\nend =SUM(1), renamed"`);
    const parsed = Papa.parse<string[]>(response.text.trimEnd(), { newline: "\r\n" });
    expect(parsed.errors).toEqual([]);
    const [header, ...rows] = parsed.data;
    expect(header).toEqual([
      "time",
      "actor",
      "action",
      "target_type",
      "target_id",
      "plan",
      "detail",
    ]);
    expect(rows.map((r) => r[2])).toEqual(["plan.create", "plan.rename"]);
    expect(rows.every((r) => r.length === header.length)).toBe(true);
    expect(rows[1][5]).toBe(`${nasty}, renamed`);
    expect(rows[1][6]).toBe(`from=${nasty}; to=${nasty}, renamed`);
    expect(rows[0][1]).toBe(team.users.lead.name);
  });

  it("a limited CSV keeps the newest events, oldest first, in a file named after the plan", async () => {
    const plan = await createPlan(api.lead, team.sites.active, "Limit check, line C");
    await api.lead.patch(`/api/plans/${plan.id}`).send({ name: "Limit check, line C2" });
    await api.lead.patch(`/api/plans/${plan.id}`).send({ name: "Limit check, line C3" });
    const response = await api.reviewer.get(`/api/plans/${plan.id}/activity.csv?limit=2`);
    expect(response.status).toBe(200);
    expect(response.headers["content-disposition"]).toBe(
      'attachment; filename="limit-check-line-c3-activity.csv"',
    );
    const rows = Papa.parse<string[]>(response.text.trimEnd(), { newline: "\r\n" }).data.slice(1);
    // The newest two (the create is left out), as the JSON list with the same limit.
    expect(rows.map((r) => r[6]).sort()).toEqual(
      [
        "from=Limit check, line C; to=Limit check, line C2",
        "from=Limit check, line C2; to=Limit check, line C3",
      ].sort(),
    );
    const json = await api.reviewer.get(`/api/plans/${plan.id}/activity?limit=2`);
    expect(json.body.map((e: { action: string }) => e.action)).toEqual([
      "plan.rename",
      "plan.rename",
    ]);
  });

  it("guards cells that a spreadsheet would run as a formula", async () => {
    const plan = await createPlan(api.lead, team.sites.active, '=HYPERLINK("x")');
    const csv = (await api.lead.get(`/api/plans/${plan.id}/activity.csv`)).text;
    const rows = Papa.parse<string[]>(csv.trimEnd(), { newline: "\r\n" }).data;
    expect(rows[1][5]).toBe(`'=HYPERLINK("x")`);
  });

  it("the team CSV leaves out sandbox plans the reader may not see", async () => {
    const sandbox = await createPlan(api.trainee, team.sites.active, "Private scenario");
    const asLead = await api.lead.get("/api/audit.csv");
    const asAdmin = await api.admin.get("/api/audit.csv");
    expect(asLead.status).toBe(200);
    expect(asLead.text.split("\r\n")[0]).toBe(
      "time,actor,action,target_type,target_id,plan,detail",
    );
    expect(asLead.text).not.toContain(sandbox.id);
    expect(asAdmin.text).toContain(sandbox.id);
    expect((await api.trainee.get("/api/audit.csv")).status).toBe(403);
  });

  it("the team trail as JSON leaves out the same sandbox plans", async () => {
    const sandbox = await createPlan(api.trainee, team.sites.active, "Another private scenario");
    const asLead = await api.lead.get("/api/audit?limit=500");
    const asAdmin = await api.admin.get("/api/audit?limit=500");
    expect(asLead.status).toBe(200);
    const targets = (body: Array<{ targetId: string | null }>) => body.map((e) => e.targetId);
    expect(targets(asLead.body)).not.toContain(sandbox.id);
    expect(targets(asAdmin.body)).toContain(sandbox.id);
  });
});

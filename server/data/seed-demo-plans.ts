/**
 * Demo plans for the demo team's two invented sites, with a believable history: revisions
 * (each with its engine summary), a review cycle with notes, comment threads, inbox entries
 * and audit rows dated over the last two weeks. Inserted once: a team that already has plans
 * is left alone. Every name, place and number here is invented.
 */
import { randomUUID } from "node:crypto";
import type { DataSource, EntityManager } from "typeorm";
import type { Role } from "@/contracts/common";
import type { CommentAnchor, NotificationKind, PlanStatus } from "@/contracts/plans";
import { planSchema, type PlanInput } from "@engine";
import { summarizeDocument } from "../domain/revisions";
import { AuditEvent, type AuditDetail } from "./entities/audit-event";
import { PlanComment } from "./entities/comment";
import { Membership } from "./entities/membership";
import { PlanNotification } from "./entities/notification";
import { Plan } from "./entities/plan";
import { PlanRevision } from "./entities/plan-revision";
import { Site } from "./entities/site";
import { inTransaction } from "./transaction";

/** Site names from seed-demo.ts. */
const SCARROWFIELD = "Scarrowfield road cutting";
const MELLBROOK = "Mellbrook landfill extension";

type Layer = { name: string; velocity: number; thickness?: number };
const spread = (spacing: number, channels: number, shots: [number, string][]) => ({
  spacing,
  channels,
  firstGeophone: 0,
  shots: shots.map(([position, label]) => ({ position, label })),
});

const colluvium = { name: "sandy colluvium", velocity: 500, thickness: 2.4 };
const lens = (thickness: number): Layer => ({ name: "soft clay lens", velocity: 1250, thickness });

/** A 1.2 m clay lens that the 3 m, 24-channel spread misses (blind: never a first arrival). */
const lensCheck = (lensThickness: number): PlanInput => ({
  name: "Cutting line A — clay lens check",
  models: [
    {
      name: "Clay lens present",
      layers: [
        colluvium,
        lens(lensThickness),
        { name: "weathered sandstone", velocity: 2100, thickness: 4 },
        { name: "sandstone", velocity: 3300 },
      ],
    },
    {
      name: "Lens pinched out",
      layers: [
        colluvium,
        { name: "weathered sandstone", velocity: 2100, thickness: 5.2 },
        { name: "sandstone", velocity: 3300 },
      ],
    },
  ],
  spread: spread(3, 24, [
    [-1.5, "end A"],
    [70.5, "end B"],
  ]),
});

/**
 * A 2-D section of the cutting: the ground falls towards the east and a shallow channel is cut
 * into the sandstone. The 4 m spread puts one head-wave exit point on the channel floor per
 * shot branch (under-sampled); 2 m spacing resolves it.
 */
const channelSection: PlanInput = {
  format: "spreadsight-plan/2",
  name: "Cutting line C — buried channel (2-D)",
  models: [
    {
      name: "Channel in the sandstone (section)",
      kind: "section",
      surface: [
        [-4, 101.6],
        [40, 100.2],
        [100, 97.8],
      ],
      layers: [
        {
          name: "sandy colluvium",
          velocity: 500,
          base: [
            [-4, 99.4],
            [40, 97.9],
            [100, 95.6],
          ],
        },
        {
          name: "weathered sandstone",
          velocity: 2100,
          base: [
            [-4, 95.6],
            [32, 94.3],
            [35, 93.0],
            [43, 92.8],
            [46, 94.0],
            [100, 92.0],
          ],
        },
        { name: "sandstone", velocity: 3300 },
      ],
    },
  ],
  spread: spread(4, 24, [
    [-2, "end A"],
    [94, "end B"],
  ]),
};

/** Water-bearing sand under stiffer till: a velocity inversion no spread can reveal. */
const cellFour = (shots: [number, string][]): PlanInput => ({
  name: "Cell 4 — sand lens under stiff till",
  models: [
    {
      name: "Sand lens under stiff till",
      layers: [
        { name: "weathered till", velocity: 450, thickness: 2.5 },
        { name: "stiff till", velocity: 1900, thickness: 3.5 },
        { name: "water-bearing sand", velocity: 1550, thickness: 2.5 },
        { name: "chalk", velocity: 2800 },
      ],
    },
    {
      name: "Till on chalk",
      layers: [
        { name: "weathered till", velocity: 450, thickness: 2.5 },
        { name: "stiff till", velocity: 1900, thickness: 6 },
        { name: "chalk", velocity: 2800 },
      ],
    },
  ],
  spread: spread(3, 24, shots),
});

const rippability = (s: ReturnType<typeof spread>): PlanInput => ({
  name: "Cutting line B — rippability",
  models: [
    {
      name: "Colluvium on sandstone",
      layers: [
        { name: "sandy colluvium", velocity: 600, thickness: 1.8 },
        { name: "weathered sandstone", velocity: 1800, thickness: 3.5 },
        { name: "sandstone", velocity: 3000 },
      ],
    },
  ],
  spread: s,
});

interface Ctx {
  manager: EntityManager;
  teamId: string;
  users: Record<Role, string>;
  names: Record<Role, string>;
  now: number;
}

const DAY = 24 * 60 * 60 * 1000;
/** `days` ago at hh:mm (local clock of the server is irrelevant: only the order matters). */
const ago = (c: Ctx, days: number, hh: number, mm = 0) =>
  new Date(Math.floor((c.now - days * DAY) / DAY) * DAY + (hh * 60 + mm) * 60 * 1000);

async function audit(
  c: Ctx,
  at: Date,
  actor: Role,
  action: string,
  planId: string,
  detail: AuditDetail,
) {
  await c.manager.getRepository(AuditEvent).insert({
    id: randomUUID(),
    teamId: c.teamId,
    actorId: c.users[actor],
    action,
    targetType: "plan",
    targetId: planId,
    detail,
    createdAt: at,
  });
}

async function notifyDemo(
  c: Ctx,
  at: Date,
  to: Role,
  from: Role,
  kind: NotificationKind,
  planId: string,
  text: string,
  read: boolean,
) {
  await c.manager.getRepository(PlanNotification).insert({
    id: randomUUID(),
    teamId: c.teamId,
    userId: c.users[to],
    kind,
    planId,
    actorId: c.users[from],
    text: `${c.names[from]} ${text}`,
    readAt: read ? new Date(at.getTime() + 30 * 60 * 1000) : null,
    createdAt: at,
  });
}

/** Inserts a plan with its revisions; returns its id. */
async function plan(
  c: Ctx,
  args: {
    siteId: string;
    name: string;
    author: Role;
    sandbox?: boolean;
    status: PlanStatus;
    submittedBy?: Role;
    revisions: { at: Date; by: Role; document: PlanInput; message: string }[];
  },
): Promise<string> {
  const id = randomUUID();
  const revisions = args.revisions.map((r) => {
    const document = planSchema.parse({ ...r.document, name: args.name });
    return { ...r, document, summary: summarizeDocument(document) };
  });
  const last = revisions[revisions.length - 1];
  await c.manager.getRepository(Plan).insert({
    id,
    teamId: c.teamId,
    siteId: args.siteId,
    name: args.name,
    status: args.status,
    statusBeforeArchive: null,
    sandbox: args.sandbox ?? false,
    authorId: c.users[args.author],
    submittedById: args.submittedBy ? c.users[args.submittedBy] : null,
    latestRevision: revisions.length,
    worstVerdict: last.summary?.worstVerdict ?? null,
    createdAt: revisions[0].at,
    updatedAt: last.at,
  });
  for (const [i, r] of revisions.entries()) {
    await c.manager.getRepository(PlanRevision).insert({
      id: randomUUID(),
      teamId: c.teamId,
      planId: id,
      number: i + 1,
      document: r.document,
      summary: r.summary,
      worstVerdict: r.summary?.worstVerdict ?? null,
      authorId: c.users[r.by],
      message: r.message,
      createdAt: r.at,
    });
  }
  return id;
}

async function comment(
  c: Ctx,
  args: {
    planId: string;
    revision: number;
    at: Date;
    by: Role;
    body: string;
    parentId?: string;
    anchor?: CommentAnchor;
    mentions?: Role[];
    resolved?: { at: Date; by: Role };
  },
): Promise<string> {
  const id = randomUUID();
  await c.manager.getRepository(PlanComment).insert({
    id,
    teamId: c.teamId,
    planId: args.planId,
    revision: args.revision,
    parentId: args.parentId ?? null,
    authorId: c.users[args.by],
    authorRole: args.by,
    body: args.body,
    anchor: args.anchor ?? null,
    mentions: (args.mentions ?? []).map((r) => c.users[r]),
    resolvedAt: args.resolved?.at ?? null,
    resolvedById: args.resolved ? c.users[args.resolved.by] : null,
    createdAt: args.at,
  });
  return id;
}

/** The approved plan: a full review cycle with a resolved thread. */
async function approvedPlan(c: Ctx, siteId: string) {
  const name = "Cutting line B — rippability";
  const first = rippability(
    spread(5, 24, [
      [-2.5, "end A"],
      [117.5, "end B"],
    ]),
  );
  const second = rippability(
    spread(2, 48, [
      [-1, "end A"],
      [47, "centre"],
      [95, "end B"],
    ]),
  );
  const t = {
    created: ago(c, 12, 9),
    submitted: ago(c, 12, 9, 20),
    thread: ago(c, 11, 14),
    requested: ago(c, 11, 14, 5),
    reply: ago(c, 10, 10),
    saved: ago(c, 10, 10, 10),
    resubmitted: ago(c, 10, 10, 15),
    caution: ago(c, 9, 15, 30),
    resolved: ago(c, 9, 16),
    approved: ago(c, 9, 16, 5),
  };
  const id = await plan(c, {
    siteId,
    name,
    author: "lead",
    status: "approved",
    submittedBy: "lead",
    revisions: [
      { at: t.created, by: "lead", document: first, message: "created" },
      { at: t.saved, by: "lead", document: second, message: "2 m spacing, 48 channels, centre shot" },
    ],
  });
  await audit(c, t.created, "lead", "plan.create", id, { name, site: SCARROWFIELD, sandbox: false });
  await audit(c, t.submitted, "lead", "plan.submit", id, {
    name,
    revision: 1,
    from: "draft",
    to: "in-review",
    note: "First pass for the rippability survey.",
  });
  for (const to of ["reviewer", "admin"] as const) {
    await notifyDemo(c, t.submitted, to, "lead", "submitted", id, `submitted “${name}” (revision 1). Note: First pass for the rippability survey.`, true);
  }
  const thread = await comment(c, {
    planId: id,
    revision: 1,
    at: t.thread,
    by: "reviewer",
    body:
      "@Tobias Renshaw at 5 m spacing only two geophones catch the weathered sandstone " +
      "segment: one bad pick and the layer is gone. Can we tighten the spacing?",
    anchor: { kind: "refractor", model: 0, index: 1 },
    mentions: ["lead"],
    resolved: { at: t.resolved, by: "reviewer" },
  });
  await audit(c, t.thread, "reviewer", "comment.create", id, {
    name,
    comment: thread,
    thread,
    revision: 1,
    anchor: "refractor 1",
    mentions: 1,
  });
  await notifyDemo(c, t.thread, "lead", "reviewer", "mention", id, `mentioned you in a review note on “${name}”.`, true);
  const note =
    "Tighten the spacing so the weathered sandstone is well sampled, and add a centre shot so it is reversed.";
  await audit(c, t.requested, "reviewer", "plan.request_changes", id, {
    name,
    revision: 1,
    from: "in-review",
    to: "changes-requested",
    note,
  });
  await notifyDemo(c, t.requested, "lead", "reviewer", "decision", id, `returned with notes “${name}” (revision 1). Note: ${note}`, true);
  const reply = await comment(c, {
    planId: id,
    revision: 1,
    at: t.reply,
    by: "lead",
    parentId: thread,
    body: "Went to 2 m with 48 channels and a centre shot at 47 m; the segment now holds 4 geophones.",
  });
  await audit(c, t.reply, "lead", "comment.reply", id, {
    name,
    comment: reply,
    thread,
    revision: 1,
    anchor: null,
    mentions: 0,
  });
  await notifyDemo(c, t.reply, "reviewer", "lead", "reply", id, `replied to a review note on “${name}”.`, true);
  await audit(c, t.saved, "lead", "plan.save", id, {
    name,
    revision: 2,
    message: "2 m spacing, 48 channels, centre shot",
    worstVerdict: summarizeDocument(planSchema.parse(second))?.worstVerdict ?? null,
  });
  await audit(c, t.resubmitted, "lead", "plan.submit", id, {
    name,
    revision: 2,
    from: "changes-requested",
    to: "in-review",
    note: "Revised as requested.",
  });
  for (const to of ["reviewer", "admin"] as const) {
    await notifyDemo(c, t.resubmitted, to, "lead", "submitted", id, `submitted “${name}” (revision 2). Note: Revised as requested.`, true);
  }
  const caution = await comment(c, {
    planId: id,
    revision: 2,
    at: t.caution,
    by: "admin",
    body: "The east end of the line runs along the lane: book traffic management, and hearing protection for the hammer.",
    anchor: { kind: "shot", model: 0, index: 2 },
  });
  await audit(c, t.caution, "admin", "comment.create", id, {
    name,
    comment: caution,
    thread: caution,
    revision: 2,
    anchor: "shot 2",
    mentions: 0,
  });
  await audit(c, t.resolved, "reviewer", "comment.resolve", id, { name, comment: thread, revision: 1 });
  const approval = "Approved for mobilisation; boreholes BH2 and BH3 remain the check on depth.";
  await audit(c, t.approved, "reviewer", "plan.approve", id, {
    name,
    revision: 2,
    from: "in-review",
    to: "approved",
    note: approval,
  });
  await notifyDemo(c, t.approved, "lead", "reviewer", "decision", id, `signed off for mobilisation “${name}” (revision 2). Note: ${approval}`, false);
}

/** Inserts the demo plans unless the demo team already has plans. Returns whether it did. */
export async function seedDemoPlans(
  dataSource: DataSource,
  team: { teamId: string },
): Promise<boolean> {
  return inTransaction(dataSource, async (manager) => {
    if (await manager.getRepository(Plan).existsBy({ teamId: team.teamId })) return false;
    const members = await manager
      .getRepository(Membership)
      .find({ where: { teamId: team.teamId }, relations: { user: true } });
    const users = {} as Record<Role, string>;
    const names = {} as Record<Role, string>;
    for (const m of members) {
      users[m.role] ??= m.userId;
      names[m.role] ??= m.user?.name ?? "";
    }
    const sites = await manager.getRepository(Site).findBy({ teamId: team.teamId });
    const site = (name: string) => sites.find((s) => s.name === name)?.id;
    const scarrowfield = site(SCARROWFIELD);
    const mellbrook = site(MELLBROOK);
    if (!scarrowfield || !mellbrook || !users.lead || !users.reviewer || !users.trainee || !users.admin) {
      return false;
    }
    const c: Ctx = { manager, teamId: team.teamId, users, names, now: Date.now() };

    await approvedPlan(c, scarrowfield);

    // A draft whose clay lens the default spread misses.
    const lensName = "Cutting line A — clay lens check";
    const lensAt = ago(c, 3, 11);
    const lensId = await plan(c, {
      siteId: scarrowfield,
      name: lensName,
      author: "lead",
      status: "draft",
      revisions: [{ at: lensAt, by: "lead", document: lensCheck(1.2), message: "created" }],
    });
    await audit(c, lensAt, "lead", "plan.create", lensId, {
      name: lensName,
      site: SCARROWFIELD,
      sandbox: false,
    });

    // A 2-D section whose channel floor the 4 m spread under-samples.
    const channelName = "Cutting line C — buried channel (2-D)";
    const channelAt = ago(c, 2, 9, 30);
    const channelId = await plan(c, {
      siteId: scarrowfield,
      name: channelName,
      author: "lead",
      status: "draft",
      revisions: [{ at: channelAt, by: "lead", document: channelSection, message: "created" }],
    });
    await audit(c, channelAt, "lead", "plan.create", channelId, {
      name: channelName,
      site: SCARROWFIELD,
      sandbox: false,
    });

    // The trainee's sandbox copy: what if the lens were thicker?
    const sandboxName = "What if the clay lens is 2.5 m thick?";
    const sandboxAt = ago(c, 1, 15);
    const sandboxId = await plan(c, {
      siteId: scarrowfield,
      name: sandboxName,
      author: "trainee",
      sandbox: true,
      status: "draft",
      revisions: [
        { at: sandboxAt, by: "trainee", document: lensCheck(1.2), message: `copied from ${lensName}, revision 1` },
        { at: ago(c, 1, 15, 20), by: "trainee", document: lensCheck(2.5), message: "lens 2.5 m" },
      ],
    });
    await audit(c, sandboxAt, "trainee", "plan.duplicate", sandboxId, {
      name: sandboxName,
      fromPlan: lensId,
      fromName: lensName,
      fromRevision: 1,
      sandbox: true,
    });

    // In review at Mellbrook: a velocity inversion no spread can reveal.
    const cellName = "Cell 4 — sand lens under stiff till";
    const cellAt = ago(c, 5, 10);
    const cellSaved = ago(c, 4, 9, 30);
    const cellSubmitted = ago(c, 2, 17);
    const cellId = await plan(c, {
      siteId: mellbrook,
      name: cellName,
      author: "lead",
      status: "in-review",
      submittedBy: "lead",
      revisions: [
        {
          at: cellAt,
          by: "lead",
          document: cellFour([
            [-1.5, "end A"],
            [70.5, "end B"],
          ]),
          message: "created",
        },
        {
          at: cellSaved,
          by: "lead",
          document: cellFour([
            [-1.5, "end A"],
            [34.5, "centre"],
            [70.5, "end B"],
          ]),
          message: "centre shot",
        },
      ],
    });
    await audit(c, cellAt, "lead", "plan.create", cellId, { name: cellName, site: MELLBROOK, sandbox: false });
    await audit(c, cellSaved, "lead", "plan.save", cellId, {
      name: cellName,
      revision: 2,
      message: "centre shot",
      worstVerdict: "inverted",
    });
    const cellNote = "The sand lens cannot show on first arrivals; I propose two boreholes to bound it.";
    await audit(c, cellSubmitted, "lead", "plan.submit", cellId, {
      name: cellName,
      revision: 2,
      from: "draft",
      to: "in-review",
      note: cellNote,
    });
    for (const to of ["reviewer", "admin"] as const) {
      await notifyDemo(c, cellSubmitted, to, "lead", "submitted", cellId, `submitted “${cellName}” (revision 2). Note: ${cellNote}`, false);
    }
    return true;
  });
}

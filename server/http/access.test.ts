import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import type { Test } from "supertest";
import { ROLES, type Role } from "@/contracts/common";
import { Invitation } from "../data/entities/invitation";
import { Membership } from "../data/entities/membership";
import { Site } from "../data/entities/site";
import { User } from "../data/entities/user";
import {
  client,
  createTestContext,
  seedTeam,
  signIn,
  testPasswordHash,
  type TestContext,
  type TestTeam,
} from "../testing/harness";

type Caller = Role | "anonymous";
const CALLERS: Caller[] = ["anonymous", ...ROLES];

let ctx: TestContext;
let alder: TestTeam;
let birch: TestTeam;
const cookies = {} as Record<Role, string>;
const birchCookies = {} as Record<Role, string>;
let pendingInvitationId: string;
let mailId: string;
let removableUserId: string;

beforeAll(async () => {
  ctx = await createTestContext();
  alder = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
  birch = await seedTeam(ctx.dataSource, "Birch Test Surveys", "birch");
  for (const role of ROLES) {
    cookies[role] = await signIn(ctx.app, `${role}@alder.test`);
    birchCookies[role] = await signIn(ctx.app, `${role}@birch.test`);
  }
  const invitation = await client(ctx.app, cookies.admin)
    .post("/api/invitations")
    .send({ email: "pending@example.test", role: "trainee" });
  pendingInvitationId = invitation.body.id;
  mailId = (await ctx.mailbox.waitFor((m) => m.to.includes("pending@example.test"))).id;
  // An extra member the admin may remove in the matrix.
  removableUserId = randomUUID();
  const now = new Date();
  await ctx.dataSource.getRepository(User).insert({
    id: removableUserId,
    email: "removable@alder.test",
    name: "Removable Member",
    passwordHash: await testPasswordHash(),
    createdAt: now,
    updatedAt: now,
  });
  await ctx.dataSource.getRepository(Membership).insert({
    id: randomUUID(),
    teamId: alder.id,
    userId: removableUserId,
    role: "trainee",
    createdAt: now,
  });
});
afterAll(() => ctx.close());

type Api = ReturnType<typeof client>;
interface Row {
  route: string;
  call: (api: Api, caller: Caller) => Test;
  expect: Record<Caller, number>;
  /** Sign in afresh for this row (the call ends the session). */
  freshSession?: boolean;
}

const all = (status: number) =>
  Object.fromEntries(CALLERS.map((c) => [c, status])) as Record<Caller, number>;
const signedIn = (status: number) => ({ ...all(status), anonymous: 401 });
const only = (roles: Role[], ok: number) => ({
  ...signedIn(403),
  ...Object.fromEntries(roles.map((r) => [r, ok])),
});
const unknownToken = "c".repeat(32);

// design.md role table: admin manages the team; admin and lead edit sites; admin, lead and
// reviewer read the audit trail; only admins read the mailbox; every member reads sites and
// the member list.
const matrix: Row[] = [
  { route: "GET /api/health", call: (a) => a.get("/api/health"), expect: all(200) },
  {
    route: "POST /api/auth/sign-in (wrong password)",
    call: (a) =>
      a.post("/api/auth/sign-in").send({ email: "ghost@alder.test", password: "wrong-password" }),
    expect: all(401),
  },
  {
    route: "POST /api/auth/sign-out",
    call: (a) => a.post("/api/auth/sign-out").send({}),
    expect: all(204),
    freshSession: true,
  },
  {
    route: "POST /api/auth/password-reset",
    call: (a) => a.post("/api/auth/password-reset").send({ email: "ghost@alder.test" }),
    expect: all(202),
  },
  {
    route: "POST /api/auth/password-reset/:token",
    call: (a) =>
      a.post(`/api/auth/password-reset/${unknownToken}`).send({ password: "long-enough-1" }),
    expect: all(404),
  },
  { route: "GET /api/me", call: (a) => a.get("/api/me"), expect: signedIn(200) },
  {
    route: "PUT /api/me/preferences",
    call: (a) => a.put("/api/me/preferences").send({ units: "metric" }),
    expect: signedIn(200),
  },
  {
    route: "GET /api/invitations",
    call: (a) => a.get("/api/invitations"),
    expect: only(["admin"], 200),
  },
  {
    route: "POST /api/invitations",
    call: (a, caller) =>
      a.post("/api/invitations").send({ email: `matrix-${caller}@example.test`, role: "trainee" }),
    expect: only(["admin"], 201),
  },
  {
    route: "DELETE /api/invitations/:id",
    call: (a) => a.delete(`/api/invitations/${pendingInvitationId}`),
    expect: only(["admin"], 204),
  },
  {
    route: "GET /api/invitations/token/:token",
    call: (a) => a.get(`/api/invitations/token/${unknownToken}`),
    expect: all(404),
  },
  {
    route: "POST /api/invitations/token/:token/accept",
    call: (a) =>
      a
        .post(`/api/invitations/token/${unknownToken}/accept`)
        .send({ name: "Nobody", password: "long-enough-1" }),
    expect: all(404),
  },
  {
    route: "GET /api/team/members",
    call: (a) => a.get("/api/team/members"),
    expect: signedIn(200),
  },
  {
    route: "PATCH /api/team/members/:userId",
    call: (a) => a.patch(`/api/team/members/${alder.users.reviewer.id}`).send({ role: "reviewer" }),
    expect: only(["admin"], 200),
  },
  {
    route: "DELETE /api/team/members/:userId",
    call: (a) => a.delete(`/api/team/members/${removableUserId}`),
    expect: only(["admin"], 204),
  },
  {
    route: "GET /api/team/settings",
    call: (a) => a.get("/api/team/settings"),
    expect: signedIn(200),
  },
  {
    route: "PATCH /api/team/settings",
    call: (a) => a.patch("/api/team/settings").send({ seismographChannels: 24 }),
    expect: only(["admin"], 200),
  },
  { route: "GET /api/sites", call: (a) => a.get("/api/sites?archived=all"), expect: signedIn(200) },
  {
    route: "GET /api/sites/:id",
    call: (a) => a.get(`/api/sites/${alder.sites.active}`),
    expect: signedIn(200),
  },
  {
    route: "POST /api/sites",
    call: (a, caller) => a.post("/api/sites").send({ name: `Matrix site by ${caller}` }),
    expect: only(["admin", "lead"], 201),
  },
  {
    route: "PATCH /api/sites/:id",
    call: (a, caller) =>
      a.patch(`/api/sites/${alder.sites.active}`).send({ description: `edited by ${caller}` }),
    expect: only(["admin", "lead"], 200),
  },
  {
    route: "GET /api/audit",
    call: (a) => a.get("/api/audit"),
    expect: only(["admin", "lead", "reviewer"], 200),
  },
  { route: "GET /api/mailbox", call: (a) => a.get("/api/mailbox"), expect: only(["admin"], 200) },
  {
    route: "GET /api/mailbox/:id",
    call: (a) => a.get(`/api/mailbox/${mailId}`),
    expect: only(["admin"], 200),
  },
];

describe("role × route matrix", () => {
  for (const row of matrix) {
    for (const caller of CALLERS) {
      it(`${row.route} as ${caller} → ${row.expect[caller]}`, async () => {
        let cookie: string | undefined;
        if (caller !== "anonymous") {
          cookie = row.freshSession
            ? await signIn(ctx.app, `${caller}@alder.test`)
            : cookies[caller];
        }
        const response = await row.call(client(ctx.app, cookie), caller);
        expect(response.status).toBe(row.expect[caller]);
        if (response.status >= 400) {
          expect(response.headers["content-type"]).toMatch(/application\/json/);
          expect(typeof response.body.error.code).toBe("string");
        }
      });
    }
  }

  it("covers every route the API registers", () => {
    const covered = new Set(matrix.map((r) => r.route.split(" (")[0]));
    // Sign-in with valid credentials is covered in auth.test.ts; the list here is the API.
    const routes = [
      "GET /api/health",
      "POST /api/auth/sign-in",
      "POST /api/auth/sign-out",
      "POST /api/auth/password-reset",
      "POST /api/auth/password-reset/:token",
      "GET /api/me",
      "PUT /api/me/preferences",
      "GET /api/invitations",
      "POST /api/invitations",
      "DELETE /api/invitations/:id",
      "GET /api/invitations/token/:token",
      "POST /api/invitations/token/:token/accept",
      "GET /api/team/members",
      "PATCH /api/team/members/:userId",
      "DELETE /api/team/members/:userId",
      "GET /api/team/settings",
      "PATCH /api/team/settings",
      "GET /api/sites",
      "GET /api/sites/:id",
      "POST /api/sites",
      "PATCH /api/sites/:id",
      "GET /api/audit",
      "GET /api/mailbox",
      "GET /api/mailbox/:id",
    ];
    expect([...covered].sort()).toEqual([...routes].sort());
  });
});

describe("team isolation", () => {
  it("another team's sites are absent from lists and 404 by id", async () => {
    const list = await client(ctx.app, birchCookies.admin).get("/api/sites?archived=all");
    expect(list.status).toBe(200);
    const ids = list.body.map((s: { id: string }) => s.id);
    expect(ids).toContain(birch.sites.active);
    expect(ids).not.toContain(alder.sites.active);
    expect(ids).not.toContain(alder.sites.archived);
    const byId = await client(ctx.app, birchCookies.admin).get(`/api/sites/${alder.sites.active}`);
    expect(byId.status).toBe(404);
    expect(byId.body.error.code).toBe("not_found");
  });

  it("another team's site cannot be changed and stays as it was", async () => {
    const before = await ctx.dataSource
      .getRepository(Site)
      .findOneByOrFail({ id: alder.sites.archived });
    for (const role of ["admin", "lead"] as const) {
      const response = await client(ctx.app, birchCookies[role])
        .patch(`/api/sites/${alder.sites.archived}`)
        .send({ name: "Taken over", archived: false });
      expect(response.status).toBe(404);
    }
    const after = await ctx.dataSource
      .getRepository(Site)
      .findOneByOrFail({ id: alder.sites.archived });
    expect(after).toEqual(before);
  });

  it("another team's members are invisible and cannot be changed or removed", async () => {
    const members = await client(ctx.app, birchCookies.trainee).get("/api/team/members");
    const emails = members.body.map((m: { email: string }) => m.email);
    expect(emails.every((e: string) => e.endsWith("@birch.test"))).toBe(true);
    expect(emails).toHaveLength(4);
    const patch = await client(ctx.app, birchCookies.admin)
      .patch(`/api/team/members/${alder.users.lead.id}`)
      .send({ role: "trainee" });
    expect(patch.status).toBe(404);
    const del = await client(ctx.app, birchCookies.admin).delete(
      `/api/team/members/${alder.users.lead.id}`,
    );
    expect(del.status).toBe(404);
    const membership = await ctx.dataSource
      .getRepository(Membership)
      .findOneByOrFail({ userId: alder.users.lead.id });
    expect(membership.role).toBe("lead");
  });

  it("another team's audit trail, invitations and mail stay hidden", async () => {
    const audit = await client(ctx.app, birchCookies.admin).get("/api/audit?limit=500");
    expect(audit.status).toBe(200);
    const alderIds = new Set([...Object.values(alder.users).map((u) => u.id), alder.sites.active]);
    for (const event of audit.body as { actor: { id: string } | null; targetId: string | null }[]) {
      expect(alderIds.has(event.actor?.id ?? "")).toBe(false);
      expect(alderIds.has(event.targetId ?? "")).toBe(false);
    }
    expect(audit.body.length).toBeGreaterThan(0);

    const invite = await client(ctx.app, cookies.admin)
      .post("/api/invitations")
      .send({ email: "isolation@example.test", role: "lead" });
    const pending = await client(ctx.app, birchCookies.admin).get("/api/invitations");
    expect(pending.body.map((i: { id: string }) => i.id)).not.toContain(invite.body.id);
    const revoke = await client(ctx.app, birchCookies.admin).delete(
      `/api/invitations/${invite.body.id}`,
    );
    expect(revoke.status).toBe(404);
    const row = await ctx.dataSource
      .getRepository(Invitation)
      .findOneByOrFail({ id: invite.body.id });
    expect(row.revokedAt).toBeNull();

    const mail = await client(ctx.app, birchCookies.admin).get(`/api/mailbox/${mailId}`);
    expect(mail.status).toBe(404);
  });
});

describe("team management rules", () => {
  it("an admin cannot demote or remove the team's last admin", async () => {
    const demote = await client(ctx.app, cookies.admin)
      .patch(`/api/team/members/${alder.users.admin.id}`)
      .send({ role: "lead" });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe("last_admin");
    const remove = await client(ctx.app, cookies.admin).delete(
      `/api/team/members/${alder.users.admin.id}`,
    );
    expect(remove.status).toBe(409);
  });

  it("a role change takes effect on the member's next request and is audited", async () => {
    const trainee = await signIn(ctx.app, "trainee@birch.test");
    expect(
      (await client(ctx.app, trainee).post("/api/sites").send({ name: "Too early" })).status,
    ).toBe(403);
    const change = await client(ctx.app, birchCookies.admin)
      .patch(`/api/team/members/${birch.users.trainee.id}`)
      .send({ role: "lead" });
    expect(change.status).toBe(200);
    expect(change.body).toMatchObject({ userId: birch.users.trainee.id, role: "lead" });
    expect(
      (await client(ctx.app, trainee).post("/api/sites").send({ name: "Now allowed" })).status,
    ).toBe(201);
    const audit = await client(ctx.app, birchCookies.admin).get("/api/audit");
    expect(audit.body).toContainEqual(
      expect.objectContaining({
        action: "member.role_change",
        targetId: birch.users.trainee.id,
        detail: expect.objectContaining({ from: "trainee", to: "lead" }),
      }),
    );
  });

  it("removing a member ends their sessions at once", async () => {
    const reviewer = await signIn(ctx.app, "reviewer@birch.test");
    const removed = await client(ctx.app, birchCookies.admin).delete(
      `/api/team/members/${birch.users.reviewer.id}`,
    );
    expect(removed.status).toBe(204);
    expect((await client(ctx.app, reviewer).get("/api/me")).status).toBe(401);
    expect((await client(ctx.app, birchCookies.reviewer).get("/api/me")).status).toBe(401);
    const signInAgain = await client(ctx.app)
      .post("/api/auth/sign-in")
      .send({ email: "reviewer@birch.test", password: "test-password-1" });
    expect(signInAgain.status).toBe(401);
  });
});

describe("sites", () => {
  it("lists active sites by default, archived ones on request, and archives/unarchives with audit", async () => {
    const active = await client(ctx.app, cookies.trainee).get("/api/sites");
    const activeIds = active.body.map((s: { id: string }) => s.id);
    expect(activeIds).toContain(alder.sites.active);
    expect(activeIds).not.toContain(alder.sites.archived);
    const archived = await client(ctx.app, cookies.trainee).get("/api/sites?archived=true");
    expect(archived.body.map((s: { id: string }) => s.id)).toEqual([alder.sites.archived]);

    const restore = await client(ctx.app, cookies.lead)
      .patch(`/api/sites/${alder.sites.archived}`)
      .send({ archived: false, name: "Alder old embankment (reopened)" });
    expect(restore.status).toBe(200);
    expect(restore.body).toMatchObject({
      archived: false,
      name: "Alder old embankment (reopened)",
      planCount: 0,
    });
    const audit = await client(ctx.app, cookies.lead).get("/api/audit");
    const actions = audit.body
      .filter((e: { targetId: string }) => e.targetId === alder.sites.archived)
      .map((e: { action: string }) => e.action);
    expect(actions).toEqual(expect.arrayContaining(["site.unarchive", "site.rename"]));
  });

  it("refuses a duplicate site name within the team (409) but allows it in another team", async () => {
    const created = await client(ctx.app, cookies.lead).post("/api/sites").send({
      name: "Shared Name Hill",
      description: "Peat over boulder clay.",
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({
      name: "Shared Name Hill",
      createdBy: "alder lead",
      archived: false,
    });
    const dup = await client(ctx.app, cookies.admin)
      .post("/api/sites")
      .send({ name: "shared name hill" });
    expect(dup.status).toBe(409);
    expect(dup.body.error.fields.name).toBeDefined();
    const otherTeam = await client(ctx.app, birchCookies.lead)
      .post("/api/sites")
      .send({ name: "Shared Name Hill" });
    expect(otherTeam.status).toBe(201);
  });
});

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Invitation } from "../data/entities/invitation";
import { PasswordReset } from "../data/entities/password-reset";
import { hashToken } from "../domain/secrets";
import {
  client,
  countRows,
  createTestContext,
  linkToken,
  PUBLIC_URL,
  seedTeam,
  sessionCookie,
  signIn,
  TEST_PASSWORD,
  type TestContext,
  type TestTeam,
} from "../testing/harness";

let ctx: TestContext;
let alder: TestTeam;
let birch: TestTeam;
let adminCookie: string;

beforeAll(async () => {
  ctx = await createTestContext();
  alder = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
  birch = await seedTeam(ctx.dataSource, "Birch Test Surveys", "birch");
  adminCookie = await signIn(ctx.app, "admin@alder.test");
});
afterAll(() => ctx.close());

async function invite(email: string, role = "reviewer") {
  const response = await client(ctx.app, adminCookie)
    .post("/api/invitations")
    .send({ email, role });
  expect(response.status).toBe(201);
  const mail = await ctx.mailbox.waitFor((m) => m.to.includes(email.toLowerCase()));
  return { response, mail, token: linkToken(mail.text, "invite") };
}

describe("invitation flow", () => {
  it("e-mails a one-time link that previews, accepts, signs in and then stops working", async () => {
    const { response, mail, token } = await invite("Fenna.Marsh@example.test", "reviewer");
    expect(response.body).toMatchObject({
      email: "fenna.marsh@example.test",
      role: "reviewer",
      invitedBy: "alder admin",
    });
    expect(mail.subject).toBe("Join Alder Test Surveys on Spreadsight");
    expect(mail.text).toContain(`${PUBLIC_URL}/invite/${token}`);
    expect(mail.html).toContain(`${PUBLIC_URL}/invite/${token}`);

    // Only the hash is stored.
    const row = await ctx.dataSource
      .getRepository(Invitation)
      .findOneByOrFail({ id: response.body.id });
    expect(row.tokenHash).toBe(hashToken(token));
    expect(row.tokenHash).not.toContain(token);

    const pending = await client(ctx.app, adminCookie).get("/api/invitations");
    expect(pending.body.map((i: { email: string }) => i.email)).toContain(
      "fenna.marsh@example.test",
    );

    const preview = await client(ctx.app).get(`/api/invitations/token/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({
      email: "fenna.marsh@example.test",
      role: "reviewer",
      teamName: "Alder Test Surveys",
    });

    const accepted = await client(ctx.app)
      .post(`/api/invitations/token/${token}/accept`)
      .send({ name: "Fenna Marsh", password: "a-long-password" });
    expect(accepted.status).toBe(201);
    expect(accepted.body).toMatchObject({
      user: { email: "fenna.marsh@example.test", name: "Fenna Marsh" },
      team: { id: alder.id, name: "Alder Test Surveys" },
      role: "reviewer",
    });
    const cookie = sessionCookie(accepted.headers["set-cookie"]);
    expect((await client(ctx.app, cookie).get("/api/me")).body.role).toBe("reviewer");

    // Single use.
    const again = await client(ctx.app)
      .post(`/api/invitations/token/${token}/accept`)
      .send({ name: "Someone Else", password: "another-password" });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe("invitation_used");
    expect((await client(ctx.app).get(`/api/invitations/token/${token}`)).status).toBe(410);

    // The new member can sign in with the chosen password and appears in the team.
    await signIn(ctx.app, "fenna.marsh@example.test", "a-long-password");
    const members = await client(ctx.app, adminCookie).get("/api/team/members");
    expect(members.body.map((m: { email: string }) => m.email)).toContain(
      "fenna.marsh@example.test",
    );
    const pendingAfter = await client(ctx.app, adminCookie).get("/api/invitations");
    expect(pendingAfter.body.map((i: { email: string }) => i.email)).not.toContain(
      "fenna.marsh@example.test",
    );

    const audit = await client(ctx.app, adminCookie).get("/api/audit");
    const actions = audit.body.map((e: { action: string }) => e.action);
    expect(actions).toContain("invitation.create");
    expect(actions).toContain("invitation.accept");
  });

  it("answers 404 for an unknown token and 400 for a malformed one", async () => {
    expect((await client(ctx.app).get(`/api/invitations/token/${"a".repeat(32)}`)).status).toBe(
      404,
    );
    const malformed = await client(ctx.app).get("/api/invitations/token/not-a-token");
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields.token).toBeDefined();
  });

  it("refuses an expired invitation with 410 and creates nothing", async () => {
    const { response, token } = await invite("late.comer@example.test", "trainee");
    await ctx.dataSource
      .getRepository(Invitation)
      .update({ id: response.body.id }, { expiresAt: new Date(Date.now() - 1000) });
    const before = await countRows(ctx.dataSource);
    const accept = await client(ctx.app)
      .post(`/api/invitations/token/${token}/accept`)
      .send({ name: "Late Comer", password: "a-long-password" });
    expect(accept.status).toBe(410);
    expect(accept.body.error.code).toBe("invitation_expired");
    expect(await countRows(ctx.dataSource)).toEqual(before);
    const pending = await client(ctx.app, adminCookie).get("/api/invitations");
    expect(pending.body.map((i: { email: string }) => i.email)).not.toContain(
      "late.comer@example.test",
    );
  });

  it("revoking makes the link answer 410; re-inviting keeps only the newest link", async () => {
    const first = await invite("twice@example.test", "lead");
    const second = await invite("twice@example.test", "trainee");
    const old = await client(ctx.app).get(`/api/invitations/token/${first.token}`);
    expect(old.status).toBe(410);
    expect(old.body.error.code).toBe("invitation_revoked");
    expect((await client(ctx.app).get(`/api/invitations/token/${second.token}`)).body.role).toBe(
      "trainee",
    );
    const revoke = await client(ctx.app, adminCookie).delete(
      `/api/invitations/${second.response.body.id}`,
    );
    expect(revoke.status).toBe(204);
    expect((await client(ctx.app).get(`/api/invitations/token/${second.token}`)).status).toBe(410);
  });

  it("refuses to invite a current member of the team (409) and sends nothing", async () => {
    const before = await countRows(ctx.dataSource);
    const response = await client(ctx.app, adminCookie)
      .post("/api/invitations")
      .send({ email: "lead@alder.test", role: "lead" });
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe("already_member");
    expect(await countRows(ctx.dataSource)).toEqual(before);
  });

  it("does not let an address that belongs to another team's member take a second team", async () => {
    const { token } = await invite("trainee@birch.test", "lead");
    const accept = await client(ctx.app)
      .post(`/api/invitations/token/${token}/accept`)
      .send({ name: "Double Agent", password: "a-long-password" });
    expect(accept.status).toBe(409);
    expect(accept.body.error.code).toBe("account_exists");
    const me = await client(ctx.app, await signIn(ctx.app, "trainee@birch.test")).get("/api/me");
    expect(me.body.team.id).toBe(birch.id);
  });

  it("re-admits a removed member through a new invitation", async () => {
    const removed = await client(ctx.app, adminCookie).delete(
      `/api/team/members/${alder.users.trainee.id}`,
    );
    expect(removed.status).toBe(204);
    const { token } = await invite("trainee@alder.test", "lead");
    const accept = await client(ctx.app)
      .post(`/api/invitations/token/${token}/accept`)
      .send({ name: "Returning Trainee", password: "a-new-long-password" });
    expect(accept.status).toBe(201);
    expect(accept.body).toMatchObject({ user: { id: alder.users.trainee.id }, role: "lead" });
  });

  it("validates the accept form and the invite form with field errors", async () => {
    const { token } = await invite("form.check@example.test");
    const accept = await client(ctx.app)
      .post(`/api/invitations/token/${token}/accept`)
      .send({ name: "", password: "short" });
    expect(accept.status).toBe(400);
    expect(accept.body.error.fields).toEqual({
      name: ["name is required"],
      password: ["password must be at least 10 characters"],
    });
    const inviteBad = await client(ctx.app, adminCookie)
      .post("/api/invitations")
      .send({ email: "not-an-address", role: "boss" });
    expect(inviteBad.status).toBe(400);
    expect(Object.keys(inviteBad.body.error.fields).sort()).toEqual(["email", "role"]);
  });

  it("shows each team's admins only their own team's mail", async () => {
    const birchAdmin = await signIn(ctx.app, "admin@birch.test");
    const birchMail = await client(ctx.app, birchAdmin).get("/api/mailbox");
    expect(birchMail.status).toBe(200);
    expect(birchMail.body).toEqual([]);
    const alderMail = await client(ctx.app, adminCookie).get("/api/mailbox");
    expect(alderMail.body.length).toBeGreaterThan(0);
    const first = alderMail.body[0];
    expect((await client(ctx.app, adminCookie).get(`/api/mailbox/${first.id}`)).body).toEqual(
      first,
    );
    expect((await client(ctx.app, birchAdmin).get(`/api/mailbox/${first.id}`)).status).toBe(404);
    // Newest first.
    const times = alderMail.body.map((m: { receivedAt: string }) => m.receivedAt);
    expect([...times].sort().reverse()).toEqual(times);
  });
});

describe("password reset", () => {
  async function requestReset(email: string) {
    const response = await client(ctx.app).post("/api/auth/password-reset").send({ email });
    expect(response.status).toBe(202);
  }

  it("answers 202 for unknown addresses too and sends nothing", async () => {
    const before = (await ctx.mailbox.all()).length;
    await requestReset("nobody-here@example.test");
    await new Promise((r) => setTimeout(r, 100));
    expect((await ctx.mailbox.all()).length).toBe(before);
  });

  it("e-mails a link that sets a new password once and signs the account out everywhere", async () => {
    const oldSession = await signIn(ctx.app, "reviewer@alder.test");
    await requestReset("REVIEWER@alder.test");
    const mail = await ctx.mailbox.waitFor(
      (m) => m.to.includes("reviewer@alder.test") && m.subject.includes("Reset"),
    );
    const token = linkToken(mail.text, "reset");
    const reset = await client(ctx.app)
      .post(`/api/auth/password-reset/${token}`)
      .send({ password: "brand-new-password" });
    expect(reset.status).toBe(204);
    expect((await client(ctx.app, oldSession).get("/api/me")).status).toBe(401);
    const oldPassword = await client(ctx.app)
      .post("/api/auth/sign-in")
      .send({ email: "reviewer@alder.test", password: TEST_PASSWORD });
    expect(oldPassword.status).toBe(401);
    await signIn(ctx.app, "reviewer@alder.test", "brand-new-password");

    const reuse = await client(ctx.app)
      .post(`/api/auth/password-reset/${token}`)
      .send({ password: "yet-another-password" });
    expect(reuse.status).toBe(410);
    expect(reuse.body.error.code).toBe("reset_used");
  });

  it("refuses an expired link with 410 and leaves the password alone", async () => {
    await requestReset("lead@alder.test");
    const mail = await ctx.mailbox.waitFor(
      (m) => m.to.includes("lead@alder.test") && m.subject.includes("Reset"),
    );
    const token = linkToken(mail.text, "reset");
    await ctx.dataSource
      .getRepository(PasswordReset)
      .update({ tokenHash: hashToken(token) }, { expiresAt: new Date(Date.now() - 1) });
    const response = await client(ctx.app)
      .post(`/api/auth/password-reset/${token}`)
      .send({ password: "brand-new-password" });
    expect(response.status).toBe(410);
    expect(response.body.error.code).toBe("reset_expired");
    await signIn(ctx.app, "lead@alder.test", TEST_PASSWORD);
  });

  it("answers 404 for an unknown reset token and 400 for a short password", async () => {
    const unknown = await client(ctx.app)
      .post(`/api/auth/password-reset/${"b".repeat(32)}`)
      .send({ password: "brand-new-password" });
    expect(unknown.status).toBe(404);
    const short = await client(ctx.app)
      .post(`/api/auth/password-reset/${"b".repeat(32)}`)
      .send({ password: "short" });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toEqual(["password must be at least 10 characters"]);
  });

  it("rate-limits reset requests per IP", async () => {
    const limited = await createTestContext({
      rateLimits: { passwordResetPerIp: { limit: 2, windowMs: 60_000 } },
    });
    try {
      for (let i = 0; i < 2; i++) {
        const r = await client(limited.app)
          .post("/api/auth/password-reset")
          .send({ email: `x${i}@example.test` });
        expect(r.status).toBe(202);
      }
      const blocked = await client(limited.app)
        .post("/api/auth/password-reset")
        .send({ email: "x3@example.test" });
      expect(blocked.status).toBe(429);
      expect(blocked.headers["retry-after"]).toBeDefined();
    } finally {
      await limited.close();
    }
  });
});

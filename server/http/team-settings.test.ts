/**
 * Team settings (issue 14): the seismograph channel count is stored on the team. Every member
 * reads it, only an admin changes it (design.md: the admin runs the team), each change is one
 * audit row, bad input is refused naming the field, and another team neither sees nor changes it.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ROLES, type Role } from "@/contracts/common";
import { AuditEvent } from "../data/entities/audit-event";
import { Team } from "../data/entities/team";
import {
  client,
  createTestContext,
  seedTeam,
  signIn,
  type TestContext,
  type TestTeam,
} from "../testing/harness";

let ctx: TestContext;
let alder: TestTeam;
let birch: TestTeam;
const cookies = {} as Record<Role, string>;
const birchCookies = {} as Record<Role, string>;

beforeAll(async () => {
  ctx = await createTestContext();
  alder = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
  birch = await seedTeam(ctx.dataSource, "Birch Test Surveys", "birch");
  for (const role of ROLES) {
    cookies[role] = await signIn(ctx.app, `${role}@alder.test`);
    birchCookies[role] = await signIn(ctx.app, `${role}@birch.test`);
  }
});
afterAll(() => ctx.close());

const channelsOf = async (teamId: string) =>
  (await ctx.dataSource.getRepository(Team).findOneByOrFail({ id: teamId })).seismographChannels;
const changeEvents = (teamId: string) =>
  ctx.dataSource
    .getRepository(AuditEvent)
    .find({ where: { teamId, action: "team.channels_change" }, order: { createdAt: "ASC" } });

describe("GET /api/team/settings", () => {
  it("gives every role the team's channel count, 48 for a team that never set it", async () => {
    for (const role of ROLES) {
      const response = await client(ctx.app, cookies[role]).get("/api/team/settings");
      expect(response.status).toBe(200);
      expect(response.body).toEqual({ seismographChannels: 48 });
    }
  });

  it("refuses an anonymous caller and unknown query parameters", async () => {
    expect((await client(ctx.app).get("/api/team/settings")).status).toBe(401);
    const query = await client(ctx.app, cookies.lead).get("/api/team/settings?team=birch");
    expect(query.status).toBe(400);
    expect(query.body.error.code).toBe("invalid_input");
  });
});

describe("PATCH /api/team/settings", () => {
  it("lets an admin change the count, records it once, and every member then reads it", async () => {
    const response = await client(ctx.app, cookies.admin)
      .patch("/api/team/settings")
      .send({ seismographChannels: 24 });
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ seismographChannels: 24 });
    expect(await channelsOf(alder.id)).toBe(24);
    const read = await client(ctx.app, cookies.trainee).get("/api/team/settings");
    expect(read.body).toEqual({ seismographChannels: 24 });

    const events = await changeEvents(alder.id);
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({
      actorId: alder.users.admin.id,
      targetType: "team",
      targetId: alder.id,
      detail: { from: 48, to: 24 },
    });
    // The team's activity list carries it.
    const audit = await client(ctx.app, cookies.lead).get("/api/audit");
    expect(audit.body.map((e: { action: string }) => e.action)).toContain("team.channels_change");

    // The same value again changes nothing and records nothing.
    const again = await client(ctx.app, cookies.admin)
      .patch("/api/team/settings")
      .send({ seismographChannels: 24 });
    expect(again.status).toBe(200);
    expect(await changeEvents(alder.id)).toHaveLength(1);
  });

  it("refuses the lead, reviewer and trainee (403) and an anonymous caller (401)", async () => {
    const before = await channelsOf(alder.id);
    for (const role of ["lead", "reviewer", "trainee"] as const) {
      const response = await client(ctx.app, cookies[role])
        .patch("/api/team/settings")
        .send({ seismographChannels: 96 });
      expect(response.status).toBe(403);
      expect(response.body.error.code).toBe("forbidden");
    }
    const anonymous = await client(ctx.app)
      .patch("/api/team/settings")
      .send({ seismographChannels: 96 });
    expect(anonymous.status).toBe(401);
    expect(await channelsOf(alder.id)).toBe(before);
  });

  it.each([
    [{ seismographChannels: 1 }, "seismographChannels must be at least 2"],
    [{ seismographChannels: 1025 }, "seismographChannels must be at most 1024"],
    [{ seismographChannels: 24.5 }, "seismographChannels must be a whole number"],
    [{ seismographChannels: "24" }, "seismographChannels must be a whole number"],
    [{}, "seismographChannels must be a whole number"],
  ])("refuses %j naming the field and writes nothing", async (body, message) => {
    const before = await channelsOf(alder.id);
    const eventsBefore = (await changeEvents(alder.id)).length;
    const response = await client(ctx.app, cookies.admin).patch("/api/team/settings").send(body);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("invalid_input");
    expect(response.body.error.fields.seismographChannels).toEqual([message]);
    expect(await channelsOf(alder.id)).toBe(before);
    expect(await changeEvents(alder.id)).toHaveLength(eventsBefore);
  });

  it("refuses unknown fields, so a team id in the body cannot redirect the change", async () => {
    const response = await client(ctx.app, cookies.admin)
      .patch("/api/team/settings")
      .send({ seismographChannels: 96, teamId: birch.id });
    expect(response.status).toBe(400);
    expect(response.body.error.fields.teamId).toEqual(["unknown field"]);
    expect(await channelsOf(birch.id)).toBe(48);
  });

  it("accepts the limits 2 and 1024 (the plan format's MAX_CHANNELS)", async () => {
    for (const n of [2, 1024]) {
      const response = await client(ctx.app, cookies.admin)
        .patch("/api/team/settings")
        .send({ seismographChannels: n });
      expect(response.status).toBe(200);
      expect(await channelsOf(alder.id)).toBe(n);
    }
  });
});

describe("team isolation", () => {
  it("another team's admin changes only their own team, and each team reads its own", async () => {
    await client(ctx.app, cookies.admin)
      .patch("/api/team/settings")
      .send({ seismographChannels: 24 });
    const birchChange = await client(ctx.app, birchCookies.admin)
      .patch("/api/team/settings")
      .send({ seismographChannels: 96 });
    expect(birchChange.status).toBe(200);
    expect(await channelsOf(alder.id)).toBe(24);
    expect(await channelsOf(birch.id)).toBe(96);
    expect((await client(ctx.app, birchCookies.trainee).get("/api/team/settings")).body).toEqual({
      seismographChannels: 96,
    });
    expect((await client(ctx.app, cookies.trainee).get("/api/team/settings")).body).toEqual({
      seismographChannels: 24,
    });
    // Birch's change is in Birch's trail only.
    const alderTrail = await client(ctx.app, cookies.admin).get("/api/audit?limit=500");
    const alderChanges = (alderTrail.body as { action: string; detail: { to: number } }[]).filter(
      (e) => e.action === "team.channels_change",
    );
    expect(alderChanges.map((e) => e.detail.to)).not.toContain(96);
  });
});

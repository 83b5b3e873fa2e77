/**
 * The database layer behaves the same on SQLite (project `server`) and PostgreSQL (project
 * `server-pg`): migrations, column types, JSON, time stamps, unique and foreign keys, cascades,
 * and racing plan saves (exactly one wins).
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { DataSource } from "typeorm";
import { client, createTestContext, seedTeam, signIn, type TestContext } from "../testing/harness";
import { testDatabaseKind } from "../testing/database";
import { createPlan, thinLayerDocument } from "../testing/plans";
import { databaseKind } from "./data-source";
import { AuditEvent, MailMessage, Membership, PlanRevision, Team, User } from "./entities";
import { migrations } from "./migrations";

let ctx: TestContext;
let ds: DataSource;

beforeAll(async () => {
  ctx = await createTestContext();
  ds = ctx.dataSource;
});
afterAll(() => ctx.close());

async function insertUser(email: string): Promise<string> {
  const id = randomUUID();
  const now = new Date();
  await ds.getRepository(User).insert({
    id,
    email,
    name: "Test Person",
    passwordHash: "x",
    createdAt: now,
    updatedAt: now,
  });
  return id;
}

describe(`the ${testDatabaseKind()} database`, () => {
  it("is the database this test project asked for", () => {
    expect(databaseKind(ds)).toBe(testDatabaseKind());
  });

  it("has run every migration, oldest first", async () => {
    const ran = (await ds.query(`SELECT name FROM "migrations" ORDER BY id`)) as {
      name: string;
    }[];
    expect(ran.map((m) => m.name)).toEqual(migrations.map((m) => new m().name));
  });

  it("stores time stamps as points in time and binary as bytes (per-driver column types)", async () => {
    const type = async (table: string, column: string) => {
      if (databaseKind(ds) === "postgres") {
        const [row] = (await ds.query(
          `SELECT data_type FROM information_schema.columns WHERE table_name = $1 AND column_name = $2`,
          [table, column],
        )) as { data_type: string }[];
        return row.data_type;
      }
      const info = (await ds.query(`PRAGMA table_info("${table}")`)) as {
        name: string;
        type: string;
      }[];
      return info.find((c) => c.name === column)!.type.toLowerCase();
    };
    const expected =
      databaseKind(ds) === "postgres"
        ? { time: "timestamp with time zone", bytes: "bytea" }
        : { time: "datetime", bytes: "blob" };
    expect(await type("users", "createdAt")).toBe(expected.time);
    expect(await type("attachments", "content")).toBe(expected.bytes);
  });

  it("gives back the same instant to the millisecond", async () => {
    const when = new Date(Date.UTC(2026, 11, 2, 23, 59, 58, 123));
    const id = randomUUID();
    await ds.getRepository(Team).insert({ id, name: "Clock team", createdAt: when });
    const row = await ds.getRepository(Team).findOneByOrFail({ id });
    expect(row.createdAt).toBeInstanceOf(Date);
    expect(row.createdAt.toISOString()).toBe("2026-12-02T23:59:58.123Z");
  });

  it("round-trips JSON columns (nested values, unicode, null) unchanged", async () => {
    const team = randomUUID();
    await ds.getRepository(Team).insert({ id: team, name: "JSON team", createdAt: new Date() });
    const detail = { name: "Hangfuß – Süd 🙂", count: 3, ratio: 0.125, ok: true, none: null };
    const id = randomUUID();
    await ds.getRepository(AuditEvent).insert({
      id,
      teamId: team,
      actorId: null,
      action: "site.create",
      targetType: "site",
      targetId: null,
      detail,
      createdAt: new Date(),
    });
    expect((await ds.getRepository(AuditEvent).findOneByOrFail({ id })).detail).toEqual(detail);
    const mailId = randomUUID();
    await ds.getRepository(MailMessage).insert({
      id: mailId,
      teamId: null,
      from: "a@b.test",
      to: ["x@y.test", "z@y.test"],
      subject: "s",
      text: "t",
      html: null,
      receivedAt: new Date(),
    });
    const mail = await ds.getRepository(MailMessage).findOneByOrFail({ id: mailId });
    expect(mail.to).toEqual(["x@y.test", "z@y.test"]);
    expect(mail.html).toBeNull();
  });

  it("refuses a second user with the same e-mail (unique key)", async () => {
    await insertUser("twice@unique.test");
    await expect(insertUser("twice@unique.test")).rejects.toThrow(/unique/i);
    expect(await ds.getRepository(User).countBy({ email: "twice@unique.test" })).toBe(1);
  });

  it("refuses a membership of a team that does not exist (foreign key)", async () => {
    const userId = await insertUser("orphan@fk.test");
    await expect(
      ds.getRepository(Membership).insert({
        id: randomUUID(),
        teamId: randomUUID(),
        userId,
        role: "lead",
        createdAt: new Date(),
      }),
    ).rejects.toThrow(/foreign key/i);
  });

  it("refuses a role outside the list (check constraint)", async () => {
    const teamId = randomUUID();
    await ds.getRepository(Team).insert({ id: teamId, name: "Check team", createdAt: new Date() });
    const userId = await insertUser("check@role.test");
    await expect(
      ds.getRepository(Membership).insert({
        id: randomUUID(),
        teamId,
        userId,
        role: "owner" as "lead",
        createdAt: new Date(),
      }),
    ).rejects.toThrow(/check/i);
  });

  it("deletes a team's memberships with the team (cascade)", async () => {
    const teamId = randomUUID();
    await ds.getRepository(Team).insert({ id: teamId, name: "Gone team", createdAt: new Date() });
    const userId = await insertUser("cascade@fk.test");
    await ds
      .getRepository(Membership)
      .insert({ id: randomUUID(), teamId, userId, role: "lead", createdAt: new Date() });
    await ds.getRepository(Team).delete({ id: teamId });
    expect(await ds.getRepository(Membership).countBy({ teamId })).toBe(0);
  });

  it("of several saves racing from the same revision, exactly one wins; the rest get 409", async () => {
    const team = await seedTeam(ds, "Race team", "race");
    const lead = client(ctx.app, await signIn(ctx.app, team.users.lead.email));
    const admin = client(ctx.app, await signIn(ctx.app, team.users.admin.email));
    const plan = await createPlan(lead, team.sites.active, "Raced plan");
    const racers = [1.0, 1.5, 2.0, 2.5, 3.0, 3.5].map((thickness, i) =>
      (i % 2 ? admin : lead)
        .put(`/api/plans/${plan.id}`)
        .send({ baseRevision: 1, document: thinLayerDocument(thickness) }),
    );
    const responses = await Promise.all(racers);
    const statuses = responses.map((r) => r.status).sort();
    expect(statuses).toEqual([200, 409, 409, 409, 409, 409]);
    for (const r of responses.filter((r) => r.status === 409)) {
      expect(r.body.error.code).toBe("revision_conflict");
    }
    const numbers = (await ds.getRepository(PlanRevision).findBy({ planId: plan.id }))
      .map((r) => r.number)
      .sort();
    expect(numbers).toEqual([1, 2]);
  });
});

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { DataSource } from "typeorm";
import { analyzePlan, parsePlan } from "@engine";
import { createTestDatabase, type TestDatabase } from "../testing/database";
import { openDatabase } from "./data-source";
import { PlanComment } from "./entities/comment";
import { PlanNotification } from "./entities/notification";
import { Plan } from "./entities/plan";
import { PlanRevision } from "./entities/plan-revision";
import { seedDemo } from "./seed-demo";

let database: TestDatabase;
let dataSource: DataSource;

beforeAll(async () => {
  database = await createTestDatabase();
  dataSource = await openDatabase(database.options);
  await seedDemo(dataSource);
});
afterAll(async () => {
  await dataSource.destroy();
  await database.drop();
});

const plans = () => dataSource.getRepository(Plan).find({ order: { name: "ASC" } });
const byName = async (start: string) => (await plans()).find((p) => p.name.startsWith(start))!;
const revisions = (planId: string) =>
  dataSource.getRepository(PlanRevision).find({ where: { planId }, order: { number: "ASC" } });

describe("demo plans", () => {
  it("every stored document is valid and its stored verdict is the engine's", async () => {
    for (const plan of await plans()) {
      for (const revision of await revisions(plan.id)) {
        const parsed = parsePlan(revision.document);
        expect(parsed.ok, `${plan.name} r${revision.number}`).toBe(true);
        if (parsed.ok) expect(revision.worstVerdict).toBe(analyzePlan(parsed.plan).worstStatus);
      }
    }
  });

  it("has a draft whose thin clay lens the default spread misses", async () => {
    const plan = await byName("Cutting line A");
    expect(plan.status).toBe("draft");
    const [revision] = await revisions(plan.id);
    const lens = revision.summary!.models[0].refractors.find((r) => r.name === "soft clay lens")!;
    expect(["blind", "under-sampled"]).toContain(lens.status);
    expect(revision.document.spread).toMatchObject({ spacing: 3, channels: 24 });
  });

  it("has a plan in review with a velocity inversion", async () => {
    const plan = await byName("Cell 4");
    expect(plan.status).toBe("in-review");
    expect(plan.worstVerdict).toBe("inverted");
  });

  it("has an approved plan with a review cycle and a resolved thread", async () => {
    const plan = await byName("Cutting line B");
    expect(plan.status).toBe("approved");
    const [first, second] = await revisions(plan.id);
    expect(first.worstVerdict).not.toBe("resolved");
    expect(second.worstVerdict).toBe("resolved");
    const comments = await dataSource.getRepository(PlanComment).findBy({ planId: plan.id });
    const root = comments.find((c) => c.parentId === null && c.revision === 1)!;
    expect(root.resolvedAt).not.toBeNull();
    expect(comments.some((c) => c.parentId === root.id)).toBe(true);
    const notifications = await dataSource.getRepository(PlanNotification).findBy({ planId: plan.id });
    expect(new Set(notifications.map((n) => n.kind))).toEqual(
      new Set(["submitted", "mention", "decision", "reply"]),
    );
  });

  it("has a trainee sandbox scenario", async () => {
    const sandbox = (await plans()).filter((p) => p.sandbox);
    expect(sandbox).toHaveLength(1);
  });

  it("is inserted once, and added to a demo database that predates plans", async () => {
    const count = (await plans()).length;
    await seedDemo(dataSource);
    expect((await plans()).length).toBe(count);
    await dataSource.query(`DELETE FROM "plans"`);
    await seedDemo(dataSource);
    expect((await plans()).length).toBe(count);
  });
});

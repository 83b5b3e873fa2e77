/**
 * Uploads in an S3-compatible object store (a local s3rver started here) and in the database,
 * on this project's database: bytes round-trip, downloads stream, deleting an attachment
 * deletes its object, deleting a plan (a cascade) leaves objects the sweep removes, and a
 * refused upload leaves nothing behind.
 */
import { readFileSync } from "node:fs";
import { HeadObjectCommand } from "@aws-sdk/client-s3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Plan as PlanDocument } from "@engine";
import { syntheticShotRecord } from "../../workers/field/__fixtures__/shot-record";
import { client, createTestContext, seedTeam, signIn, type TestContext } from "../testing/harness";
import { startFakeS3, type FakeS3 } from "../testing/fake-s3";
import { Attachment } from "./entities/attachment";
import { Plan } from "./entities/plan";
import {
  databaseFileStore,
  fileStoreOf,
  s3FileStore,
  sweepOrphanObjects,
  useFileStore,
} from "./file-store";

const document = JSON.parse(
  readFileSync("docs/examples/two-layer-simple.json", "utf8"),
) as PlanDocument;
const record = Buffer.from(
  syntheticShotRecord({ model: document.models[0], spread: document.spread, shotIndex: 0 }).bytes,
);

let ctx: TestContext;
let s3: FakeS3;
let store: ReturnType<typeof s3FileStore>;
let lead: ReturnType<typeof client>;
let siteId: string;

beforeAll(async () => {
  s3 = await startFakeS3("file-store-test");
  ctx = await createTestContext();
  store = s3FileStore({ ...s3.settings, prefix: "t/" });
  useFileStore(ctx.dataSource, store);
  const team = await seedTeam(ctx.dataSource, "Object Store Surveys", "objects");
  lead = client(ctx.app, await signIn(ctx.app, team.users.lead.email));
  siteId = team.sites.active;
});
afterAll(async () => {
  await ctx.close();
  await s3.close();
});

async function newPlan(name: string): Promise<string> {
  const created = await lead.post(`/api/sites/${siteId}/plans`).send({ name, document });
  expect(created.status).toBe(201);
  return created.body.id as string;
}

const upload = (planId: string, bytes: Buffer, name = "shot.sg2") =>
  lead
    .post(`/api/plans/${planId}/attachments`)
    .field("kind", "seg2")
    .attach("file", bytes, name);

const download = (id: string) =>
  lead
    .get(`/api/attachments/${id}/content`)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => done(null, Buffer.concat(chunks)));
    });

async function objectExists(key: string): Promise<boolean> {
  try {
    await store.client.send(new HeadObjectCommand({ Bucket: s3.settings.bucket, Key: key }));
    return true;
  } catch {
    return false;
  }
}

async function row(id: string) {
  return ctx.dataSource
    .getRepository(Attachment)
    .createQueryBuilder("a")
    .addSelect("a.content")
    .where("a.id = :id", { id })
    .getOneOrFail();
}

describe("object storage", () => {
  it("puts the bytes in the bucket (the row keeps only the key) and streams them back", async () => {
    const planId = await newPlan("Object line");
    const response = await upload(planId, record);
    expect(response.status).toBe(201);
    const stored = await row(response.body.attachment.id);
    expect(stored.objectKey).toMatch(new RegExp(`^t/attachments/.+/${planId}/${stored.id}$`));
    expect(stored.content.length).toBe(0);
    expect(await objectExists(stored.objectKey!)).toBe(true);
    const got = await download(stored.id);
    expect(got.status).toBe(200);
    expect(Buffer.compare(got.body as Buffer, record)).toBe(0);
  });

  it("deleting an attachment deletes its object", async () => {
    const planId = await newPlan("Delete one");
    const response = await upload(planId, record);
    const stored = await row(response.body.attachment.id);
    expect((await lead.delete(`/api/attachments/${stored.id}`)).status).toBe(204);
    expect(await objectExists(stored.objectKey!)).toBe(false);
  });

  it("deleting a plan (the rows go by cascade) lets the sweep delete its objects, and only those", async () => {
    const gone = await newPlan("Deleted plan");
    const kept = await newPlan("Kept plan");
    const goneRow = await row((await upload(gone, record, "a.sg2")).body.attachment.id);
    const keptRow = await row((await upload(kept, record, "b.sg2")).body.attachment.id);
    await ctx.dataSource.getRepository(Plan).delete({ id: gone });
    expect(await ctx.dataSource.getRepository(Attachment).countBy({ planId: gone })).toBe(0);
    // A fresh object is never swept (its row may still be on its way)…
    expect(await sweepOrphanObjects(ctx.dataSource)).toBe(0);
    expect(await objectExists(goneRow.objectKey!)).toBe(true);
    // …an old orphan is.
    const later = new Date(Date.now() + 2 * 60 * 60 * 1000);
    expect(await sweepOrphanObjects(ctx.dataSource, { now: later })).toBe(1);
    expect(await objectExists(goneRow.objectKey!)).toBe(false);
    expect(await objectExists(keptRow.objectKey!)).toBe(true);
  });

  it("a refused upload leaves no object and no row", async () => {
    const planId = await newPlan("Refused upload");
    const before: string[] = [];
    for await (const o of store.list()) before.push(o.key);
    const response = await upload(planId, Buffer.from("not a SEG-2 record at all"));
    expect(response.status).toBe(422);
    const after: string[] = [];
    for await (const o of store.list()) after.push(o.key);
    expect(after).toEqual(before);
    expect(await ctx.dataSource.getRepository(Attachment).countBy({ planId })).toBe(0);
  });
});

describe("database storage", () => {
  it("keeps the bytes in the row when no object store is set, and streams them back", async () => {
    useFileStore(ctx.dataSource, databaseFileStore);
    try {
      expect(fileStoreOf(ctx.dataSource).kind).toBe("database");
      const planId = await newPlan("Row line");
      const response = await upload(planId, record);
      expect(response.status).toBe(201);
      const stored = await row(response.body.attachment.id);
      expect(stored.objectKey).toBeNull();
      expect(Buffer.compare(Buffer.from(stored.content), record)).toBe(0);
      const got = await download(stored.id);
      expect(Buffer.compare(got.body as Buffer, record)).toBe(0);
    } finally {
      useFileStore(ctx.dataSource, store);
    }
  });

  it("an older upload kept in the row stays readable after object storage is turned on", async () => {
    useFileStore(ctx.dataSource, databaseFileStore);
    const planId = await newPlan("Before the bucket");
    const response = await upload(planId, record);
    useFileStore(ctx.dataSource, store);
    const got = await download(response.body.attachment.id);
    expect(got.status).toBe(200);
    expect(Buffer.compare(got.body as Buffer, record)).toBe(0);
  });
});

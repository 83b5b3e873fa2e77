import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { findMaterial, type Plan as PlanDocument } from "@engine";
import { ATTACHMENT_LIMITS } from "@/contracts/field";
import { syntheticShotRecord } from "../../../workers/field/__fixtures__/shot-record";
import {
  client,
  createTestContext,
  seedTeam,
  signIn,
  type TestContext,
  type TestTeam,
} from "../../testing/harness";

let ctx: TestContext;
let alder: TestTeam;
let leadCookie: string;
let planId: string;
let otherPlanId: string;
const document = JSON.parse(
  readFileSync("docs/examples/two-layer-simple.json", "utf8"),
) as PlanDocument;

beforeAll(async () => {
  ctx = await createTestContext();
  alder = await seedTeam(ctx.dataSource, "Alder Test Surveys", "alder");
  leadCookie = await signIn(ctx.app, "lead@alder.test");
  const lead = client(ctx.app, leadCookie);
  const created = await lead
    .post(`/api/sites/${alder.sites.active}/plans`)
    .send({ name: "Pilot line", document });
  expect(created.status).toBe(201);
  planId = created.body.id;
  const other = await lead
    .post(`/api/sites/${alder.sites.active}/plans`)
    .send({ name: "Second line", document });
  otherPlanId = other.body.id;
});
afterAll(() => ctx.close());

const upload = (kind: string, name: string, content: Buffer | string, extra = {}) => {
  let req = client(ctx.app, leadCookie)
    .post(`/api/plans/${planId}/attachments`)
    .field("kind", kind);
  for (const [k, v] of Object.entries(extra)) req = req.field(k, String(v));
  return req.attach("file", Buffer.isBuffer(content) ? content : Buffer.from(content), name);
};

async function fieldRowCounts() {
  const count = async (sql: string) => ((await ctx.dataSource.query(sql)) as { n: number }[])[0].n;
  return {
    attachments: await count(`SELECT COUNT(*) AS n FROM attachments`),
    audit: await count(`SELECT COUNT(*) AS n FROM audit_events`),
    picks: await count(`SELECT COUNT(*) AS n FROM pick_sets`),
  };
}

const shot = () =>
  syntheticShotRecord({ model: document.models[0], spread: document.spread, shotIndex: 0 });

describe("uploads", () => {
  it("stores a SEG-2 record against the latest revision and gives back the same bytes", async () => {
    const record = shot();
    const response = await upload("seg2", "pilot-shot-A.sg2", Buffer.from(record.bytes));
    expect(response.status).toBe(201);
    const a = response.body.attachment;
    expect(a).toMatchObject({ kind: "seg2", revision: 1, fileName: "pilot-shot-A.sg2" });
    expect(a.facts).toMatchObject({
      kind: "seg2",
      traces: document.spread.channels,
      byteOrder: "little",
      sourcePositions: [document.spread.shots[0].position],
      tracesWithReceiver: document.spread.channels,
    });
    expect(a.sha256).toBe(createHash("sha256").update(record.bytes).digest("hex"));
    const content = await client(ctx.app, leadCookie)
      .get(`/api/attachments/${a.id}/content`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on("data", (c: Buffer) => chunks.push(c));
        res.on("end", () => done(null, Buffer.concat(chunks)));
      });
    expect(content.status).toBe(200);
    expect(Buffer.compare(content.body as Buffer, Buffer.from(record.bytes))).toBe(0);
    expect(content.headers["content-disposition"]).toContain("pilot-shot-A.sg2");
    const list = await client(ctx.app, leadCookie).get(`/api/plans/${planId}/attachments`);
    expect(list.body.map((x: { id: string }) => x.id)).toContain(a.id);
  });

  it("reads a picks CSV with the unit from its header and returns the picks in seconds", async () => {
    const csv = "shot_m,geophone_m,time_ms\n-1,0,1.8\n-1,2,5.5\n-1,4,9.1\n";
    const response = await upload("picks", "picks.csv", csv);
    expect(response.status).toBe(201);
    expect(response.body.attachment.facts).toMatchObject({
      kind: "picks",
      picks: 3,
      timeUnit: "ms",
    });
    expect(response.body.picks).toEqual([
      { sourcePosition: -1, receiverPosition: 0, time: 0.0018, origin: "csv" },
      { sourcePosition: -1, receiverPosition: 2, time: 0.0055, origin: "csv" },
      { sourcePosition: -1, receiverPosition: 4, time: 0.0091, origin: "csv" },
    ]);
  });

  it("takes the time unit chosen on upload for a bare time column", async () => {
    const response = await upload("picks", "bare.csv", "shot,geophone,time\n0,10,0.02\n", {
      timeUnit: "s",
    });
    expect(response.status).toBe(201);
    expect(response.body.picks[0].time).toBeCloseTo(0.02, 12);
  });

  it("builds a ground model from a borehole log, filling missing velocities from the material table", async () => {
    const csv =
      "depth_from,depth_to,material,velocity\n0,2.5,topsoil,420\n2.5,7,clay,\n7,12,sandstone,\n";
    const response = await upload("borehole", "BH-3.csv", csv, { modelName: "Borehole BH-3" });
    expect(response.status).toBe(201);
    const model = response.body.model;
    expect(model.name).toBe("Borehole BH-3");
    expect(model.layers).toHaveLength(3);
    expect(model.layers[0]).toMatchObject({ velocity: 420, thickness: 2.5 });
    expect(model.layers[1].velocity).toBe(findMaterial("clay")?.typical);
    expect(model.layers[1].thickness).toBeCloseTo(4.5, 9);
    expect(model.layers[2].velocity).toBe(findMaterial("sandstone")?.typical);
    expect(model.layers[2].thickness).toBeUndefined();
    expect(response.body.attachment.facts).toMatchObject({
      kind: "borehole",
      intervals: 3,
      layers: 3,
    });
  });

  it("stores a file against the revision that is latest when it arrives", async () => {
    const lead = client(ctx.app, leadCookie);
    const saved = await lead
      .put(`/api/plans/${otherPlanId}`)
      .send({ baseRevision: 1, document: { ...document, name: "Second line" } });
    expect(saved.status).toBe(200);
    const response = await lead
      .post(`/api/plans/${otherPlanId}/attachments`)
      .field("kind", "picks")
      .attach("file", Buffer.from("shot_m,geophone_m,time_ms\n0,2,4\n"), "p.csv");
    expect(response.status).toBe(201);
    expect(response.body.attachment.revision).toBe(2);
  });
});

describe("refused uploads write nothing", () => {
  it("names the line and column of a malformed picks CSV", async () => {
    const before = await fieldRowCounts();
    const csv = "shot_m,geophone_m,time_ms\n-1,0,1.8\n-1,2,abc\n";
    const response = await upload("picks", "bad.csv", csv);
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe("invalid_csv");
    expect(response.body.error.message).toContain("line 3, column time_ms");
    expect(response.body.error.fields.file[0]).toBe(
      "line 3, column time_ms: 'abc' is not a number",
    );
    expect(await fieldRowCounts()).toEqual(before);
  });

  it("names the line of a gap in a borehole log", async () => {
    const before = await fieldRowCounts();
    const csv = "depth_from,depth_to,material\n0,2,clay\n3,5,sandstone\n";
    const response = await upload("borehole", "gap.csv", csv);
    expect(response.status).toBe(422);
    expect(response.body.error.message).toMatch(/line 3: gap from 2 m to 3 m/);
    expect(await fieldRowCounts()).toEqual(before);
  });

  it("names the byte offset where a truncated SEG-2 file ends", async () => {
    const before = await fieldRowCounts();
    const bytes = shot().bytes;
    const cut = Buffer.from(bytes.subarray(0, bytes.length - 101));
    const response = await upload("seg2", "cut.sg2", cut);
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe("invalid_seg2");
    expect(response.body.error.message).toMatch(/^not a readable SEG-2 file: byte \d+: expected /);
    const offset = Number(response.body.error.fields.offset[0]);
    expect(offset).toBeGreaterThan(32);
    expect(offset).toBeLessThanOrEqual(cut.length);
    expect(await fieldRowCounts()).toEqual(before);
  });

  it("names byte 0 for a file that is not SEG-2 at all", async () => {
    const response = await upload(
      "seg2",
      "notes.sg2",
      Buffer.from("just some text, certainly not a seismic record"),
    );
    expect(response.status).toBe(422);
    expect(response.body.error.message).toContain("byte 0: expected file descriptor id 0x3A55");
  });

  it("refuses a CSV over its size limit with 413", async () => {
    const before = await fieldRowCounts();
    const big = Buffer.alloc(ATTACHMENT_LIMITS.picks + 1, "1");
    const response = await upload("picks", "huge.csv", big);
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe("file_too_large");
    expect(await fieldRowCounts()).toEqual(before);
  });

  it("refuses a file over the largest limit while it is still arriving", async () => {
    const before = await fieldRowCounts();
    const response = await upload("seg2", "huge.sg2", Buffer.alloc(ATTACHMENT_LIMITS.seg2 + 1));
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe("file_too_large");
    expect(await fieldRowCounts()).toEqual(before);
  });

  it("refuses the wrong file type with 415", async () => {
    const before = await fieldRowCounts();
    const pdf = await upload("picks", "picks.pdf", "%PDF-1.4");
    expect(pdf.status).toBe(415);
    expect(pdf.body.error.code).toBe("unsupported_file_type");
    const csvAsSeg2 = await upload("seg2", "record.csv", "a,b\n1,2\n");
    expect(csvAsSeg2.status).toBe(415);
    const binary = await upload("picks", "picks.csv", Buffer.from([0x55, 0x3a, 0, 1, 2]));
    expect(binary.status).toBe(415);
    expect(binary.body.error.message).toContain("byte 2");
    expect(await fieldRowCounts()).toEqual(before);
  });

  it("refuses a JSON body, a missing file and an unknown kind", async () => {
    const before = await fieldRowCounts();
    const json = await client(ctx.app, leadCookie)
      .post(`/api/plans/${planId}/attachments`)
      .send({ kind: "picks" });
    expect(json.status).toBe(415);
    const noFile = await client(ctx.app, leadCookie)
      .post(`/api/plans/${planId}/attachments`)
      .field("kind", "picks");
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.fields.file).toEqual(["choose a file to upload"]);
    const badKind = await upload("photo", "a.csv", "x");
    expect(badKind.status).toBe(400);
    expect(badKind.body.error.fields.kind).toEqual(["kind must be borehole, picks or seg2"]);
    const twoFiles = await client(ctx.app, leadCookie)
      .post(`/api/plans/${planId}/attachments`)
      .field("kind", "picks")
      .attach("file", Buffer.from("a"), "a.csv")
      .attach("file", Buffer.from("b"), "b.csv");
    expect(twoFiles.status).toBe(400);
    expect(await fieldRowCounts()).toEqual(before);
  });

  it("refuses an upload without an Origin when the session cookie is sent", async () => {
    const { default: request } = await import("supertest");
    const response = await request(ctx.app)
      .post(`/api/plans/${planId}/attachments`)
      .set("Cookie", leadCookie)
      .field("kind", "picks")
      .attach("file", Buffer.from("shot_m,geophone_m,time_ms\n0,1,2\n"), "p.csv");
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe("origin_required");
  });
});

describe("picks", () => {
  it("saves and reads back picks with their origin", async () => {
    const lead = client(ctx.app, leadCookie);
    const empty = await lead.get(`/api/plans/${planId}/picks`);
    expect(empty.status).toBe(200);
    expect(empty.body).toMatchObject({ picks: [], revision: null, updatedBy: null });
    const picks = [
      { sourcePosition: -1, receiverPosition: 0, time: 0.0019, origin: "auto" },
      { sourcePosition: -1, receiverPosition: 2, time: 0.0057, origin: "adjusted" },
    ];
    const saved = await lead.put(`/api/plans/${planId}/picks`).send({ picks, picker: "sta-lta" });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ picks, revision: 1, picker: "sta-lta" });
    expect(saved.body.updatedBy.name).toBe("alder lead");
    const read = await lead.get(`/api/plans/${planId}/picks`);
    expect(read.body.picks).toEqual(picks);
  });

  it("names the duplicate pick and the bad field", async () => {
    const before = await fieldRowCounts();
    const response = await client(ctx.app, leadCookie)
      .put(`/api/plans/${planId}/picks`)
      .send({
        picks: [
          { sourcePosition: 0, receiverPosition: 2, time: 0.004 },
          { sourcePosition: 0, receiverPosition: 2, time: 0.005 },
          { sourcePosition: 0, receiverPosition: 4, time: -1 },
        ],
      });
    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.fields).sort()).toEqual(["picks.1", "picks.2.time"]);
    expect(await fieldRowCounts()).toEqual(before);
  });

  it("refuses an attachment of another plan as the picks' source", async () => {
    const list = await client(ctx.app, leadCookie).get(`/api/plans/${otherPlanId}/attachments`);
    const response = await client(ctx.app, leadCookie)
      .put(`/api/plans/${planId}/picks`)
      .send({ picks: [], attachmentId: list.body[0].id });
    expect(response.status).toBe(400);
    expect(response.body.error.fields.attachmentId).toEqual(["no such attachment on this plan"]);
  });

  it("keeps the picks when their record is deleted, without the link", async () => {
    const lead = client(ctx.app, leadCookie);
    const uploaded = await upload("seg2", "shot.sg2", Buffer.from(shot().bytes));
    const id = uploaded.body.attachment.id;
    await lead.put(`/api/plans/${planId}/picks`).send({
      picks: [{ sourcePosition: -1, receiverPosition: 0, time: 0.002 }],
      attachmentId: id,
    });
    const deleted = await lead.delete(`/api/attachments/${id}`);
    expect(deleted.status).toBe(204);
    expect((await lead.get(`/api/attachments/${id}/content`)).status).toBe(404);
    const picks = await lead.get(`/api/plans/${planId}/picks`);
    expect(picks.body.picks).toHaveLength(1);
    expect(picks.body.attachmentId).toBeNull();
  });
});

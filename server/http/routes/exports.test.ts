import { beforeAll, describe, expect, it } from "vitest";
import type { Response } from "supertest";
import type { TestContext, TestTeam } from "../../testing/harness";
import type { TeamApis } from "../../testing/plans";
import { binary, hasTool, pdfText, planFixture } from "../../testing/exports";
import { REPORT_SECTIONS } from "../../reports/plan-report";

const fixture = planFixture();
const { document } = fixture;
let ctx: TestContext;
let alder: TestTeam;
let apis: TeamApis;
let planId: string;
beforeAll(() => {
  ({ ctx, team: alder, apis, planId } = fixture);
});

const planCount = async () =>
  ((await ctx.dataSource.query(`SELECT COUNT(*) AS n FROM plans`)) as { n: number }[])[0].n;

describe("plan JSON export and import", () => {
  it("exports the stored document and imports it back to an equal document", async () => {
    const exported = await apis.reviewer.get(`/api/plans/${planId}/export.json`);
    expect(exported.status).toBe(200);
    expect(exported.headers["content-type"]).toContain("application/json");
    expect(exported.headers["content-disposition"]).toContain(
      "filename=harrowfield-quarry-access-road-cut-2-rev1.json",
    );
    const first = JSON.parse(exported.text);
    expect(first).toMatchObject({ format: "spreadsight-plan/1", spread: document.spread });
    const imported = await apis.lead
      .post(`/api/sites/${alder.sites.active}/plans/import`)
      .send(first);
    expect(imported.status).toBe(201);
    expect(imported.body.name).toBe(first.name);
    const again = await apis.lead.get(`/api/plans/${imported.body.id}/export.json`);
    expect(JSON.parse(again.text)).toEqual(first);
  });

  it("names every bad field of an invalid document and stores nothing", async () => {
    const before = await planCount();
    const bad = {
      ...document,
      colour: "teal",
      models: [
        {
          name: "broken",
          layers: [{ velocity: 500, thickness: 3 }, { velocity: -20 }],
        },
      ],
      spread: { ...document.spread, spacing: 0 },
    };
    const response = await apis.lead
      .post(`/api/sites/${alder.sites.active}/plans/import`)
      .send(bad);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("invalid_input");
    expect(response.body.error.fields).toMatchObject({
      colour: ["unknown field"],
      "models.0.layers.1.velocity": ["velocity must be > 0"],
      "spread.spacing": ["spacing must be > 0"],
    });
    expect(response.body.error.message).toContain("models.0.layers.1.velocity");
    // The sentence counts as the screen does (model 1, layer 2), the key stays for scripts.
    expect(response.body.error.message).toContain("Model 1, layer 2: velocity must be > 0");
    expect(await planCount()).toBe(before);
  });

  it("refuses interfaces that cross within the spread, naming the dip", async () => {
    const crossing = {
      ...document,
      models: [
        {
          name: "crossing",
          layers: [
            { velocity: 500, thickness: 2, dip: 20 },
            { velocity: 1500, thickness: 1, dip: -20 },
            { velocity: 3000 },
          ],
        },
      ],
    };
    const response = await apis.lead
      .post(`/api/sites/${alder.sites.active}/plans/import`)
      .send(crossing);
    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.fields).some((k) => k.endsWith(".dip"))).toBe(true);
  });

  it("refuses a body that is not a plan document object", async () => {
    const response = await apis.lead
      .post(`/api/sites/${alder.sites.active}/plans/import`)
      .send([1, 2, 3]);
    expect(response.status).toBe(400);
    expect(response.body.error.fields.root).toBeDefined();
  });
});

describe("station layout CSV", () => {
  it("lists every geophone and shot with its position for the crew", async () => {
    const response = await apis.lead.get(`/api/plans/${planId}/stations.csv`);
    expect(response.status).toBe(200);
    expect(response.headers["content-type"]).toContain("text/csv");
    const lines = response.text.trimEnd().split("\r\n");
    const spread = document.spread;
    expect(lines[0]).toBe("kind,number,label,position_m");
    expect(lines).toHaveLength(1 + spread.channels + spread.shots.length);
    // Geophone k stands at firstGeophone + (k − 1)·spacing (plan-schema.ts geometry).
    expect(lines[1]).toBe(`geophone,1,G1,${spread.firstGeophone}`);
    expect(lines[spread.channels]).toBe(
      `geophone,${spread.channels},G${spread.channels},${spread.firstGeophone + (spread.channels - 1) * spread.spacing}`,
    );
    expect(lines.slice(1 + spread.channels)).toEqual(
      spread.shots.map((s, i) => `shot,${i + 1},${s.label},${s.position}`),
    );
  });
});

describe("plan report PDF", () => {
  let pdf: Response;

  beforeAll(async () => {
    await apis.lead.put(`/api/plans/${planId}/picks`).send({
      picks: [0, 2, 4, 6, 8, 10].map((x) => ({
        sourcePosition: -1,
        receiverPosition: x,
        time: (x + 1) / 550,
      })),
    });
    pdf = await binary(apis.reviewer.get(`/api/plans/${planId}/report.pdf`));
  });

  it("downloads a PDF file", () => {
    expect(pdf.status).toBe(200);
    expect(pdf.headers["content-type"]).toBe("application/pdf");
    expect(pdf.headers["content-disposition"]).toMatch(/attachment; filename=\S+-rev1-report\.pdf/);
    const bytes = pdf.body as Buffer;
    expect(bytes.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(bytes.subarray(-6).toString("latin1")).toContain("%%EOF");
  });

  it.skipIf(!hasTool("pdftotext"))(
    "holds every section, the plan's name and the field check (pdftotext; skipped where poppler-utils is missing)",
    () => {
      const text = pdfText(pdf.body as Buffer, { layout: true });
      for (const section of REPORT_SECTIONS) expect(text).toContain(section);
      expect(text).toContain(document.name);
      expect(text).toContain("6 first-break picks from 1 shot");
      expect(text).toContain("alder quarry floor");
    },
  );
});

import { beforeAll, describe, expect, it } from "vitest";
import type { TeamApis } from "../../testing/plans";
import { binary, hasTool, pdfText, planFixture } from "../../testing/exports";

// The interpretation choices of the Field check kept with the saved picks
// (PUT /api/plans/:id/picks and PUT /api/plans/:id/picks/interpretation) and used by
// interpretation.csv and the report. Picks from the closed form for two flat layers
// (Telford, Geldart & Sheriff 1990 §4.3: t = x/v2 + 2h cos θ/v1, h = 6 m); on a flat
// refractor every method gives that depth, so what changes with the choice is the method,
// the datum, the GRM XY and which picks are head waves.
const ti = (2 * 6 * Math.sqrt(1 - (550 / 2800) ** 2)) / 550;
const picks = [-1, 47].flatMap((s) =>
  Array.from({ length: 24 }, (_, k) => 2 * k).map((r) => {
    const x = Math.abs(r - s);
    return { sourcePosition: s, receiverPosition: r, time: Math.min(x / 550, x / 2800 + ti) };
  }),
);
const grm = { method: "grm", xy: 4, datum: -3 } as const;

const fixture = planFixture();
let apis: TeamApis;
let planId: string;
beforeAll(() => {
  ({ apis, planId } = fixture);
});

const csvRows = async () => {
  const res = await apis.reviewer.get(`/api/plans/${planId}/interpretation.csv`);
  expect(res.status).toBe(200);
  const [header, ...rows] = res.text.trimEnd().split("\r\n");
  const names = header.split(",");
  return rows.map((l) => {
    const cells = l.split(",");
    return Object.fromEntries(names.map((n, i) => [n, cells[i]]));
  });
};

/** The report's text (pdftotext), from its interpreted section on, on one line. */
async function reportInterpretationText(): Promise<string> {
  const res = await binary(apis.lead.get(`/api/plans/${planId}/report.pdf?units=metric`));
  expect(res.status).toBe(200);
  const text = pdfText(res.body as Buffer);
  const at = text.indexOf("Interpreted section under the line");
  expect(at).toBeGreaterThan(0);
  return text.slice(at).replace(/\s+/g, " ");
}

describe("interpretation choices kept with the picks", () => {
  it("cannot be saved before the picks", async () => {
    const res = await apis.lead
      .put(`/api/plans/${planId}/picks/interpretation`)
      .send({ interpretation: grm });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/save the plan's picks first/);
  });

  it("are null for picks saved without them, and the exports use the defaults", async () => {
    const saved = await apis.lead.put(`/api/plans/${planId}/picks`).send({ picks, picker: "csv" });
    expect(saved.status).toBe(200);
    expect(saved.body.interpretation).toBeNull();
    const rows = await csvRows();
    expect(rows.length).toBeGreaterThan(5);
    for (const r of rows) {
      expect(r.method).toBe("plus-minus");
      // default datum: the lowest station; no elevations in this plan → flat at 0 m
      expect(Number(r.datum_m)).toBe(0);
      expect(Math.abs(Number(r.depth_m) - 6) / 6).toBeLessThan(0.01);
    }
    if (hasTool("pdftotext")) {
      const text = await reportInterpretationText();
      expect(text).toContain("Plus-minus");
      expect(text).toContain("the default; no choice was saved");
      expect(text).toMatch(/datum 0(\.0+)? m \(the lowest station\)/);
      expect(text).not.toContain("XY");
    }
  }, 60_000);

  it("are saved with the picks, returned by GET and used by the CSV (GRM, datum −3 m)", async () => {
    const saved = await apis.lead
      .put(`/api/plans/${planId}/picks`)
      .send({ picks, picker: "csv", interpretation: grm });
    expect(saved.status).toBe(200);
    const got = await apis.reviewer.get(`/api/plans/${planId}/picks`);
    expect(got.body.interpretation).toEqual(grm);
    const rows = await csvRows();
    expect(rows.length).toBeGreaterThan(5);
    for (const r of rows) {
      expect(r.method).toBe("grm");
      expect(Number(r.datum_m)).toBe(-3);
      expect(Math.abs(Number(r.depth_m) - 6) / 6).toBeLessThan(0.01);
    }
  });

  it.skipIf(!hasTool("pdftotext"))(
    "are named in the report: method, fixed XY and chosen datum (pdftotext)",
    async () => {
      const text = await reportInterpretationText();
      expect(text).toContain("Generalized reciprocal method");
      expect(text).toContain("as chosen on the Field check");
      expect(text).toMatch(/datum −?-?3(\.0+)? m \(chosen\)/);
      expect(text).toMatch(/XY 4(\.0+)? m \(fixed on the Field check/);
      expect(text).not.toContain("Plus-minus");
    },
    60_000,
  );

  it("stay when the picks are saved again without them; null clears them", async () => {
    await apis.lead.put(`/api/plans/${planId}/picks`).send({ picks, picker: "sta-lta" });
    expect((await apis.lead.get(`/api/plans/${planId}/picks`)).body.interpretation).toEqual(grm);
    const cleared = await apis.lead
      .put(`/api/plans/${planId}/picks/interpretation`)
      .send({ interpretation: null });
    expect(cleared.status).toBe(200);
    expect(cleared.body.interpretation).toBeNull();
    expect(cleared.body.picks).toHaveLength(picks.length);
    expect((await csvRows())[0].method).toBe("plus-minus");
  });

  it("use the stored assignment: all picks as direct waves leave no refractor", async () => {
    const res = await apis.lead.put(`/api/plans/${planId}/picks/interpretation`).send({
      interpretation: {
        method: "plus-minus",
        assignments: [
          { shot: -1, layer: 1, from: 0, to: 46 },
          { shot: 47, layer: 1, from: 0, to: 46 },
        ],
      },
    });
    expect(res.status).toBe(200);
    expect(await csvRows()).toEqual([]);
    await apis.lead.put(`/api/plans/${planId}/picks/interpretation`).send({ interpretation: null });
    expect((await csvRows()).length).toBeGreaterThan(5);
  });

  it("refuse bad choices with 400 naming the field, and write nothing", async () => {
    const bad: [unknown, string][] = [
      [{ method: "hagedoorn" }, "interpretation.method"],
      [{ method: "grm", xy: -2 }, "interpretation.xy"],
      [{ method: "grm", datum: "low" }, "interpretation.datum"],
      [
        { method: "grm", assignments: [{ shot: 0, layer: 0, from: 0, to: 10 }] },
        "interpretation.assignments.0.layer",
      ],
      [
        { method: "grm", assignments: [{ shot: 0, layer: 2, from: 10, to: 4 }] },
        "interpretation.assignments.0.to",
      ],
      [{ method: "grm", colour: "red" }, "interpretation.colour"],
    ];
    for (const [interpretation, field] of bad) {
      for (const [path, body] of [
        [`/api/plans/${planId}/picks/interpretation`, { interpretation }],
        [`/api/plans/${planId}/picks`, { picks, interpretation }],
      ] as const) {
        const res = await apis.lead.put(path).send(body);
        expect(res.status, `${path} ${JSON.stringify(interpretation)}`).toBe(400);
        expect(Object.keys(res.body.error.fields ?? {})).toContain(field);
        expect(res.body.error.message).toContain(field);
      }
    }
    expect((await apis.lead.get(`/api/plans/${planId}/picks`)).body.interpretation).toBeNull();
  });

  it("are not changed by a reviewer, nor by a trainee outside a sandbox", async () => {
    for (const api of [apis.reviewer, apis.trainee]) {
      const res = await api
        .put(`/api/plans/${planId}/picks/interpretation`)
        .send({ interpretation: grm });
      expect(res.status).toBe(403);
    }
    expect((await apis.lead.get(`/api/plans/${planId}/picks`)).body.interpretation).toBeNull();
  });
});

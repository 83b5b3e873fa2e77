import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { analyzePlan, parsePlan, type Plan } from "@engine";
import { arrivalsFigure, curveRuns, sectionFigure } from "./charts";
import { pdfText, reportFonts, unpackWoff } from "./fonts";
import { REPORT_SECTIONS, renderPlanReport } from "./plan-report";
import type { PlanReportInput } from "./types";

function example(name: string): Plan {
  const parsed = parsePlan(JSON.parse(readFileSync(`docs/examples/${name}.json`, "utf8")));
  if (!parsed.ok) throw new Error(parsed.issues.join("; "));
  return parsed.plan;
}

function input(document: Plan, overrides: Partial<PlanReportInput> = {}): PlanReportInput {
  const at = new Date("2025-03-04T09:30:00Z");
  return {
    generatedAt: at,
    generatedBy: "Test Lead",
    teamName: "Invented Test Surveys",
    site: { name: "Invented quarry floor", description: "made-up ground for tests" },
    plan: {
      id: "p",
      name: document.name,
      status: "Approved",
      revision: 2,
      author: "Test Lead",
      sandbox: false,
    },
    document,
    analysis: { ok: true, value: analyzePlan(document) },
    revisions: [
      {
        number: 1,
        author: "Test Lead",
        createdAt: at,
        message: "created",
        worstVerdict: "resolved",
      },
    ],
    review: [{ at, actor: "Test Reviewer", label: "Approved", revision: 2, note: "fine" }],
    approval: { by: "Test Reviewer", at, revision: 2, note: "fine" },
    fieldCheck: null,
    ...overrides,
  };
}

/** The bookmark titles of an uncompressed PDF (pdfkit writes them as literal strings). */
function outlineTitles(pdf: Buffer): string[] {
  return [...pdf.toString("latin1").matchAll(/\/Title \(([^)]*)\)/g)].map((m) => m[1]);
}

describe("renderPlanReport", () => {
  it("writes a PDF whose outline holds every section in order", async () => {
    const pdf = await renderPlanReport(input(example("thin-blind-layer")), { compress: false });
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    const titles = outlineTitles(pdf);
    // The document title comes first in the info dictionary; the outline follows in order.
    expect(titles.filter((t) => (REPORT_SECTIONS as readonly string[]).includes(t))).toEqual([
      ...REPORT_SECTIONS,
    ]);
  });

  it("embeds IBM Plex Sans when its WOFF files are installed", async () => {
    const fonts = reportFonts();
    const pdf = (
      await renderPlanReport(input(example("two-layer-simple")), { compress: false })
    ).toString("latin1");
    if (fonts.family === "IBM Plex Sans")
      expect(pdf).toMatch(/\/FontName \/[A-Z]{6}\+IBMPlexSans-Regular/);
    else expect(pdf).toContain("/BaseFont /Helvetica");
  });

  it("still writes every section when the plan cannot be analysed", async () => {
    const pdf = await renderPlanReport(
      input(example("two-layer-simple"), {
        analysis: { ok: false, reason: "test: no analysis" },
        approval: null,
      }),
      { compress: false },
    );
    expect(outlineTitles(pdf)).toEqual(expect.arrayContaining([...REPORT_SECTIONS]));
  });
});

describe("report figures", () => {
  it("draws first arrivals that match the two-layer closed forms", () => {
    // Telford, Geldart & Sheriff (1990) §4.3: direct wave x/v1; head wave x/v2 + 2h cos θ / v1.
    const document = example("two-layer-simple");
    const [top, bottom] = document.models[0].layers;
    const v1 = top.velocity;
    const v2 = bottom.velocity;
    const h = top.thickness ?? 0;
    const ti = (2 * h * Math.sqrt(1 - (v1 / v2) ** 2)) / v1;
    const figure = arrivalsFigure(document.models[0], document.spread, 481);
    const shot = figure.shots[0];
    for (const run of shot.runs) {
      for (const [x, t] of run.points) {
        const offset = Math.abs(x - shot.position);
        const expected = Math.min(offset / v1, offset / v2 + ti);
        expect(t).toBeCloseTo(expected, 9);
      }
    }
    // Crossover distance (Kearey, Brooks & Hill 2002 ch. 5): x = 2h √((v2 + v1)/(v2 − v1)).
    const crossover = 2 * h * Math.sqrt((v2 + v1) / (v2 - v1));
    const forward = shot.runs.filter((r) => r.points[0][0] >= shot.position);
    const switchAt = forward.find((r) => r.layer === 2)?.points[0][0];
    expect(switchAt).toBeDefined();
    expect(Math.abs((switchAt as number) - shot.position - crossover)).toBeLessThan(0.25);
    expect(figure.layers).toEqual([1, 2]);
  });

  it("draws dipping interfaces at D + x·tan(dip)", () => {
    const document = example("dipping-reversed");
    const model = document.models[0];
    const figure = sectionFigure(model, document.spread);
    const dip = model.layers[0].dip ?? 0;
    const [[x0, d0], [x1, d1]] = figure.interfaces[0];
    const h = model.layers[0].thickness ?? 0;
    expect(d0).toBeCloseTo(h + x0 * Math.tan((dip * Math.PI) / 180), 9);
    expect(d1).toBeCloseTo(h + x1 * Math.tan((dip * Math.PI) / 180), 9);
    expect(figure.maxDepth).toBeGreaterThan(Math.max(d0, d1));
    expect(figure.ray?.points[0][0]).toBe(document.spread.shots[0].position);
  });

  it("splits a sampled curve into runs that share their end points", () => {
    const runs = curveRuns([0, 1, 2, 3, 4], [0, 1, 2, 2.5, 3], [1, 1, 2, 2, 2]);
    expect(runs.map((r) => r.layer)).toEqual([1, 2]);
    expect(runs[0].points).toEqual([
      [0, 0],
      [1, 1],
      [2, 2],
    ]);
    expect(runs[1].points[0]).toEqual([2, 2]);
    expect(curveRuns([0, 1, 2], [0, Number.NaN, 2], [1, 1, 1])).toHaveLength(2);
  });
});

describe("report fonts", () => {
  it("spells out symbols the Latin subsets lack", () => {
    expect(pdfText("σ ≤ 2 ms → ok")).toBe("sigma  <= 2 ms -> ok");
    expect(pdfText("Müller – 5 m · 3 m²")).toBe("Müller – 5 m · 3 m²");
    expect(pdfText("日本")).toBe("??");
  });

  it("unpacks a WOFF file into a plain TrueType font with the same tables", () => {
    const path = fileURLToPath(
      new URL(
        "../../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-400-normal.woff",
        import.meta.url,
      ),
    );
    const woff = readFileSync(path);
    const sfnt = unpackWoff(woff);
    const tables = woff.readUInt16BE(12);
    expect(sfnt.readUInt32BE(0)).toBe(woff.readUInt32BE(4));
    expect(sfnt.readUInt16BE(4)).toBe(tables);
    const tags = Array.from({ length: tables }, (_, i) =>
      sfnt.toString("latin1", 12 + 16 * i, 16 + 16 * i),
    );
    expect(tags).toEqual(expect.arrayContaining(["cmap", "glyf", "head", "hmtx"]));
    const other = Buffer.from("not a font");
    expect(unpackWoff(other)).toBe(other);
  });
});

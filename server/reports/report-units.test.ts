// The report in the reader's units: the words and tables of every text section (read without a
// PDF reader, through a writer that records what it is given) and, where poppler-utils is
// installed, the text of the rendered PDF. Conversions: 1 ft = 0.3048 m exactly (1959
// international yard and pound agreement), so 3 m = 9.84 ft and 550 m/s = 1804 ft/s.
import { describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { analyzePlan, parsePlan, type Plan } from "@engine";
import type { UnitSystem } from "@/lib/units";
import { fieldCheckSummary } from "./assemble";
import { drawInterpretation, interpretationSummary } from "./field-interpretation";
import { reportUnits, type Cell, type Column, type ReportWriter } from "./layout";
import { renderPlanReport, textSections } from "./plan-report";
import type { PlanReportInput } from "./types";

function twoLayer(spacing: number): Plan {
  const raw = JSON.parse(readFileSync("docs/examples/two-layer-simple.json", "utf8"));
  raw.spread.spacing = spacing;
  const parsed = parsePlan(raw);
  if (!parsed.ok) throw new Error(parsed.issues.join("; "));
  return parsed.plan;
}

// Closed-form picks of the plan's own two-layer model from two reversed shots (Telford,
// Geldart & Sheriff 1990 §4.3: t = min(x/v1, x/v2 + 2h cos θ/v1)).
function picksFor(document: Plan) {
  const [l1, l2] = document.models[0].layers;
  const h = l1.thickness ?? 0;
  const ti = (2 * h * Math.sqrt(1 - (l1.velocity / l2.velocity) ** 2)) / l1.velocity;
  const { firstGeophone, spacing, channels } = document.spread;
  const end = firstGeophone + (channels - 1) * spacing;
  return [firstGeophone - 1, end + 1].flatMap((s) =>
    Array.from({ length: channels }, (_, k) => firstGeophone + k * spacing).map((r) => {
      const x = Math.abs(r - s);
      return {
        sourcePosition: s,
        receiverPosition: r,
        time: Math.min(x / l1.velocity, x / l2.velocity + ti),
      };
    }),
  );
}

function input(document: Plan, units: UnitSystem): PlanReportInput {
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
    revisions: [],
    review: [],
    approval: null,
    fieldCheck: fieldCheckSummary(
      picksFor(document),
      document.models,
      document.criteria.pickError,
      units,
    ),
    units,
  };
}

/** A writer that keeps the words it is given, one entry per line or table row. */
function recordingWriter() {
  const lines: string[] = [];
  const text = (c: string | Cell) => (typeof c === "string" ? c : c.text);
  const writer = {
    heading: (t: string) => lines.push(t),
    subheading: (t: string) => lines.push(t),
    paragraph: (t: string) => lines.push(t),
    callout: (t: string) => lines.push(t),
    facts: (pairs: [string, string][]) => pairs.forEach(([k, v]) => lines.push(`${k}: ${v}`)),
    table: (columns: Column[], rows: (string | Cell)[][]) => {
      lines.push(columns.map((c) => c.header).join(" | "));
      for (const row of rows) lines.push(row.map(text).join(" | "));
    },
    ensureSpace: () => undefined,
  };
  return { writer: writer as unknown as ReportWriter, lines };
}

function sectionText(report: PlanReportInput): string {
  const { writer, lines } = recordingWriter();
  const u = reportUnits(report.units);
  for (const section of Object.values(textSections)) section(writer, report, u);
  return lines.join("\n");
}

describe("report text in the reader's units", () => {
  const document = twoLayer(3);

  it("writes a feet reader's spread, models and verdicts in ft and ft/s, converted", () => {
    const text = sectionText(input(document, "imperial"));
    expect(text).toContain("Geophones: 24 at 9.84 ft spacing");
    // 23 spacings of 3 m = 69 m = 226.38 ft.
    expect(text).toContain("Spread length: 226.38 ft");
    expect(text).toContain("Velocity (ft/s) | Thickness (ft)");
    // The top layer: 550 m/s over 6 m = 1804 ft/s over 19.69 ft.
    expect(text).toMatch(/\| 1804 \| 19\.69 \| 0 \|/);
    expect(text).toContain("Units: feet (ft, ft/s); times in ms");
    expect(text).not.toMatch(/\((m|m\/s)\)/);
  });

  it("writes a metric reader's report in m and m/s as before", () => {
    const text = sectionText(input(document, "metric"));
    expect(text).toContain("Geophones: 24 at 3 m spacing");
    expect(text).toContain("Spread length: 69 m");
    expect(text).toContain("Velocity (m/s) | Thickness (m)");
    expect(text).toMatch(/\| 550 \| 6 \| 0 \|/);
    expect(text).not.toContain("ft");
  });

  it("writes the field check's shots and interpreted section in the reader's units", () => {
    const report = input(document, "imperial");
    const text = sectionText(report);
    // Shots at −1 m and 70 m: −3.28 ft and 229.66 ft.
    expect(text).toMatch(/from 2 shots \(at -3\.28 ft, 229\.66 ft\)/);
    expect(text).toContain("Geophone (ft) | Depth (ft)");
    expect(text).toMatch(/top-layer velocity 1804 ft\/s/);
    // The interpreted depth of the 6 m refractor reads about 19.7 ft (6 / 0.3048 = 19.69).
    const depths = text
      .split("\n")
      .filter((l) => /^\d+(\.\d+)? \| \d+(\.\d+)? \|/.test(l))
      .map((l) => Number(l.split(" | ")[1]));
    expect(depths.length).toBeGreaterThan(5);
    for (const d of depths) expect(Math.abs(d - 19.69)).toBeLessThan(0.2);
  });

  it("draws the interpretation in metres when no units are given", () => {
    const document2 = twoLayer(2);
    const { writer, lines } = recordingWriter();
    drawInterpretation(writer, interpretationSummary(picksFor(document2), document2));
    expect(lines.join("\n")).toContain("Geophone (m) | Depth (m)");
  });

  it("writes an engine message's metres in feet for a feet reader, with the message's decimals", () => {
    // 1 ft = 0.3048 m exactly (international foot). Whole metres get one decimal in feet.
    expect(reportUnits("imperial").text("geophone 18 m (19 m offset), 1500 m/s, 5 ms")).toBe(
      "geophone 59.1 ft (62.3 ft offset), 4921 ft/s, 5 ms",
    );
    // A sentence rounded to 0.1 m stays at 0.1 ft (29.3 m = 96.128 ft), so it does not claim
    // "96.13 ft" beside the exact figure (29.285 m = 96.08 ft); 0.01 m stays 0.01 ft.
    expect(
      reportUnits("imperial").text("spacing at most 4.88 m and branches reaching 29.3 m offset"),
    ).toBe("spacing at most 16.01 ft and branches reaching 96.1 ft offset");
    expect(reportUnits("metric").text("offset 12 m")).toBe("offset 12 m");
  });
});

function hasTool(name: string): boolean {
  try {
    execFileSync(name, ["-v"], { stdio: "ignore" });
    return true;
  } catch {
    return false;
  }
}

describe("rendered report in feet", () => {
  it.skipIf(!hasTool("pdftotext"))(
    "says ft and ft/s with converted numbers (pdftotext; skipped where poppler-utils is missing)",
    async () => {
      const pdf = await renderPlanReport(input(twoLayer(3), "imperial"));
      const dir = mkdtempSync(join(tmpdir(), "spreadsight-pdf-units-"));
      try {
        const file = join(dir, "report.pdf");
        writeFileSync(file, pdf);
        const text = execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" });
        expect(text).toContain("9.84 ft spacing");
        expect(text).toContain("Velocity (ft/s)");
        expect(text).toContain("position along the line (ft)");
        expect(text).toContain("depth (ft)");
        expect(text).not.toContain("position along the line (m)");
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  );
});

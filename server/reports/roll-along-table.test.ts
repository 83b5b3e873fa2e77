// The roll-along table of the plan report (roll-along-table.ts): rows worked by hand from the
// layout (common practice: spread k starts (k − 1)·(N − overlap)·Δx after the first) and the
// rendered PDF read back with pdftotext (skipped where poppler-utils is missing).
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { analyzePlan, parsePlan, type Plan } from "@engine";
import { renderPlanReport } from "./plan-report";
import { rollAlongSpreads, rollAlongTableRows } from "./roll-along-table";
import type { PlanReportInput } from "./types";

function hasTool(name: string): boolean {
  try {
    execFileSync("which", [name], { stdio: "ignore" });
    return true;
  } catch {
    return false;
  }
}

// Rock 3 m deep at 0 m deepening at 10°: out of reach of spread 3 (96–142 m) only.
// 24 geophones at 2 m, 3 spreads without overlap; end shots 1 m off each end of each spread.
const parsed = parsePlan({
  name: "Invented deepening rockhead line",
  models: [
    {
      name: "rock deepening east",
      layers: [{ velocity: 500, thickness: 3, dip: 10 }, { velocity: 2500 }],
    },
  ],
  spread: {
    spacing: 2,
    channels: 24,
    firstGeophone: 0,
    shots: [
      { position: -1, label: "A", anchor: { to: "start", offset: -1 } },
      { position: 47, label: "B", anchor: { to: "end", offset: 1 } },
    ],
    rollAlong: { spreads: 3, overlap: 0 },
  },
});
if (!parsed.ok) throw new Error(parsed.issues.join("; "));
const document: Plan = parsed.plan;
const analysis = analyzePlan(document);

const text = (cell: unknown) => (typeof cell === "string" ? cell : (cell as { text: string }).text);

describe("rollAlongTableRows", () => {
  it("gives each spread's stations, geophones, shots and verdict in metres", () => {
    const rows = rollAlongTableRows(rollAlongSpreads(document, analysis), "metric", 3);
    expect(rows.map((r) => r.map(text))).toEqual([
      ["1", "1–24", "0 – 46", "A at -1; B at 47", "resolved"],
      ["2", "25–48", "48 – 94", "A at 47; B at 95", "resolved"],
      ["3 (detailed)", "49–72", "96 – 142", "A at 95; B at 143", "under-sampled"],
    ]);
  });

  it("shows positions in feet for a reader who prefers them (1 ft = 0.3048 m exactly)", () => {
    const rows = rollAlongTableRows(rollAlongSpreads(document, analysis), "imperial");
    // 48 m / 0.3048 = 157.48 ft; 94 m = 308.40 ft; 95 m = 311.68 ft
    expect(text(rows[1][2])).toBe("157.48 – 308.4");
    expect(text(rows[1][3])).toBe("A at 154.2; B at 311.68");
  });

  it("takes the spreads from the layout, without verdicts, when there is no analysis", () => {
    const rows = rollAlongTableRows(rollAlongSpreads(document, null), "metric");
    expect(rows.map((r) => text(r[4]))).toEqual(["–", "–", "–"]);
    expect(text(rows[2][1])).toBe("49–72");
  });

  it("has no rows for a plan without roll-along", () => {
    const { rollAlong: _roll, ...spread } = document.spread;
    expect(rollAlongSpreads({ ...document, spread }, null)).toEqual([]);
  });
});

function input(doc: Plan, withAnalysis = true): PlanReportInput {
  const at = new Date("2026-03-04T09:30:00Z");
  return {
    generatedAt: at,
    generatedBy: "Test Lead",
    teamName: "Invented Test Surveys",
    site: { name: "Invented valley side", description: "made-up ground for tests" },
    plan: {
      id: "p",
      name: doc.name,
      status: "Draft",
      revision: 1,
      author: "Test Lead",
      sandbox: false,
    },
    document: doc,
    analysis: withAnalysis
      ? { ok: true, value: analyzePlan(doc) }
      : { ok: false, reason: "test: no analysis" },
    revisions: [],
    review: [],
    approval: null,
    fieldCheck: null,
  };
}

async function pdfText(report: PlanReportInput): Promise<string> {
  const dir = mkdtempSync(join(tmpdir(), "spreadsight-roll-"));
  try {
    const file = join(dir, "report.pdf");
    writeFileSync(file, await renderPlanReport(report));
    return execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

describe("plan report with roll-along", () => {
  it.skipIf(!hasTool("pdftotext"))(
    "lists every spread with its stations, shots and verdict (pdftotext)",
    async () => {
      const t = (await pdfText(input(document))).replace(/[ \t]+/g, " ");
      expect(t).toContain("Roll-along");
      expect(t).toMatch(/3 spreads of 24 geophones/);
      expect(t).toMatch(/end to end, sharing no station\):\s+72\s+stations numbered 1.72/);
      for (const [stations, shots] of [
        ["1.24", "A at -1; B at 47"],
        ["25.48", "A at 47; B at 95"],
        ["49.72", "A at 95; B at 143"],
      ]) {
        expect(t).toMatch(new RegExp(`${stations} .*${shots}`));
      }
      expect(t).toMatch(/3 \(detailed\).*under-sampled/);
      expect(t).toMatch(/give spread 3 in detail/);
    },
  );

  it.skipIf(!hasTool("pdftotext"))(
    "still lists the spreads when the plan could not be analysed, and nothing without roll-along",
    async () => {
      const t = (await pdfText(input(document, false))).replace(/[ \t]+/g, " ");
      expect(t).toMatch(/49.72 .*A at 95; B at 143/);
      const { rollAlong: _roll, ...spread } = document.spread;
      const single = await pdfText(input({ ...document, spread }));
      expect(single).not.toContain("Roll-along");
    },
  );
});

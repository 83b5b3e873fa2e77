/**
 * Shared set-up of the export route tests (report.pdf, stations.csv, interpretation.csv,
 * export.json): one test server, one seeded team signed in as every role, and one plan made
 * from an example document; plus reading binary bodies and PDF text.
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll } from "vitest";
import type { PlanInput } from "@engine";
import { createTestContext, seedTeam, type TestContext, type TestTeam } from "./harness";
import { createPlan, signInTeam, type TeamApis } from "./plans";

/** An example plan document from docs/examples (default: the two-layer example). */
export function examplePlan(name = "two-layer-simple"): PlanInput {
  return JSON.parse(readFileSync(`docs/examples/${name}.json`, "utf8")) as PlanInput;
}

/** What `planFixture` sets up; its fields are filled in by the file's first `beforeAll`. */
export interface PlanFixture {
  ctx: TestContext;
  team: TestTeam;
  apis: TeamApis;
  planId: string;
  document: PlanInput;
}

/**
 * Registers the `beforeAll` / `afterAll` of a file: a test server, the team `teamName` (ids
 * `slug`), its members signed in, and one plan made by the lead from `example`. Read the fields
 * inside tests or later hooks.
 */
export function planFixture(
  options: { teamName?: string; slug?: string; example?: string } = {},
): PlanFixture {
  const fixture = { document: examplePlan(options.example) } as PlanFixture;
  beforeAll(async () => {
    fixture.ctx = await createTestContext();
    fixture.team = await seedTeam(
      fixture.ctx.dataSource,
      options.teamName ?? "Alder Test Surveys",
      options.slug ?? "alder",
    );
    fixture.apis = await signInTeam(fixture.ctx.app, fixture.team);
    const doc = fixture.document;
    fixture.planId = (
      await createPlan(fixture.apis.lead, fixture.team.sites.active, doc.name ?? "Plan", doc)
    ).id;
  }, 60_000);
  afterAll(() => fixture.ctx?.close());
  return fixture;
}

/** A request whose body is read as one Buffer (PDF, PNG). */
export const binary = (req: ReturnType<TeamApis["lead"]["get"]>) =>
  req.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on("data", (c: Buffer) => chunks.push(c));
    res.on("end", () => done(null, Buffer.concat(chunks)));
  });

/** True when the command `name` runs here (e.g. pdftotext from poppler-utils). */
export function hasTool(name: string): boolean {
  try {
    execFileSync(name, ["-v"], { stdio: "ignore" });
    return true;
  } catch {
    return false;
  }
}

/** The text of a PDF through pdftotext (check `hasTool("pdftotext")` first). */
export function pdfText(pdf: Buffer, options: { layout?: boolean } = {}): string {
  const dir = mkdtempSync(join(tmpdir(), "spreadsight-pdf-"));
  try {
    const file = join(dir, "report.pdf");
    writeFileSync(file, pdf);
    return execFileSync("pdftotext", [...(options.layout ? ["-layout"] : []), file, "-"], {
      encoding: "utf8",
    });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

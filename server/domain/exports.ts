/**
 * Exports of a plan — the plan document as JSON (docs/plan-format.md), the station layout as
 * CSV for the field crew — and the import of a plan document into a site.
 *
 * Who may export (design.md): admin, lead and reviewer export any plan they see; a trainee
 * exports only their own sandbox plans.
 */
import { can } from "@/contracts/common";
import type { PlanDetail } from "@/contracts/plans";
import { geometryIssues, planSchema, type Plan as PlanDocument } from "@engine";
import type { DataSource } from "typeorm";
import { stationLayoutCsv } from "../../workers/field/index";
import type { Plan } from "../data/entities/plan";
import { PlanRevision } from "../data/entities/plan-revision";
import { describePlanProblem } from "@/contracts/plan-problems";
import type { Actor } from "./actor";
import { AppError, collectFields, fieldsFromZod, forbidden, notFound } from "./errors";
import { findVisiblePlan } from "./plan-visibility";
import { createPlan, requireCreator } from "./plans";

/** 403 unless the actor may export this plan. */
export function requireExporter(actor: Actor, plan: Plan): void {
  if (can.exportReports(actor.role)) return;
  if (plan.sandbox && plan.authorId === actor.userId) return;
  throw forbidden("trainees export only their own sandbox plans");
}

/** A file name from a plan name: letters, digits and dashes. */
export function fileSlug(name: string): string {
  const slug = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60);
  return slug || "plan";
}

export interface ExportablePlan {
  plan: Plan;
  document: PlanDocument;
  revision: number;
}

/** The plan and its latest document, when the actor may export it. */
export async function exportablePlan(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
): Promise<ExportablePlan> {
  const plan = await findVisiblePlan(dataSource.manager, actor, planId);
  requireExporter(actor, plan);
  const row = await dataSource
    .getRepository(PlanRevision)
    .findOneBy({ planId, number: plan.latestRevision });
  if (!row) throw notFound("plan revision");
  return { plan, document: row.document, revision: row.number };
}

/** The plan document exactly as stored in the latest revision. */
export async function exportPlanDocument(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
): Promise<{ document: PlanDocument; fileName: string }> {
  const { plan, document, revision } = await exportablePlan(dataSource, actor, planId);
  return { document, fileName: `${fileSlug(plan.name)}-rev${revision}.json` };
}

/** Geophone and shot stations with their positions, as CSV. */
export async function exportStationsCsv(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
): Promise<{ csv: string; fileName: string }> {
  const { plan, document, revision } = await exportablePlan(dataSource, actor, planId);
  return {
    csv: stationLayoutCsv(document.spread),
    fileName: `${fileSlug(plan.name)}-rev${revision}-stations.csv`,
  };
}

/**
 * Checks an uploaded plan document: the plan schema, then the geometry the schema cannot
 * express. Throws 400 `invalid_input` with one entry per bad field, keyed by its dotted path
 * (e.g. `models.0.layers.2.velocity`).
 */
export function parsePlanDocument(body: unknown): PlanDocument {
  if (body === null || typeof body !== "object" || Array.isArray(body)) {
    throw new AppError(400, "invalid_input", "invalid body: send a plan document (a JSON object)", {
      root: ["send a plan document (a JSON object)"],
    });
  }
  const parsed = planSchema.safeParse(body);
  let fields: Record<string, string[]>;
  if (!parsed.success) fields = fieldsFromZod(parsed.error);
  else {
    const issues = geometryIssues(parsed.data);
    if (issues.length === 0) return parsed.data;
    fields = collectFields(
      issues.map((issue) => {
        const split = issue.indexOf(": ");
        const path = issue
          .slice(0, split)
          .replace(/\[(\d+)\]/g, ".$1")
          .replace(/^\./, "");
        return [path, issue.slice(split + 2)] as const;
      }),
    );
  }
  const entries = Object.entries(fields);
  // The sentence counts models and layers from 1 as the screens do; the machine-readable key
  // follows in brackets for scripts, and `fields` keeps its keys.
  const list = entries.map(([k, v]) =>
    k === "root" ? v[0] : `${describePlanProblem(k, v[0])} [${k}]`,
  );
  throw new AppError(
    400,
    "invalid_input",
    `invalid plan document: ${list.slice(0, 3).join("; ")}${list.length > 3 ? ` (and ${list.length - 3} more)` : ""}`,
    fields,
  );
}

/** Creates a plan in the site from a plan document (a trainee's lands in their sandbox). */
export async function importPlan(
  dataSource: DataSource,
  actor: Actor,
  siteId: string,
  body: unknown,
): Promise<PlanDetail> {
  requireCreator(actor);
  const document = parsePlanDocument(body);
  return createPlan(dataSource, actor, siteId, { name: document.name, document });
}

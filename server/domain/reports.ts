/**
 * The plan report: gathers the site, the latest revision, the engine's analysis, the review
 * trail, the approval and the saved field picks, and renders the PDF (server/reports).
 */
import { In, type DataSource } from "typeorm";
import { PLAN_STATUS_LABELS } from "@/contracts/plans";
import type { UnitSystem } from "@/lib/units";
import { AuditEvent } from "../data/entities/audit-event";
import { PickSet } from "../data/entities/pick-set";
import { PlanRevision } from "../data/entities/plan-revision";
import { completeReportInput, type ReportSource } from "../reports/assemble";
import type { PlanReportInput, ReportReviewEvent } from "../reports/types";
import { runTask } from "../workers/pool";
import type { Actor } from "./actor";
import { exportablePlan, fileSlug } from "./exports";
import { loadPreferences } from "./me";

/** Review steps of the workflow as they read in the report. */
const REVIEW_LABELS: Record<string, string> = {
  "plan.submit": "Submitted for review",
  "plan.approve": "Signed off for mobilisation",
  "plan.request_changes": "Returned to the lead with notes",
  "plan.reopen": "Reopened",
};

const asNumber = (v: unknown): number | null => (typeof v === "number" ? v : null);
const asText = (v: unknown): string | null => (typeof v === "string" && v ? v : null);

export { fieldCheckSummary } from "../reports/assemble";

/**
 * What the report shows that comes from the database, read for the actor (who must be allowed
 * to export). The analysis and the field check are computed from it by `completeReportInput`.
 * Lengths and velocities are written in `units`, else in the actor's preferred units.
 */
export async function gatherReportSource(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  units?: UnitSystem,
): Promise<ReportSource> {
  const { plan, document, revision } = await exportablePlan(dataSource, actor, planId);
  const revisions = await dataSource.getRepository(PlanRevision).find({
    where: { planId, teamId: actor.teamId },
    relations: { author: true },
    order: { number: "ASC" },
  });
  const events = await dataSource.getRepository(AuditEvent).find({
    where: {
      teamId: actor.teamId,
      targetType: "plan",
      targetId: planId,
      action: In(Object.keys(REVIEW_LABELS)),
    },
    relations: { actor: true },
    order: { createdAt: "ASC", id: "ASC" },
  });
  const review: ReportReviewEvent[] = events.map((e) => ({
    at: e.createdAt,
    actor: e.actor?.name ?? null,
    label: REVIEW_LABELS[e.action] ?? e.action,
    revision: asNumber(e.detail.revision),
    note: asText(e.detail.note),
  }));
  const lastApproval = [...events].reverse().find((e) => e.action === "plan.approve");
  const approval =
    plan.status === "approved" && lastApproval
      ? {
          by: lastApproval.actor?.name ?? "a former member",
          at: lastApproval.createdAt,
          revision: asNumber(lastApproval.detail.revision) ?? revision,
          note: asText(lastApproval.detail.note),
        }
      : null;
  const pickSet = await dataSource
    .getRepository(PickSet)
    .findOneBy({ planId, teamId: actor.teamId });
  return {
    units: units ?? (await loadPreferences(dataSource, actor.userId)).units,
    generatedAt: new Date(),
    generatedBy: actor.name,
    teamName: actor.teamName,
    site: { name: plan.site?.name ?? "", description: plan.site?.description ?? "" },
    plan: {
      id: plan.id,
      name: plan.name,
      status: PLAN_STATUS_LABELS[plan.status],
      revision,
      author: plan.author?.name ?? "",
      sandbox: plan.sandbox,
    },
    document,
    revisions: revisions.map((r) => ({
      number: r.number,
      author: r.author?.name ?? "",
      createdAt: r.createdAt,
      message: r.message,
      worstVerdict: r.worstVerdict,
    })),
    review,
    approval,
    picks: pickSet ? pickSet.picks : null,
    interpretation: pickSet?.interpretation ?? null,
  };
}

/** Everything the report shows (computed on the calling thread; tests use it). */
export async function buildReportInput(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  units?: UnitSystem,
): Promise<PlanReportInput> {
  return completeReportInput(await gatherReportSource(dataSource, actor, planId, units));
}

/**
 * The plan report as PDF bytes and a file name. The database is read here; the analysis, the
 * field check and the drawing run in the worker-thread pool (server/workers), off the event loop.
 * `units` chooses metres or feet for lengths and velocities; by default the actor's preference.
 */
export async function planReportPdf(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  options: { compress?: boolean; units?: UnitSystem } = {},
): Promise<{ pdf: Buffer; fileName: string }> {
  const source = await gatherReportSource(dataSource, actor, planId, options.units);
  const bytes = await runTask({ kind: "report", source, compress: options.compress });
  const pdf = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  return { pdf, fileName: `${fileSlug(source.plan.name)}-rev${source.plan.revision}-report.pdf` };
}

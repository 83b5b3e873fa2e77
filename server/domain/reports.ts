/**
 * The plan report: gathers the site, the latest revision, the engine's analysis, the review
 * trail, the approval and the saved field picks, and renders the PDF (server/reports).
 */
import { In, type DataSource } from "typeorm";
import { PLAN_STATUS_LABELS } from "@/contracts/plans";
import { analyzePlan } from "@engine";
import {
  compareModels,
  misfitWarnings,
  modelFirstArrival,
  type ObservedPick,
} from "../../workers/field/index";
import { AuditEvent } from "../data/entities/audit-event";
import { PickSet } from "../data/entities/pick-set";
import { PlanRevision } from "../data/entities/plan-revision";
import { renderPlanReport } from "../reports/plan-report";
import type { PlanReportInput, ReportFieldCheck, ReportReviewEvent } from "../reports/types";
import type { Actor } from "./actor";
import { exportablePlan, fileSlug } from "./exports";

/** Review steps of the workflow as they read in the report. */
const REVIEW_LABELS: Record<string, string> = {
  "plan.submit": "Submitted for review",
  "plan.approve": "Signed off for mobilisation",
  "plan.request_changes": "Returned to the lead with notes",
  "plan.reopen": "Reopened",
};

const asNumber = (v: unknown): number | null => (typeof v === "number" ? v : null);
const asText = (v: unknown): string | null => (typeof v === "string" && v ? v : null);

/** Best model, RMS per model and misfit warnings for the saved picks. */
export function fieldCheckSummary(
  picks: readonly ObservedPick[],
  models: PlanReportInput["document"]["models"],
  pickError: number,
): ReportFieldCheck | null {
  if (picks.length === 0) return null;
  const candidates = models.map((m) => ({ name: m.name, firstArrival: modelFirstArrival(m) }));
  const { fits, best } = compareModels(picks, candidates);
  const bestIndex = best;
  const warnings =
    bestIndex === null
      ? []
      : misfitWarnings(picks, candidates[bestIndex].firstArrival, {
          pickError: Math.max(pickError, 0.0002),
        }).map(
          (w) =>
            `${candidates[bestIndex].name}, shot at ${Number(w.sourcePosition.toFixed(2))} m (${w.side}): ${w.message}`,
        );
  return {
    picks: picks.length,
    shots: [...new Set(picks.map((p) => p.sourcePosition))].sort((a, b) => a - b),
    fits: fits.map((f) => ({
      name: f.name,
      rms: f.rms,
      meanResidual: f.meanResidual,
      count: f.count,
    })),
    best: bestIndex === null ? null : fits[bestIndex].name,
    warnings,
  };
}

/** Everything the report shows, read for the actor (who must be allowed to export). */
export async function buildReportInput(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
): Promise<PlanReportInput> {
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
  let analysis: PlanReportInput["analysis"];
  try {
    analysis = { ok: true, value: analyzePlan(document) };
  } catch (error) {
    analysis = { ok: false, reason: (error as Error).message };
  }
  const pickSet = await dataSource
    .getRepository(PickSet)
    .findOneBy({ planId, teamId: actor.teamId });
  return {
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
    analysis,
    revisions: revisions.map((r) => ({
      number: r.number,
      author: r.author?.name ?? "",
      createdAt: r.createdAt,
      message: r.message,
      worstVerdict: r.worstVerdict,
    })),
    review,
    approval,
    fieldCheck: pickSet
      ? fieldCheckSummary(pickSet.picks, document.models, document.criteria.pickError)
      : null,
  };
}

/** The plan report as PDF bytes and a file name. */
export async function planReportPdf(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  options: { compress?: boolean } = {},
): Promise<{ pdf: Buffer; fileName: string }> {
  const input = await buildReportInput(dataSource, actor, planId);
  const pdf = await renderPlanReport(input, options);
  return { pdf, fileName: `${fileSlug(input.plan.name)}-rev${input.plan.revision}-report.pdf` };
}

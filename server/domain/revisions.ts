/**
 * Plan revisions: the analysis summary stored with each save, the revision list and one
 * revision, and the diff of two revisions. Revisions are immutable once written.
 */
import type { DataSource } from "typeorm";
import type {
  PlanDiff,
  RefractorSummary,
  RevisionAnalysisSummary,
  RevisionDetail,
  RevisionSummary,
} from "@/contracts/plans";
import { analyzePlan, geometryIssues, type Plan as PlanDocument } from "@engine";
import { PlanRevision } from "../data/entities/plan-revision";
import type { Actor } from "./actor";
import { AppError, collectFields, notFound } from "./errors";
import { diffRevisions } from "./plan-diff";
import { findVisiblePlan } from "./plan-visibility";

/** Depths and errors to the millimetre: enough for a design check, and no float noise. */
const mm = (x: number) => {
  const r = Math.round(x * 1000) / 1000;
  return Object.is(r, -0) ? 0 : r;
};
const mmOrNull = (x: number | null) => (x === null || !Number.isFinite(x) ? null : mm(x));

/**
 * The compact analysis stored with a revision: per model its worst verdict, the direct
 * wave's verdict and per refractor the verdict, true and interpreted depth and the error;
 * the plan's worst verdict and the combined recommendation. Null when the engine refuses
 * the document (it was validated first, so this means an engine limit, never bad input).
 */
export function summarizeDocument(document: PlanDocument): RevisionAnalysisSummary | null {
  let analysis;
  try {
    analysis = analyzePlan(document);
  } catch {
    return null;
  }
  return {
    format: "spreadsight-revision-summary/1",
    worstVerdict: analysis.worstStatus,
    models: analysis.models.map((model) => {
      const interpreted = new Map(
        (model.interpretation?.refractors ?? []).map((r) => [r.layer, r]),
      );
      const refractors: RefractorSummary[] = model.refractors.map((r) => {
        const i = interpreted.get(r.layer);
        return {
          layer: r.layer,
          name: r.name,
          status: r.status,
          trueDepth: mm(r.depth),
          interpretedDepth: i ? mmOrNull(i.interpretedDepth) : null,
          error: i ? mmOrNull(i.error) : null,
          exceedsTolerance: i?.exceedsTolerance ?? false,
          minimumThickness: mmOrNull(r.minimumThickness),
        };
      });
      return {
        name: model.name,
        worstStatus: model.worstStatus,
        direct: model.direct.status,
        refractors,
        recommendation: model.recommendation.text,
      };
    }),
    recommendation: {
      maxSpacing: mmOrNull(analysis.recommendation.maxSpacing),
      spreadLength: mm(analysis.recommendation.spreadLength),
      channels: analysis.recommendation.channels,
      text: analysis.recommendation.text,
    },
  };
}

/**
 * 400 `invalid_input` when the document's interfaces reach the surface or cross within the
 * spread (what the schema cannot express); fields keyed like zod's, e.g.
 * `document.models.0.layers.1.dip`.
 */
export function assertDocumentGeometry(document: PlanDocument, prefix = "document"): void {
  const issues = geometryIssues(document);
  if (issues.length === 0) return;
  const fields = collectFields(
    issues.map((issue) => {
      const split = issue.indexOf(": ");
      const path = issue
        .slice(0, split)
        .replace(/\[(\d+)\]/g, ".$1")
        .replace(/^\./, "");
      return [`${prefix}.${path}`, issue.slice(split + 2)] as const;
    }),
  );
  const [first] = Object.entries(fields);
  throw new AppError(400, "invalid_input", `invalid body: ${first[0]}: ${first[1][0]}`, fields);
}

function toSummary(row: PlanRevision): RevisionSummary {
  return {
    number: row.number,
    author: { id: row.authorId, name: row.author?.name ?? "" },
    createdAt: row.createdAt.toISOString(),
    message: row.message,
    worstVerdict: row.worstVerdict,
  };
}

/** Every revision of a plan the actor can see, newest first. */
export async function listRevisions(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
): Promise<RevisionSummary[]> {
  await findVisiblePlan(dataSource.manager, actor, planId);
  const rows = await dataSource.getRepository(PlanRevision).find({
    where: { planId, teamId: actor.teamId },
    relations: { author: true },
    order: { number: "DESC" },
  });
  return rows.map(toSummary);
}

async function findRevision(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  number: number,
): Promise<PlanRevision> {
  const row = await dataSource.getRepository(PlanRevision).findOne({
    where: { planId, teamId: actor.teamId, number },
    relations: { author: true },
  });
  if (!row) throw notFound(`revision ${number}`);
  return row;
}

export async function getRevision(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  number: number,
): Promise<RevisionDetail> {
  await findVisiblePlan(dataSource.manager, actor, planId);
  const row = await findRevision(dataSource, actor, planId, number);
  return { ...toSummary(row), document: row.document, summary: row.summary };
}

/** The structured difference from revision `from` to revision `to` (either order works). */
export async function diffPlan(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  from: number,
  to: number,
): Promise<PlanDiff> {
  await findVisiblePlan(dataSource.manager, actor, planId);
  const a = await findRevision(dataSource, actor, planId, from);
  const b = await findRevision(dataSource, actor, planId, to);
  return {
    planId,
    from,
    to,
    ...diffRevisions(
      { document: a.document, summary: a.summary },
      { document: b.document, summary: b.summary },
    ),
  };
}

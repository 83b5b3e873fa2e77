/**
 * The interpreted section under the line as CSV (GET /api/plans/:id/interpretation.csv): the
 * saved picks of the plan interpreted as the report does (server/reports/field-interpretation.ts):
 * with the choices stored with the picks, else the defaults. Only those who may export the plan may call it.
 */
import type { DataSource } from "typeorm";
import { PickSet } from "../data/entities/pick-set";
import { interpretationCsv, interpretationSummary } from "../reports/field-interpretation";
import type { Actor } from "./actor";
import { exportablePlan, fileSlug } from "./exports";

/** CSV text and a file name; a header-only CSV when no picks are saved. */
export async function exportInterpretationCsv(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
): Promise<{ csv: string; fileName: string }> {
  const { plan, document, revision } = await exportablePlan(dataSource, actor, planId);
  const pickSet = await dataSource
    .getRepository(PickSet)
    .findOneBy({ planId, teamId: actor.teamId });
  const picks = (pickSet?.picks ?? []).map((p) => ({
    sourcePosition: p.sourcePosition,
    receiverPosition: p.receiverPosition,
    time: p.time,
  }));
  return {
    csv: interpretationCsv(interpretationSummary(picks, document, pickSet?.interpretation ?? null)),
    fileName: `${fileSlug(plan.name)}-rev${revision}-interpretation.csv`,
  };
}

/**
 * Activity: the audit trail of one plan (every plan, revision, workflow and comment action
 * is recorded with target "plan"), and CSV exports of a plan's trail and of the team's.
 */
import type { DataSource } from "typeorm";
import type { ActivityView } from "@/contracts/plans";
import { AuditEvent } from "../data/entities/audit-event";
import { requireRole, type Actor } from "./actor";
import { withoutHiddenPlans } from "./audit";
import { fileSlug } from "./exports";
import { findVisiblePlan } from "./plan-visibility";

function toView(row: AuditEvent): ActivityView {
  return {
    id: row.id,
    actorName: row.actor?.name ?? null,
    action: row.action,
    targetType: row.targetType,
    targetId: row.targetId,
    detail: row.detail,
    createdAt: row.createdAt.toISOString(),
  };
}

/** A plan's trail, newest first. */
export async function planActivity(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  limit: number,
): Promise<ActivityView[]> {
  await findVisiblePlan(dataSource.manager, actor, planId);
  const rows = await dataSource.getRepository(AuditEvent).find({
    where: { teamId: actor.teamId, targetType: "plan", targetId: planId },
    relations: { actor: true },
    order: { createdAt: "DESC", id: "ASC" },
    take: limit,
  });
  return rows.map(toView);
}

/**
 * One CSV cell (RFC 4180): quoted when it holds a comma, quote, CR or LF, quotes doubled.
 * A cell starting with = + - @ or a tab/CR is prefixed with an apostrophe so spreadsheets do
 * not run it as a formula (OWASP "CSV injection", common practice).
 */
export function csvCell(value: unknown): string {
  let text = value === null || value === undefined ? "" : String(value);
  if (/^[=+\-@\t\r]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Rows to CSV with CRLF line ends (RFC 4180), header first. */
export function toCsv(header: string[], rows: unknown[][]): string {
  return [header, ...rows].map((row) => row.map(csvCell).join(",")).join("\r\n") + "\r\n";
}

const HEADER = ["time", "actor", "action", "target_type", "target_id", "plan", "detail"];

function detailText(detail: AuditEvent["detail"]): string {
  return Object.entries(detail)
    .map(([key, value]) => `${key}=${value === null ? "" : String(value)}`)
    .join("; ");
}

function csvRows(rows: AuditEvent[], planNames: Map<string, string>): unknown[][] {
  return rows.map((row) => [
    row.createdAt.toISOString(),
    row.actor?.name ?? "",
    row.action,
    row.targetType,
    row.targetId ?? "",
    row.targetType === "plan" && row.targetId ? (planNames.get(row.targetId) ?? "") : "",
    detailText(row.detail),
  ]);
}

/** A plan's trail as CSV, oldest first. */
export async function planActivityCsv(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  limit: number,
): Promise<string> {
  return (await planActivityCsvFile(dataSource, actor, planId, limit)).csv;
}

/**
 * The plan's trail as CSV with a file name from the plan's name. Like the JSON list, `limit`
 * keeps the newest events; the file then lists them oldest first.
 */
export async function planActivityCsvFile(
  dataSource: DataSource,
  actor: Actor,
  planId: string,
  limit: number,
): Promise<{ csv: string; filename: string }> {
  const plan = await findVisiblePlan(dataSource.manager, actor, planId);
  const rows = await dataSource.getRepository(AuditEvent).find({
    where: { teamId: actor.teamId, targetType: "plan", targetId: planId },
    relations: { actor: true },
    order: { createdAt: "DESC", id: "DESC" },
    take: limit,
  });
  rows.reverse();
  return {
    csv: toCsv(HEADER, csvRows(rows, new Map([[plan.id, plan.name]]))),
    filename: `${fileSlug(plan.name)}-activity.csv`,
  };
}

/**
 * The team's trail as CSV (admin, lead, reviewer), oldest first. Events about sandbox plans
 * the actor may not see are left out, as everywhere else.
 */
export async function teamAuditCsv(
  dataSource: DataSource,
  actor: Actor,
  limit: number,
): Promise<string> {
  requireRole(actor, "admin", "lead", "reviewer");
  const rows = await dataSource.getRepository(AuditEvent).find({
    where: { teamId: actor.teamId },
    relations: { actor: true },
    order: { createdAt: "DESC", id: "ASC" },
    take: limit,
  });
  const { visible, plans } = await withoutHiddenPlans(dataSource, actor, rows);
  visible.reverse();
  const names = new Map([...plans.values()].map((p) => [p.id, p.name]));
  return toCsv(HEADER, csvRows(visible, names));
}

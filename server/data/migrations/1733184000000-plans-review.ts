import {
  type MigrationInterface, type QueryRunner, type TableColumnOptions } from "typeorm";
import { createPortableTable, TIMESTAMP, UUID_COLUMN } from "../columns";

const id = (name = "id"): TableColumnOptions => ({ name, ...UUID_COLUMN, isPrimary: true });
const uuid = (name: string, nullable = false): TableColumnOptions => ({
  name,
  ...UUID_COLUMN,
  isNullable: nullable,
});
const text = (name: string, length?: number, nullable = false): TableColumnOptions =>
  length
    ? { name, type: "varchar", length: String(length), isNullable: nullable }
    : { name, type: "text", isNullable: nullable };
const time = (name: string, nullable = false): TableColumnOptions => ({
  name,
  type: TIMESTAMP,
  isNullable: nullable,
});
const int = (name: string): TableColumnOptions => ({ name, type: "integer" });
const bool = (name: string): TableColumnOptions => ({ name, type: "boolean" });
const fk = (columnName: string, table: string, onDelete: "CASCADE" | "SET NULL" | "RESTRICT") => ({
  columnNames: [columnName],
  referencedTableName: table,
  referencedColumnNames: ["id"],
  onDelete,
});

const STATUSES = `('draft','in-review','changes-requested','approved','archived')`;
const VERDICTS = `('resolved','under-sampled','blind','inverted')`;

/** Plans and their revisions, comments, notifications and notification settings. */
export class PlansReview1733184000000 implements MigrationInterface {
  name = "PlansReview1733184000000";

  async up(q: QueryRunner): Promise<void> {
    await createPortableTable(
      q,
      ({
        name: "plans",
        columns: [
          id(),
          uuid("teamId"),
          uuid("siteId"),
          text("name", 120),
          text("status", 24),
          text("statusBeforeArchive", 24, true),
          bool("sandbox"),
          uuid("authorId"),
          uuid("submittedById", true),
          int("latestRevision"),
          text("worstVerdict", 16, true),
          time("createdAt"),
          time("updatedAt"),
        ],
        foreignKeys: [
          fk("teamId", "teams", "CASCADE"),
          fk("siteId", "sites", "CASCADE"),
          fk("authorId", "users", "RESTRICT"),
          fk("submittedById", "users", "SET NULL"),
        ],
        indices: [{ name: "IDX_plans_team_site", columnNames: ["teamId", "siteId"] }],
        checks: [
          { name: "CHK_plans_status", expression: `"status" IN ${STATUSES}` },
          {
            name: "CHK_plans_status_before_archive",
            expression: `"statusBeforeArchive" IS NULL OR "statusBeforeArchive" IN ${STATUSES}`,
          },
          {
            name: "CHK_plans_verdict",
            expression: `"worstVerdict" IS NULL OR "worstVerdict" IN ${VERDICTS}`,
          },
        ],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "plan_revisions",
        columns: [
          id(),
          uuid("teamId"),
          uuid("planId"),
          int("number"),
          text("document"),
          text("summary", undefined, true),
          text("worstVerdict", 16, true),
          uuid("authorId"),
          text("message", 300, true),
          time("createdAt"),
        ],
        foreignKeys: [
          fk("teamId", "teams", "CASCADE"),
          fk("planId", "plans", "CASCADE"),
          fk("authorId", "users", "RESTRICT"),
        ],
        uniques: [{ name: "UQ_plan_revisions_plan_number", columnNames: ["planId", "number"] }],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "comments",
        columns: [
          id(),
          uuid("teamId"),
          uuid("planId"),
          int("revision"),
          uuid("parentId", true),
          uuid("authorId"),
          text("authorRole", 16),
          text("body"),
          text("anchor", undefined, true),
          text("mentions"),
          time("resolvedAt", true),
          uuid("resolvedById", true),
          time("createdAt"),
        ],
        foreignKeys: [
          fk("teamId", "teams", "CASCADE"),
          fk("planId", "plans", "CASCADE"),
          fk("parentId", "comments", "CASCADE"),
          fk("authorId", "users", "RESTRICT"),
          fk("resolvedById", "users", "SET NULL"),
        ],
        indices: [{ name: "IDX_comments_plan", columnNames: ["planId", "createdAt"] }],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "notifications",
        columns: [
          id(),
          uuid("teamId"),
          uuid("userId"),
          text("kind", 16),
          uuid("planId"),
          uuid("actorId", true),
          text("text"),
          time("readAt", true),
          time("createdAt"),
        ],
        foreignKeys: [
          fk("teamId", "teams", "CASCADE"),
          fk("userId", "users", "CASCADE"),
          fk("planId", "plans", "CASCADE"),
          fk("actorId", "users", "SET NULL"),
        ],
        indices: [{ name: "IDX_notifications_user_time", columnNames: ["userId", "createdAt"] }],
        checks: [
          {
            name: "CHK_notifications_kind",
            expression: `"kind" IN ('submitted','decision','mention','reply')`,
          },
        ],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "notification_settings",
        columns: [
          { name: "userId", ...UUID_COLUMN, isPrimary: true },
          bool("submitted"),
          bool("decision"),
          bool("mention"),
          bool("reply"),
          time("updatedAt"),
        ],
        foreignKeys: [fk("userId", "users", "CASCADE")],
      }),
    );
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of [
      "notification_settings",
      "notifications",
      "comments",
      "plan_revisions",
      "plans",
    ]) {
      await q.dropTable(table);
    }
  }
}

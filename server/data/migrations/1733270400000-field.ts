import {
  type MigrationInterface, type QueryRunner, type TableColumnOptions } from "typeorm";
import { BLOB, createPortableTable, TIMESTAMP, UUID_COLUMN } from "../columns";

const id = (): TableColumnOptions => ({ name: "id", ...UUID_COLUMN, isPrimary: true });
const uuid = (name: string, nullable = false): TableColumnOptions => ({
  name,
  ...UUID_COLUMN,
  isNullable: nullable,
});
const text = (name: string, length?: number, nullable = false): TableColumnOptions =>
  length
    ? { name, type: "varchar", length: String(length), isNullable: nullable }
    : { name, type: "text", isNullable: nullable };
const int = (name: string): TableColumnOptions => ({ name, type: "integer" });
const time = (name: string): TableColumnOptions => ({ name, type: TIMESTAMP });
const fk = (columnName: string, table: string, onDelete: "CASCADE" | "SET NULL" | "RESTRICT") => ({
  columnNames: [columnName],
  referencedTableName: table,
  referencedColumnNames: ["id"],
  onDelete,
});

/** Field check: uploaded files of a plan revision, and the plan's saved first-break picks. */
export class Field1733270400000 implements MigrationInterface {
  name = "Field1733270400000";

  async up(q: QueryRunner): Promise<void> {
    await createPortableTable(
      q,
      ({
        name: "attachments",
        columns: [
          id(),
          uuid("teamId"),
          uuid("planId"),
          uuid("revisionId"),
          int("revision"),
          text("kind", 16),
          text("fileName", 200),
          text("mediaType", 100),
          int("size"),
          text("sha256", 64),
          text("facts"),
          { name: "content", type: BLOB },
          uuid("uploadedById"),
          time("createdAt"),
        ],
        foreignKeys: [
          fk("teamId", "teams", "CASCADE"),
          fk("planId", "plans", "CASCADE"),
          fk("revisionId", "plan_revisions", "CASCADE"),
          fk("uploadedById", "users", "RESTRICT"),
        ],
        indices: [{ name: "IDX_attachments_plan", columnNames: ["planId", "createdAt"] }],
        checks: [
          { name: "CHK_attachments_kind", expression: `"kind" IN ('borehole','picks','seg2')` },
        ],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "pick_sets",
        columns: [
          id(),
          uuid("teamId"),
          { ...uuid("planId"), isUnique: true },
          int("revision"),
          text("picks"),
          uuid("attachmentId", true),
          text("picker", 40, true),
          uuid("updatedById"),
          time("updatedAt"),
        ],
        foreignKeys: [
          fk("teamId", "teams", "CASCADE"),
          fk("planId", "plans", "CASCADE"),
          fk("attachmentId", "attachments", "SET NULL"),
          fk("updatedById", "users", "RESTRICT"),
        ],
      }),
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.dropTable("pick_sets");
    await q.dropTable("attachments");
  }
}

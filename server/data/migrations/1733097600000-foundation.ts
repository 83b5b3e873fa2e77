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
const fk = (columnName: string, table: string, onDelete: "CASCADE" | "SET NULL" | "RESTRICT") => ({
  columnNames: [columnName],
  referencedTableName: table,
  referencedColumnNames: ["id"],
  onDelete,
});

/** Teams, users, memberships, sessions, sites, audit, invitations, resets, mailbox, preferences. */
export class Foundation1733097600000 implements MigrationInterface {
  name = "Foundation1733097600000";

  async up(q: QueryRunner): Promise<void> {
    await createPortableTable(
      q,
      ({ name: "teams", columns: [id(), text("name", 120), time("createdAt")] }),
    );
    await createPortableTable(
      q,
      ({
        name: "users",
        columns: [
          id(),
          { ...text("email", 200), isUnique: true },
          text("name", 100),
          text("passwordHash", 255),
          time("createdAt"),
          time("updatedAt"),
        ],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "memberships",
        columns: [
          id(),
          uuid("teamId"),
          { ...uuid("userId"), isUnique: true },
          text("role", 16),
          time("createdAt"),
        ],
        foreignKeys: [fk("teamId", "teams", "CASCADE"), fk("userId", "users", "CASCADE")],
        indices: [{ name: "IDX_memberships_team", columnNames: ["teamId"] }],
        checks: [{ name: "CHK_memberships_role", expression: `"role" IN ('admin','lead','reviewer','trainee')` }],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "sessions",
        columns: [
          { name: "id", type: "varchar", length: "64", isPrimary: true },
          uuid("userId"),
          time("expiresAt"),
        ],
        foreignKeys: [fk("userId", "users", "CASCADE")],
        indices: [{ name: "IDX_sessions_user", columnNames: ["userId"] }],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "sites",
        columns: [
          id(),
          uuid("teamId"),
          text("name", 120),
          text("description"),
          time("archivedAt", true),
          uuid("createdById"),
          time("createdAt"),
          time("updatedAt"),
        ],
        foreignKeys: [fk("teamId", "teams", "CASCADE"), fk("createdById", "users", "RESTRICT")],
        indices: [{ name: "IDX_sites_team", columnNames: ["teamId", "archivedAt"] }],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "audit_events",
        columns: [
          id(),
          uuid("teamId"),
          uuid("actorId", true),
          text("action", 64),
          text("targetType", 32),
          text("targetId", 64, true),
          text("detail"),
          time("createdAt"),
        ],
        foreignKeys: [fk("teamId", "teams", "CASCADE"), fk("actorId", "users", "SET NULL")],
        indices: [{ name: "IDX_audit_team_time", columnNames: ["teamId", "createdAt"] }],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "invitations",
        columns: [
          id(),
          uuid("teamId"),
          text("email", 200),
          text("role", 16),
          { ...text("tokenHash", 64), isUnique: true },
          uuid("invitedById"),
          time("createdAt"),
          time("expiresAt"),
          time("acceptedAt", true),
          time("revokedAt", true),
        ],
        foreignKeys: [fk("teamId", "teams", "CASCADE"), fk("invitedById", "users", "RESTRICT")],
        indices: [{ name: "IDX_invitations_team", columnNames: ["teamId", "email"] }],
        checks: [{ name: "CHK_invitations_role", expression: `"role" IN ('admin','lead','reviewer','trainee')` }],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "password_resets",
        columns: [
          id(),
          uuid("userId"),
          { ...text("tokenHash", 64), isUnique: true },
          time("createdAt"),
          time("expiresAt"),
          time("usedAt", true),
        ],
        foreignKeys: [fk("userId", "users", "CASCADE")],
        indices: [{ name: "IDX_password_resets_user", columnNames: ["userId"] }],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "mail_messages",
        columns: [
          id(),
          uuid("teamId", true),
          text("from", 320),
          text("to"),
          text("subject", 500),
          text("text"),
          text("html", undefined, true),
          time("receivedAt"),
        ],
        foreignKeys: [fk("teamId", "teams", "CASCADE")],
        indices: [{ name: "IDX_mail_team_time", columnNames: ["teamId", "receivedAt"] }],
      }),
    );
    await createPortableTable(
      q,
      ({
        name: "user_preferences",
        columns: [
          { name: "userId", ...UUID_COLUMN, isPrimary: true },
          text("units", 16),
          time("updatedAt"),
        ],
        foreignKeys: [{ ...fk("userId", "users", "CASCADE") }],
      }),
    );
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of [
      "user_preferences",
      "mail_messages",
      "password_resets",
      "invitations",
      "audit_events",
      "sites",
      "sessions",
      "memberships",
      "users",
      "teams",
    ]) {
      await q.dropTable(table);
    }
  }
}

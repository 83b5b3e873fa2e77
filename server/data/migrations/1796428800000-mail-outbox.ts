import { Table, type MigrationInterface, type QueryRunner } from "typeorm";
import { timestampType, UUID_COLUMN } from "../columns";

/**
 * The notification e-mail outbox (server/mail/outbox.ts): one row per e-mail, written in the
 * transaction that writes its inbox row, deleted from view once sent (sentAt set).
 */
export class MailOutbox1796428800000 implements MigrationInterface {
  name = "MailOutbox1796428800000";

  async up(q: QueryRunner): Promise<void> {
    await q.createTable(
      new Table({
        name: "mail_outbox",
        columns: [
          { name: "id", ...UUID_COLUMN, isPrimary: true },
          { name: "teamId", ...UUID_COLUMN, isNullable: true },
          { name: "userId", ...UUID_COLUMN, isNullable: true },
          { name: "to", type: "varchar", length: "320" },
          { name: "subject", type: "varchar", length: "500" },
          { name: "text", type: "text" },
          { name: "html", type: "text", isNullable: true },
          { name: "createdAt", type: timestampType(q) },
          { name: "attempts", type: "integer", default: 0 },
          { name: "nextAttemptAt", type: "bigint" },
          { name: "claimedUntil", type: "bigint", isNullable: true },
          { name: "sentAt", type: "bigint", isNullable: true },
          { name: "lastError", type: "varchar", length: "500", isNullable: true },
        ],
        indices: [{ name: "IDX_mail_outbox_due", columnNames: ["sentAt", "nextAttemptAt"] }],
      }),
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.dropTable("mail_outbox");
  }
}

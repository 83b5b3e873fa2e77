import { Column, Entity, Index, PrimaryColumn } from "typeorm";
import { TIMESTAMP, UUID } from "../columns";

/** bigint columns come back as strings from PostgreSQL: read them as numbers (epoch ms). */
const epochMs = {
  to: (value: number | null) => value,
  from: (value: string | number | null) => (value === null ? null : Number(value)),
};

/**
 * A notification e-mail waiting to be handed to SMTP (server/mail/outbox.ts). Written in the
 * same transaction as the inbox row it twins, so an e-mail is never lost between the commit and
 * the SMTP server: a row stays until it is sent, and any app server on the database may send it.
 * Times that are compared in SQL are epoch milliseconds, which both databases compare alike.
 */
@Entity({ name: "mail_outbox" })
@Index("IDX_mail_outbox_due", ["sentAt", "nextAttemptAt"])
export class MailOutboxRow {
  @PrimaryColumn(UUID) id: string;
  @Column({ ...UUID, nullable: true }) teamId: string | null;
  /** The recipient's user id (for logs), when the mail is for a member. */
  @Column({ ...UUID, nullable: true }) userId: string | null;
  @Column({ type: "varchar", length: 320 }) to: string;
  @Column({ type: "varchar", length: 500 }) subject: string;
  @Column({ type: "text" }) text: string;
  @Column({ type: "text", nullable: true }) html: string | null;
  @Column({ type: TIMESTAMP }) createdAt: Date;
  /** Failed sends so far. */
  @Column({ type: "integer", default: 0 }) attempts: number;
  /** Not sent before this time (epoch ms). */
  @Column({ type: "bigint", transformer: epochMs }) nextAttemptAt: number;
  /** A server is sending it until this time (epoch ms); null = nobody. */
  @Column({ type: "bigint", nullable: true, transformer: epochMs }) claimedUntil: number | null;
  /** When SMTP accepted it (epoch ms); null = still to send. */
  @Column({ type: "bigint", nullable: true, transformer: epochMs }) sentAt: number | null;
  @Column({ type: "varchar", length: 500, nullable: true }) lastError: string | null;
}

import { Column, Entity, PrimaryColumn } from "typeorm";
import { TIMESTAMP, UUID } from "../columns";

/**
 * A message caught by the built-in fake SMTP server (demo/test mode). `teamId` comes from the
 * X-Spreadsight-Team header the app sets, so each team's admins see only their own mail.
 */
@Entity({ name: "mail_messages" })
export class MailMessage {
  @PrimaryColumn(UUID) id: string;
  @Column({ ...UUID, nullable: true }) teamId: string | null;
  @Column({ type: "varchar", length: 320 }) from: string;
  @Column({ type: "simple-json" }) to: string[];
  @Column({ type: "varchar", length: 500 }) subject: string;
  @Column({ type: "text" }) text: string;
  @Column({ type: "text", nullable: true }) html: string | null;
  @Column({ type: TIMESTAMP }) receivedAt: Date;
}

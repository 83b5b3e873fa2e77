import { Column, Entity, PrimaryColumn } from "typeorm";
import { TIMESTAMP, UUID } from "../columns";

/** Which notification e-mails a user receives (one row per user, created on first change). */
@Entity({ name: "notification_settings" })
export class NotificationSetting {
  @PrimaryColumn(UUID) userId: string;
  @Column({ type: "boolean" }) submitted: boolean;
  @Column({ type: "boolean" }) decision: boolean;
  @Column({ type: "boolean" }) mention: boolean;
  @Column({ type: "boolean" }) reply: boolean;
  @Column({ type: TIMESTAMP }) updatedAt: Date;
}

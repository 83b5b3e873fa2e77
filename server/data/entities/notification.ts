import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import type { NotificationKind } from "@/contracts/plans";
import { TIMESTAMP, UUID } from "../columns";
import { Plan } from "./plan";
import { User } from "./user";

/** One entry in a user's in-app inbox (the e-mail twin is sent when their setting allows). */
@Entity({ name: "notifications" })
export class PlanNotification {
  @PrimaryColumn(UUID) id: string;
  @Column(UUID) teamId: string;
  /** The recipient. */
  @Column(UUID) userId: string;
  @Column({ type: "varchar", length: 16 }) kind: NotificationKind;
  @Column(UUID) planId: string;
  @Column({ ...UUID, nullable: true }) actorId: string | null;
  @Column({ type: "text" }) text: string;
  @Column({ type: TIMESTAMP, nullable: true }) readAt: Date | null;
  @Column({ type: TIMESTAMP }) createdAt: Date;

  @ManyToOne(() => Plan, { onDelete: "CASCADE" })
  @JoinColumn({ name: "planId" })
  plan?: Plan;

  @ManyToOne(() => User, { onDelete: "SET NULL" })
  @JoinColumn({ name: "actorId" })
  actor?: User | null;
}

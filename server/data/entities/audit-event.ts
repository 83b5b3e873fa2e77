import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import { TIMESTAMP, UUID } from "../columns";
import { User } from "./user";

/** Small JSON facts about an event (names, roles, before/after values). */
export type AuditDetail = Record<string, string | number | boolean | null>;

/** One recorded action in a team: who did what to which row, when. */
@Entity({ name: "audit_events" })
export class AuditEvent {
  @PrimaryColumn(UUID) id: string;
  @Column(UUID) teamId: string;
  @Column({ ...UUID, nullable: true }) actorId: string | null;
  /** Dotted verb, e.g. "site.create", "member.role_change". */
  @Column({ type: "varchar", length: 64 }) action: string;
  @Column({ type: "varchar", length: 32 }) targetType: string;
  @Column({ type: "varchar", length: 64, nullable: true }) targetId: string | null;
  @Column({ type: "simple-json" }) detail: AuditDetail;
  @Column({ type: TIMESTAMP }) createdAt: Date;

  @ManyToOne(() => User, { onDelete: "SET NULL" })
  @JoinColumn({ name: "actorId" })
  actor?: User | null;
}

import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import { TIMESTAMP, UUID } from "../columns";
import { User } from "./user";

/** A place where surveys are planned. Archived sites keep their data but leave the default list. */
@Entity({ name: "sites" })
export class Site {
  @PrimaryColumn(UUID) id: string;
  @Column(UUID) teamId: string;
  @Column({ type: "varchar", length: 120 }) name: string;
  @Column({ type: "text" }) description: string;
  @Column({ type: TIMESTAMP, nullable: true }) archivedAt: Date | null;
  @Column(UUID) createdById: string;
  @Column({ type: TIMESTAMP }) createdAt: Date;
  @Column({ type: TIMESTAMP }) updatedAt: Date;

  @ManyToOne(() => User)
  @JoinColumn({ name: "createdById" })
  createdBy?: User;
}

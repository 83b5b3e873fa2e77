import { Column, Entity, PrimaryColumn } from "typeorm";
import { TIMESTAMP, UUID } from "../columns";

/** A team: the unit of data isolation. Every team-owned row carries a teamId. */
@Entity({ name: "teams" })
export class Team {
  @PrimaryColumn(UUID) id: string;
  @Column({ type: "varchar", length: 120 }) name: string;
  @Column({ type: TIMESTAMP }) createdAt: Date;
}

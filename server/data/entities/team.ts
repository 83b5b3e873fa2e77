import { Column, Entity, PrimaryColumn } from "typeorm";
import { TEAM_SEISMOGRAPH_CHANNELS_DEFAULT } from "@/contracts/team";
import { TIMESTAMP, UUID } from "../columns";

/** A team: the unit of data isolation. Every team-owned row carries a teamId. */
@Entity({ name: "teams" })
export class Team {
  @PrimaryColumn(UUID) id: string;
  @Column({ type: "varchar", length: 120 }) name: string;
  @Column({ type: TIMESTAMP }) createdAt: Date;
  /** Channels the team's seismograph records (2…1024, default 48): a team setting. */
  @Column({ type: "integer", default: TEAM_SEISMOGRAPH_CHANNELS_DEFAULT }) seismographChannels: number;
}

import { Column, Entity, PrimaryColumn } from "typeorm";
import { TIMESTAMP, UUID } from "../columns";

/** A lucia session (id is lucia's random session id; the cookie carries it). */
@Entity({ name: "sessions" })
export class Session {
  @PrimaryColumn({ type: "varchar", length: 64 }) id: string;
  @Column(UUID) userId: string;
  @Column({ type: TIMESTAMP }) expiresAt: Date;
}

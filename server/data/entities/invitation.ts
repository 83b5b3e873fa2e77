import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import type { Role } from "@/contracts/common";
import { TIMESTAMP, UUID } from "../columns";
import { Team } from "./team";
import { User } from "./user";

/** An e-mailed, single-use, expiring invitation to join a team. Only the token's SHA-256 is stored. */
@Entity({ name: "invitations" })
export class Invitation {
  @PrimaryColumn(UUID) id: string;
  @Column(UUID) teamId: string;
  @Column({ type: "varchar", length: 200 }) email: string;
  @Column({ type: "varchar", length: 16 }) role: Role;
  @Column({ type: "varchar", length: 64, unique: true }) tokenHash: string;
  @Column(UUID) invitedById: string;
  @Column({ type: TIMESTAMP }) createdAt: Date;
  @Column({ type: TIMESTAMP }) expiresAt: Date;
  @Column({ type: TIMESTAMP, nullable: true }) acceptedAt: Date | null;
  @Column({ type: TIMESTAMP, nullable: true }) revokedAt: Date | null;

  @ManyToOne(() => Team, { onDelete: "CASCADE" })
  @JoinColumn({ name: "teamId" })
  team?: Team;

  @ManyToOne(() => User)
  @JoinColumn({ name: "invitedById" })
  invitedBy?: User;
}

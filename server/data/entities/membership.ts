import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import type { Role } from "@/contracts/common";
import { TIMESTAMP, UUID } from "../columns";
import { Team } from "./team";
import { User } from "./user";

/**
 * A user's place in a team with a role. For now a user belongs to at most one team
 * (unique userId); a user without a membership cannot sign in.
 */
@Entity({ name: "memberships" })
export class Membership {
  @PrimaryColumn(UUID) id: string;
  @Column(UUID) teamId: string;
  @Column({ ...UUID, unique: true }) userId: string;
  @Column({ type: "varchar", length: 16 }) role: Role;
  @Column({ type: TIMESTAMP }) createdAt: Date;

  @ManyToOne(() => Team, { onDelete: "CASCADE" })
  @JoinColumn({ name: "teamId" })
  team?: Team;

  @ManyToOne(() => User, { onDelete: "CASCADE" })
  @JoinColumn({ name: "userId" })
  user?: User;
}

import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import type { Role } from "@/contracts/common";
import type { CommentAnchor } from "@/contracts/plans";
import { TIMESTAMP, UUID } from "../columns";
import { User } from "./user";

/**
 * A comment on a plan revision. A thread is a first comment (parentId null) and its replies
 * (parentId = the first comment). Only a thread's first comment carries resolvedAt.
 */
@Entity({ name: "comments" })
export class PlanComment {
  @PrimaryColumn(UUID) id: string;
  @Column(UUID) teamId: string;
  @Column(UUID) planId: string;
  /** Revision number commented on (replies share their thread's). */
  @Column({ type: "integer" }) revision: number;
  @Column({ ...UUID, nullable: true }) parentId: string | null;
  @Column(UUID) authorId: string;
  /** The author's role when writing (kept if the role changes or the member leaves). */
  @Column({ type: "varchar", length: 16 }) authorRole: Role;
  @Column({ type: "text" }) body: string;
  @Column({ type: "simple-json", nullable: true }) anchor: CommentAnchor | null;
  /** Ids of the mentioned team members. */
  @Column({ type: "simple-json" }) mentions: string[];
  @Column({ type: TIMESTAMP, nullable: true }) resolvedAt: Date | null;
  @Column({ ...UUID, nullable: true }) resolvedById: string | null;
  @Column({ type: TIMESTAMP }) createdAt: Date;

  @ManyToOne(() => User)
  @JoinColumn({ name: "authorId" })
  author?: User;

  @ManyToOne(() => User, { onDelete: "SET NULL" })
  @JoinColumn({ name: "resolvedById" })
  resolvedBy?: User | null;
}

import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import type { PlanStatus, Verdict } from "@/contracts/plans";
import { TIMESTAMP, UUID } from "../columns";
import { Site } from "./site";
import { User } from "./user";

/**
 * A survey plan of a site. Its documents live in immutable revisions (plan_revisions,
 * addressable by planId + number); the plan row carries the workflow status, the number of
 * the latest revision and that revision's worst verdict for the lists.
 */
@Entity({ name: "plans" })
export class Plan {
  @PrimaryColumn(UUID) id: string;
  @Column(UUID) teamId: string;
  @Column(UUID) siteId: string;
  @Column({ type: "varchar", length: 120 }) name: string;
  @Column({ type: "varchar", length: 24 }) status: PlanStatus;
  /** The status an archived plan returns to when restored; null unless archived. */
  @Column({ type: "varchar", length: 24, nullable: true }) statusBeforeArchive: PlanStatus | null;
  /** A trainee's personal scenario: visible to its author, admins and reviewers only. */
  @Column({ type: "boolean" }) sandbox: boolean;
  @Column(UUID) authorId: string;
  /** Who last submitted it for review (told about the decision with the author). */
  @Column({ ...UUID, nullable: true }) submittedById: string | null;
  @Column({ type: "integer" }) latestRevision: number;
  @Column({ type: "varchar", length: 16, nullable: true }) worstVerdict: Verdict | null;
  @Column({ type: TIMESTAMP }) createdAt: Date;
  @Column({ type: TIMESTAMP }) updatedAt: Date;

  @ManyToOne(() => User)
  @JoinColumn({ name: "authorId" })
  author?: User;

  @ManyToOne(() => Site, { onDelete: "CASCADE" })
  @JoinColumn({ name: "siteId" })
  site?: Site;
}

import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import type { RevisionAnalysisSummary, Verdict } from "@/contracts/plans";
import type { Plan as PlanDocument } from "@engine";
import { TIMESTAMP, UUID } from "../columns";
import { Plan } from "./plan";
import { User } from "./user";

/** One immutable saved state of a plan: the document, its analysis summary, who and when. */
@Entity({ name: "plan_revisions" })
@Index("UQ_plan_revisions_plan_number", ["planId", "number"], { unique: true })
export class PlanRevision {
  @PrimaryColumn(UUID) id: string;
  @Column(UUID) teamId: string;
  @Column(UUID) planId: string;
  /** 1, 2, 3… per plan. */
  @Column({ type: "integer" }) number: number;
  /** The plan document (engine plan schema, SI units) as saved. */
  @Column({ type: "simple-json" }) document: PlanDocument;
  /** Compact analysis computed with the engine at save time; null if the engine refused. */
  @Column({ type: "simple-json", nullable: true }) summary: RevisionAnalysisSummary | null;
  @Column({ type: "varchar", length: 16, nullable: true }) worstVerdict: Verdict | null;
  @Column(UUID) authorId: string;
  @Column({ type: "varchar", length: 300, nullable: true }) message: string | null;
  @Column({ type: TIMESTAMP }) createdAt: Date;

  @ManyToOne(() => Plan, { onDelete: "CASCADE" })
  @JoinColumn({ name: "planId" })
  plan?: Plan;

  @ManyToOne(() => User)
  @JoinColumn({ name: "authorId" })
  author?: User;
}

import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import type { FirstBreakPick, InterpretationChoices } from "@/contracts/field";
import { TIMESTAMP, UUID } from "../columns";
import { User } from "./user";

/** The first-break picks saved for a plan (one set per plan; a save replaces it). */
@Entity({ name: "pick_sets" })
export class PickSet {
  @PrimaryColumn(UUID) id: string;
  @Column(UUID) teamId: string;
  @Column(UUID) planId: string;
  /** Latest plan revision when the picks were saved. */
  @Column({ type: "integer" }) revision: number;
  @Column({ type: "simple-json" }) picks: FirstBreakPick[];
  /** The record or CSV the picks came from; null when deleted or not given. */
  @Column({ ...UUID, nullable: true }) attachmentId: string | null;
  @Column({ type: "varchar", length: 40, nullable: true }) picker: string | null;
  /** The interpretation choices made on the Field check; null: the defaults. */
  @Column({ type: "simple-json", nullable: true }) interpretation: InterpretationChoices | null;
  @Column(UUID) updatedById: string;
  @Column({ type: TIMESTAMP }) updatedAt: Date;

  @ManyToOne(() => User)
  @JoinColumn({ name: "updatedById" })
  updatedBy?: User;
}

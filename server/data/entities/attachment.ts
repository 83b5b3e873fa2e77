import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import type { AttachmentFacts, AttachmentKind } from "@/contracts/field";
import { BLOB, TIMESTAMP, UUID } from "../columns";
import { User } from "./user";

/**
 * A file uploaded to a plan (borehole log, picks CSV or SEG-2 record), stored against the
 * revision that was the latest when it arrived. Only files that passed the content check are
 * stored; the content never changes.
 */
@Entity({ name: "attachments" })
export class Attachment {
  @PrimaryColumn(UUID) id: string;
  @Column(UUID) teamId: string;
  @Column(UUID) planId: string;
  /** The plan_revisions row it was stored against. */
  @Column(UUID) revisionId: string;
  /** That revision's number. */
  @Column({ type: "integer" }) revision: number;
  @Column({ type: "varchar", length: 16 }) kind: AttachmentKind;
  @Column({ type: "varchar", length: 200 }) fileName: string;
  @Column({ type: "varchar", length: 100 }) mediaType: string;
  @Column({ type: "integer" }) size: number;
  @Column({ type: "varchar", length: 64 }) sha256: string;
  /** What the content check read from the file (counts, positions, the model a log builds). */
  @Column({ type: "simple-json" }) facts: AttachmentFacts;
  /** The file's bytes; not loaded by listings (select: false). */
  @Column({ type: BLOB, select: false }) content: Buffer;
  /** The object holding the bytes when they are in object storage (then `content` is empty);
   * null when `content` holds them (server/data/file-store.ts). */
  @Column({ type: "varchar", length: 400, nullable: true }) objectKey: string | null;
  @Column(UUID) uploadedById: string;
  @Column({ type: TIMESTAMP }) createdAt: Date;

  @ManyToOne(() => User)
  @JoinColumn({ name: "uploadedById" })
  uploadedBy?: User;
}

import { Column, Entity, PrimaryColumn } from "typeorm";
import { TIMESTAMP, UUID } from "../columns";

/** An e-mailed, single-use, expiring password-reset link. Only the token's SHA-256 is stored. */
@Entity({ name: "password_resets" })
export class PasswordReset {
  @PrimaryColumn(UUID) id: string;
  @Column(UUID) userId: string;
  @Column({ type: "varchar", length: 64, unique: true }) tokenHash: string;
  @Column({ type: TIMESTAMP }) createdAt: Date;
  @Column({ type: TIMESTAMP }) expiresAt: Date;
  @Column({ type: TIMESTAMP, nullable: true }) usedAt: Date | null;
}

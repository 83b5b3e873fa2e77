import { Column, Entity, PrimaryColumn } from "typeorm";
import { TIMESTAMP, UUID } from "../columns";

/** A person who can sign in. E-mail is stored lower-case and is unique. */
@Entity({ name: "users" })
export class User {
  @PrimaryColumn(UUID) id: string;
  @Column({ type: "varchar", length: 200, unique: true }) email: string;
  @Column({ type: "varchar", length: 100 }) name: string;
  /** argon2id PHC string. */
  @Column({ type: "varchar", length: 255 }) passwordHash: string;
  @Column({ type: TIMESTAMP }) createdAt: Date;
  @Column({ type: TIMESTAMP }) updatedAt: Date;
}

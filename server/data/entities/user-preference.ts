import { Column, Entity, PrimaryColumn } from "typeorm";
import { TIMESTAMP, UUID } from "../columns";

/** Per-user display preferences (one row per user, created on first change). */
@Entity({ name: "user_preferences" })
export class UserPreference {
  @PrimaryColumn(UUID) userId: string;
  @Column({ type: "varchar", length: 16 }) units: "metric" | "imperial";
  @Column({ type: TIMESTAMP }) updatedAt: Date;
}

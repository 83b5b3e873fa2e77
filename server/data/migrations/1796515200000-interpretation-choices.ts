import type { MigrationInterface, QueryRunner } from "typeorm";

/**
 * The interpretation choices of the Field check (method, GRM XY, datum, assignment of picks to
 * refractors, station elevations) are kept with the plan's saved picks as JSON text, so the
 * report and interpretation.csv use them. Null: the defaults (older pick sets).
 * Plain SQL that SQLite and PostgreSQL both accept (no table rebuild on SQLite).
 */
export class InterpretationChoices1796515200000 implements MigrationInterface {
  name = "InterpretationChoices1796515200000";

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "pick_sets" ADD COLUMN "interpretation" text`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "pick_sets" DROP COLUMN "interpretation"`);
  }
}

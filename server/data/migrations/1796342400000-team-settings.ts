import type { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Team settings (issue 14): the team's seismograph channel count, which the designer's Apply
 * choices compare each spread against. Every team, existing ones included, starts at 48
 * (a common recorder size, common practice); the API keeps it within 2…1024 (MAX_CHANNELS).
 * Plain SQL that SQLite and PostgreSQL both accept (no table rebuild on SQLite).
 */
export class TeamSettings1796342400000 implements MigrationInterface {
  name = "TeamSettings1796342400000";

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `ALTER TABLE "teams" ADD COLUMN "seismographChannels" integer NOT NULL DEFAULT 48`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "teams" DROP COLUMN "seismographChannels"`);
  }
}

import type { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Uploads may live in an S3-compatible object store (server/data/file-store.ts): the row then
 * names the object in `objectKey` and keeps an empty `content`. Null: the bytes are in the row.
 * Plain SQL that SQLite and PostgreSQL both accept (no table rebuild on SQLite).
 */
export class ObjectStorage1796256000000 implements MigrationInterface {
  name = "ObjectStorage1796256000000";

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "attachments" ADD COLUMN "objectKey" varchar(400)`);
    await q.query(`CREATE INDEX "IDX_attachments_object_key" ON "attachments" ("objectKey")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_attachments_object_key"`);
    await q.query(`ALTER TABLE "attachments" DROP COLUMN "objectKey"`);
  }
}

import { Table, type MigrationInterface, type QueryRunner } from "typeorm";

/**
 * Rate-limit counters kept in the database so that every app server on one database shares
 * them (server/http/rate-limit.ts). One row per bucket, hashed key and fixed window; rows
 * older than two windows are swept.
 */
export class RateLimits1796169600000 implements MigrationInterface {
  name = "RateLimits1796169600000";

  async up(q: QueryRunner): Promise<void> {
    await q.createTable(
      new Table({
        name: "rate_limit_counters",
        columns: [
          { name: "bucket", type: "varchar", length: "32", isPrimary: true },
          { name: "subject", type: "varchar", length: "64", isPrimary: true },
          { name: "windowStart", type: "bigint", isPrimary: true },
          { name: "hits", type: "integer", default: 0 },
        ],
        indices: [{ name: "IDX_rate_limit_counters_window", columnNames: ["windowStart"] }],
      }),
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.dropTable("rate_limit_counters");
  }
}

/**
 * Copies a whole Spreadsight database into an empty one (`npm run db:copy`), typically a
 * team's SQLite file into PostgreSQL. Everything is copied except sessions (everyone signs in
 * again) and rate-limit counters: teams, users, memberships, sites, plans, revisions,
 * comments, notifications and their settings, preferences, invitations, password resets, the
 * mailbox, the audit trail, uploaded files (their bytes, or their object keys when they are in
 * object storage: the objects stay where they are) and saved picks.
 *
 * Rows go through the entities, so each database's own types (time stamps, JSON, booleans,
 * bytes) are converted by TypeORM. The copy is one transaction on the target: it is complete
 * or absent. Both databases are migrated to the current schema first (as starting the app
 * would). The target must be empty.
 */
import type { DataSource, EntityTarget, ObjectLiteral } from "typeorm";
import { openDatabase, type DatabaseOptions } from "./data-source";
import {
  Attachment,
  AuditEvent,
  entities,
  Invitation,
  MailMessage,
  MailOutboxRow,
  Membership,
  NotificationSetting,
  PasswordReset,
  PickSet,
  Plan,
  PlanComment,
  PlanNotification,
  PlanRevision,
  Session,
  Site,
  Team,
  User,
  UserPreference,
} from "./entities";

/** Parents before children (foreign keys). */
const ORDER: { entity: EntityTarget<ObjectLiteral>; batch: number }[] = [
  { entity: Team, batch: 500 },
  { entity: User, batch: 500 },
  { entity: Membership, batch: 500 },
  { entity: Site, batch: 500 },
  { entity: Plan, batch: 500 },
  { entity: PlanRevision, batch: 100 },
  { entity: PlanComment, batch: 500 },
  { entity: PlanNotification, batch: 500 },
  { entity: NotificationSetting, batch: 500 },
  { entity: UserPreference, batch: 500 },
  { entity: Invitation, batch: 500 },
  { entity: PasswordReset, batch: 500 },
  { entity: MailMessage, batch: 200 },
  // Unsent notification e-mails travel with the database (sent ones are swept after a week).
  { entity: MailOutboxRow, batch: 200 },
  { entity: AuditEvent, batch: 500 },
  { entity: Attachment, batch: 10 },
  { entity: PickSet, batch: 200 },
];
/** Deliberately not copied. */
const SKIPPED: EntityTarget<ObjectLiteral>[] = [Session];

export interface TableCount {
  table: string;
  source: number;
  target: number;
}

export class CopyRefused extends Error {}

function tableName(ds: DataSource, entity: EntityTarget<ObjectLiteral>): string {
  return ds.getMetadata(entity).tableName;
}

/** Row counts of the copied tables. */
export async function countTables(ds: DataSource): Promise<Map<string, number>> {
  const counts = new Map<string, number>();
  for (const { entity } of ORDER) counts.set(tableName(ds, entity), await ds.getRepository(entity).count());
  return counts;
}

/**
 * Copies `from` into `to` and verifies the counts. Throws CopyRefused (nothing written) when
 * the target holds any row, and an Error when a count differs after the copy.
 */
export async function copyDatabase(
  from: DatabaseOptions,
  to: DatabaseOptions,
  log: (line: string) => void = () => {},
): Promise<TableCount[]> {
  const known = new Set([...ORDER.map((o) => o.entity), ...SKIPPED]);
  const unknown = entities.filter((e) => !known.has(e));
  if (unknown.length) {
    // A new table must be added to ORDER (or SKIPPED) before copies can be trusted.
    throw new Error(`db:copy does not know the tables of ${unknown.map((e) => e.name).join(", ")}`);
  }
  const source = await openDatabase(from);
  let target: DataSource | null = null;
  try {
    target = await openDatabase(to);
    const occupied: string[] = [];
    for (const entity of [...ORDER.map((o) => o.entity), ...SKIPPED]) {
      const n = await target.getRepository(entity).count();
      if (n > 0) occupied.push(`${tableName(target, entity)} (${n})`);
    }
    if (occupied.length) {
      throw new CopyRefused(
        `the target is not empty: ${occupied.join(", ")}. Copy only into a new, empty database.`,
      );
    }
    const dest = target;
    await dest.transaction(async (manager) => {
      for (const { entity, batch } of ORDER) {
        const metadata = source.getMetadata(entity);
        const name = metadata.tableName;
        const primary = metadata.primaryColumns.map((c) => c.propertyName);
        let copied = 0;
        for (let offset = 0; ; offset += batch) {
          const query = source.getRepository(entity).createQueryBuilder("r");
          // Every column, including those that listings leave out (an upload's bytes).
          for (const column of metadata.columns) {
            if (column.isSelect === false) query.addSelect(`r.${column.propertyName}`);
          }
          // Threads' first comments before their replies (replies point at them).
          if (entity === PlanComment) query.orderBy("r.parentId IS NULL", "DESC");
          for (const [i, key] of primary.entries()) {
            query[i === 0 && entity !== PlanComment ? "orderBy" : "addOrderBy"](`r.${key}`, "ASC");
          }
          const rows = await query.skip(offset).take(batch).getMany();
          if (!rows.length) break;
          await manager.getRepository(entity).insert(rows);
          copied += rows.length;
        }
        log(`  ${name.padEnd(22)} ${String(copied).padStart(8)} rows copied`);
      }
    });
    const before = await countTables(source);
    const after = await countTables(dest);
    const counts = [...before].map(([table, n]) => ({
      table,
      source: n,
      target: after.get(table) ?? -1,
    }));
    const wrong = counts.filter((c) => c.source !== c.target);
    if (wrong.length) {
      throw new Error(
        `verification failed: ${wrong.map((c) => `${c.table} ${c.source} → ${c.target}`).join(", ")}`,
      );
    }
    return counts;
  } finally {
    await source.destroy();
    if (target?.isInitialized) await target.destroy();
  }
}

/**
 * Column types used by every entity and migration, in one place. Entities name two portable
 * types that the databases spell differently:
 *
 * | entity type | SQLite                 | PostgreSQL                 |
 * |-------------|------------------------|----------------------------|
 * | "datetime"  | datetime (UTC text)    | timestamp with time zone   |
 * | "blob"      | blob                   | bytea                      |
 *
 * `usePortableTypes` teaches a PostgreSQL DataSource the left-hand names; migrations ask
 * `timestampType` / `binaryType` for the right-hand ones. JSON is stored as text on both
 * ("simple-json"), booleans as boolean (SQLite: 0/1), UUIDs as varchar(36).
 */
import { Table, type DataSource, type QueryRunner } from "typeorm";

export const TIMESTAMP = "datetime" as const;
/** Binary column type in entities (see the table above). */
export const BLOB = "blob" as const;
/** UUIDs as text: portable across SQLite and PostgreSQL. */
export const UUID = { type: "varchar", length: 36 } as const;
/** Migration column form of UUID. */
export const UUID_COLUMN = { type: "varchar", length: "36" } as const;

type TableOptions = NonNullable<ConstructorParameters<typeof Table>[0]>;
type ColumnLike = Parameters<DataSource["driver"]["normalizeType"]>[0];

const POSTGRES_NAMES: Record<string, string> = {
  [TIMESTAMP]: "timestamp with time zone",
  [BLOB]: "bytea",
};

function isPostgres(dataSource: DataSource): boolean {
  return dataSource.options.type === "postgres";
}

/** The migration column type for a point in time on this connection's database. */
export function timestampType(q: QueryRunner): string {
  return isPostgres(q.connection) ? POSTGRES_NAMES[TIMESTAMP] : TIMESTAMP;
}

/** The migration column type for bytes on this connection's database. */
export function binaryType(q: QueryRunner): string {
  return isPostgres(q.connection) ? POSTGRES_NAMES[BLOB] : BLOB;
}

/**
 * On PostgreSQL, maps the entities' "datetime" and "blob" to timestamptz and bytea (the pg
 * driver already converts Date and Buffer values for them). Call before `initialize()`.
 * SQLite needs nothing. Only this DataSource's driver is changed, so a process may hold one of
 * each (db:copy does).
 */
export function usePortableTypes(dataSource: DataSource): void {
  if (!isPostgres(dataSource)) return;
  const driver = dataSource.driver;
  const normalize = driver.normalizeType.bind(driver);
  driver.normalizeType = (column: ColumnLike) => {
    const name = typeof column.type === "string" ? POSTGRES_NAMES[column.type] : undefined;
    return name ?? normalize(column);
  };
}

/**
 * `q.createTable` with the portable "datetime" and "blob" column types spelt for this
 * connection's database (migrations are written once for both).
 */
export async function createPortableTable(q: QueryRunner, options: TableOptions): Promise<void> {
  const columns = options.columns?.map((column) =>
    column.type === TIMESTAMP
      ? { ...column, type: timestampType(q) }
      : column.type === BLOB
        ? { ...column, type: binaryType(q) }
        : column,
  );
  await q.createTable(new Table({ ...options, columns }));
}

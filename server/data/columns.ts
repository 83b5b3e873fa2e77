/**
 * Column types used by every entity and migration, in one place so that switching the
 * database (see docs/api.md, "PostgreSQL") is a change here and in data-source.ts only.
 * SQLite stores `datetime` as UTC text; PostgreSQL would use "timestamptz".
 */
export const TIMESTAMP = "datetime" as const;
/** UUIDs as text: portable across SQLite and PostgreSQL. */
export const UUID = { type: "varchar", length: 36 } as const;
/** Migration column form of UUID. */
export const UUID_COLUMN = { type: "varchar", length: "36" } as const;

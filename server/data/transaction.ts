/**
 * Transactions that behave the same on SQLite and PostgreSQL: as if they ran one at a time.
 *
 * SQLite: TypeORM's better-sqlite3 driver runs everything on one connection, so two
 * overlapping `dataSource.transaction()` calls would nest (the second becomes a savepoint of
 * the first) and a rollback of one could undo the other. `inTransaction` queues them.
 *
 * PostgreSQL: each transaction gets its own pooled connection at SERIALIZABLE isolation, so
 * transactions from any number of app servers on the same database are serialisable. When
 * PostgreSQL refuses one (serialization failure, deadlock, or a unique key taken by a
 * concurrent transaction) the whole callback runs again on fresh data, up to a few times; the
 * second of two racing plan saves then sees the first one's revision and gets the usual 409.
 *
 * Rule for callers: the callback only reads and writes the database (it may run more than
 * once); do network or worker-thread work (password hashing, e-mail) before or after it.
 */
import type { DataSource, EntityManager } from "typeorm";

const queues = new WeakMap<DataSource, Promise<unknown>>();

/** PostgreSQL error codes after which the transaction is retried from the start. */
const RETRY_CODES = new Set([
  "40001", // serialization_failure
  "40P01", // deadlock_detected
  "23505", // unique_violation (a concurrent transaction inserted the same key first)
]);
/** Attempts in all, including the first. */
const MAX_ATTEMPTS = 6;

export function inTransaction<T>(
  dataSource: DataSource,
  work: (manager: EntityManager) => Promise<T>,
): Promise<T> {
  if (dataSource.options.type === "postgres") return serializable(dataSource, work);
  const previous = queues.get(dataSource) ?? Promise.resolve();
  const next = previous.catch(() => undefined).then(() => dataSource.transaction(work));
  queues.set(
    dataSource,
    next.catch(() => undefined),
  );
  return next;
}

/** The PostgreSQL error code of a failed query, if any. */
export function pgErrorCode(error: unknown): string | undefined {
  if (typeof error !== "object" || error === null) return undefined;
  const withCode = error as { code?: unknown; driverError?: { code?: unknown } };
  const code = withCode.driverError?.code ?? withCode.code;
  return typeof code === "string" ? code : undefined;
}

async function serializable<T>(
  dataSource: DataSource,
  work: (manager: EntityManager) => Promise<T>,
): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await dataSource.transaction("SERIALIZABLE", work);
    } catch (error) {
      const code = pgErrorCode(error);
      if (attempt >= MAX_ATTEMPTS || !code || !RETRY_CODES.has(code)) throw error;
      // Back off a little, with jitter, so the racers do not collide again in lockstep.
      await new Promise((resolve) => setTimeout(resolve, 5 * attempt + Math.random() * 10 * attempt));
    }
  }
}

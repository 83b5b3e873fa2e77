/**
 * Transactions on SQLite, one at a time.
 *
 * TypeORM's better-sqlite3 driver runs everything on one connection, so two overlapping
 * `dataSource.transaction()` calls would nest (the second becomes a savepoint of the first)
 * and a rollback of one could undo the other. `inTransaction` queues them. Rule for callers:
 * do no network or worker-thread work (password hashing, e-mail) inside the callback; do it
 * before or after, so the open transaction never yields to other requests.
 */
import type { DataSource, EntityManager } from "typeorm";

const queues = new WeakMap<DataSource, Promise<unknown>>();

export function inTransaction<T>(
  dataSource: DataSource,
  work: (manager: EntityManager) => Promise<T>,
): Promise<T> {
  const previous = queues.get(dataSource) ?? Promise.resolve();
  const next = previous.catch(() => undefined).then(() => dataSource.transaction(work));
  queues.set(
    dataSource,
    next.catch(() => undefined),
  );
  return next;
}

import type { Db } from '../../db/client';

/**
 * Runs `fn` in one synchronous SQLite transaction (never await inside). Drizzle types the transaction
 * handle apart from the database, but it has the same query API; notifications and jobs take a `Db` as
 * their transaction, so the handle is passed on as one. Throwing rolls everything back.
 */
export function inTransaction<T>(db: Db, fn: (tx: Db) => T): T {
  return db.transaction((tx) => fn(tx as unknown as Db));
}

import { AsyncLocalStorage } from 'node:async_hooks';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { Sequelize } from 'sequelize';

/** The dialect a DATABASE_URL selects. */
export type DatabaseDialect = 'sqlite' | 'postgres';

export function dialectOf(databaseUrl: string): DatabaseDialect {
  if (databaseUrl.startsWith('sqlite:')) return 'sqlite';
  if (/^postgres(ql)?:\/\//.test(databaseUrl)) return 'postgres';
  throw new RangeError(
    `DATABASE_URL must start with sqlite: or postgres://; got ${JSON.stringify(databaseUrl.split(':')[0])}`,
  );
}

/** Milliseconds a SQLite connection waits for another writer before giving up. */
export const SQLITE_BUSY_TIMEOUT_MS = 5000;

/**
 * Opens the database named by `databaseUrl`: `sqlite:<file>` (the folder is created; WAL
 * journal and a busy timeout on every connection), `sqlite::memory:`, or `postgres://…`
 * (needs the `pg` package installed).
 */
export async function openDatabase(databaseUrl: string): Promise<Sequelize> {
  const dialect = dialectOf(databaseUrl);
  if (dialect === 'postgres') {
    const sequelize = new Sequelize(databaseUrl, { logging: false, pool: { max: 10 } });
    await sequelize.authenticate();
    return sequelize;
  }
  const target = databaseUrl.slice('sqlite:'.length);
  const storage =
    target === ':memory:' || target === ''
      ? ':memory:'
      : path.resolve(target.replace(/^\/\/(?=\/)/, ''));
  if (storage !== ':memory:') mkdirSync(path.dirname(storage), { recursive: true });
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    storage,
    logging: false,
    hooks: {
      // Sequelize opens one SQLite connection per transaction; each needs the busy timeout.
      afterConnect(connection: unknown) {
        (connection as { configure(option: 'busyTimeout', ms: number): void }).configure(
          'busyTimeout',
          SQLITE_BUSY_TIMEOUT_MS,
        );
      },
    },
  });
  serialiseWrites(sequelize);
  if (storage !== ':memory:') await sequelize.query('PRAGMA journal_mode = WAL;');
  await sequelize.query('PRAGMA foreign_keys = ON;');
  return sequelize;
}

/**
 * One-at-a-time queue for SQLite writers, kept in JavaScript.
 *
 * Sequelize opens one SQLite connection per transaction, and node-sqlite3 runs each statement on
 * one of libuv's threadpool threads (4 by default). A `BEGIN IMMEDIATE` that finds the write lock
 * taken waits in SQLite's busy handler *on that thread*; with four such waiters every pool
 * thread is blocked, so the writer holding the lock can never run its COMMIT and the service
 * stops (defect L1 in docs/robustness.md). Queuing writers here means at most one write
 * transaction (or autocommit write) is in SQLite at a time and the rest wait as promises.
 *
 * Work started from inside a queued transaction (the store says so) runs straight away, so a
 * nested write never waits for itself; it meets SQLite's busy timeout as it did before. The
 * store is on only while writers wait or run.
 */
export class WriteQueue {
  private tail: Promise<void> = Promise.resolve();
  private readonly holder = new AsyncLocalStorage<true>();
  /** Writers waiting or running, for tests and diagnostics. */
  pending = 0;

  run<T>(work: () => Promise<T>): Promise<T> {
    if (this.holder.getStore()) return work();
    const previous = this.tail;
    let release!: () => void;
    this.tail = new Promise<void>((resolve) => {
      release = resolve;
    });
    this.pending += 1;
    return previous
      .then(() => this.holder.run(true, work))
      .finally(() => {
        this.pending -= 1;
        // No writer waiting or running: nothing can be inside the store, so turn it off. While
        // any AsyncLocalStorage is on, Node (20) runs its async hooks on every promise of the
        // process (an id, the store carried over, before and after each reaction): 7.6 µs of a
        // compute answer's request thread under the throughput bench's load (docs/robustness.md,
        // throughput, sixth pass). The next writer's `run` turns it on again. Work a finished
        // writer left running is then queued like any other, as it should be.
        if (this.pending === 0) this.holder.disable();
        release();
      });
  }
}

const WRITE_SQL = /^\s*(INSERT|UPDATE|DELETE|REPLACE|CREATE|DROP|ALTER)\b/i;

/** The write queue of a SQLite Sequelize instance opened by {@link openDatabase}. */
export function writeQueueOf(sequelize: Sequelize): WriteQueue | undefined {
  return (sequelize as Sequelize & { pulsewrightWriteQueue?: WriteQueue }).pulsewrightWriteQueue;
}

/**
 * Routes every managed transaction, and every write statement outside a transaction, of a
 * SQLite instance through one {@link WriteQueue}. Reads outside transactions are not queued
 * (WAL readers do not wait for the writer). Unmanaged transactions (`transaction()` without a
 * callback) are not queued; the service does not use them.
 */
function serialiseWrites(sequelize: Sequelize): void {
  const queue = new WriteQueue();
  (sequelize as Sequelize & { pulsewrightWriteQueue?: WriteQueue }).pulsewrightWriteQueue = queue;
  const transaction = sequelize.transaction.bind(sequelize) as (
    ...args: unknown[]
  ) => Promise<unknown>;
  const query = sequelize.query.bind(sequelize) as (...args: unknown[]) => Promise<unknown>;
  const patched = sequelize as unknown as {
    transaction: (...args: unknown[]) => Promise<unknown>;
    query: (...args: unknown[]) => Promise<unknown>;
  };
  patched.transaction = (...args: unknown[]) => {
    const managed = typeof args[0] === 'function' || typeof args[1] === 'function';
    return managed ? queue.run(() => transaction(...args)) : transaction(...args);
  };
  patched.query = (...args: unknown[]) => {
    const [sql, options] = args as [unknown, { transaction?: unknown } | undefined];
    const text = typeof sql === 'string' ? sql : (sql as { query?: unknown } | null)?.query;
    const write = typeof text === 'string' && WRITE_SQL.test(text) && !options?.transaction;
    return write ? queue.run(() => query(...args)) : query(...args);
  };
}

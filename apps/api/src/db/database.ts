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
  const storage = target === ':memory:' || target === '' ? ':memory:' : path.resolve(target.replace(/^\/\/(?=\/)/, ''));
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
  if (storage !== ':memory:') await sequelize.query('PRAGMA journal_mode = WAL;');
  await sequelize.query('PRAGMA foreign_keys = ON;');
  return sequelize;
}

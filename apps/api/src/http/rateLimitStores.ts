import { setTimeout as sleep } from 'node:timers/promises';
import { PostgresStore } from '@acpr/rate-limit-postgresql';
import type { Store } from 'express-rate-limit';
import type { Sequelize } from 'sequelize';
import { dialectOf } from '../db/database.js';

/** Gives each rate limiter its store: the replicas' shared one on PostgreSQL, memory on SQLite. */
export interface RateLimitStores {
  /** A store for one limiter (`name` keeps its counts apart); undefined means express-rate-limit's memory store. */
  store(name: string): Store | undefined;
  /** Resolves when the shared stores' tables are in place (PostgreSQL). */
  ready(): Promise<void>;
  /** Closes the stores' connections. */
  close(): Promise<void>;
}

/** Migrations of @acpr/rate-limit-postgresql, recorded by its migration runner in `migrations`. */
const STORE_MIGRATIONS = 7;

/**
 * The rate-limit stores for `databaseUrl`. On PostgreSQL each limiter gets an
 * @acpr/rate-limit-postgresql store (counts in the `rate_limit` schema, so a limit holds across
 * every replica behind the load balancer), each with a small connection pool; the package sets up
 * its tables from each store's constructor without waiting, so {@link RateLimitStores.ready}
 * waits for them before the service takes requests. On SQLite (one process) memory is enough.
 */
export function rateLimitStores(databaseUrl: string, sequelize: Sequelize): RateLimitStores {
  const stores: PostgresStore[] = [];
  if (dialectOf(databaseUrl) !== 'postgres') {
    return { store: () => undefined, ready: async () => undefined, close: async () => undefined };
  }
  return {
    store(name) {
      const store = new PostgresStore({ connectionString: databaseUrl, max: 2 }, name);
      stores.push(store);
      return store;
    },
    async ready() {
      for (let attempt = 0; attempt < 100; attempt++) {
        const [table] = (await sequelize.query(
          "SELECT to_regclass('public.migrations') IS NOT NULL AS present",
          { type: 'SELECT' },
        )) as Array<{ present: boolean }>;
        if (table?.present) {
          const [row] = (await sequelize.query(
            'SELECT count(*) AS applied FROM public.migrations',
            {
              type: 'SELECT',
            },
          )) as Array<{ applied: string | number }>;
          if (Number(row?.applied) >= STORE_MIGRATIONS) return;
        }
        await sleep(100);
      }
      throw new Error('The rate-limit tables on PostgreSQL were not set up within 10 s.');
    },
    async close() {
      await Promise.all(
        stores.map(async (store) => {
          await (store.pool as { end(): Promise<void> } | undefined)?.end();
        }),
      );
    },
  };
}

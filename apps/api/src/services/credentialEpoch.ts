import { QueryTypes, type Transaction } from 'sequelize';
import type { Models } from '../models/index.js';

/**
 * A count of the changes that can take a bearer token's rights away. The credential cache
 * (services/credentialCache.ts) keeps a verified principal with the count read *before* its
 * lookup and serves it only while the count is unchanged, so a change committed after that read
 * always invalidates it.
 */
export interface CredentialEpoch {
  /** The current count. */
  read(): Promise<number>;
}

/** Fields whose change alone never takes rights away (bookkeeping of the lookup itself). */
const BOOKKEEPING = new Set(['lastUsedAt', 'updatedAt']);

/** The models whose changes can end, lower or move a credential's rights. */
const WATCHED = ['Session', 'ApiKey', 'Membership', 'User', 'Team'] as const;

interface HookOptions {
  transaction?: Transaction | null;
  fields?: string[];
  attributes?: Record<string, unknown>;
}

/**
 * The epoch for a database, counted by hooks on the credential models (any update, other than
 * of `lastUsedAt` alone, and any delete of a session, key, membership, user or team):
 *
 * - SQLite (one process): the count is in memory and is raised after the change commits, so no
 *   request reads it anew while the old rows are still visible.
 * - PostgreSQL (replicas): the count is the `credential_epochs` row (migration 0005), raised in
 *   the same transaction as the change and read by every replica on each request: one
 *   primary-key read instead of the credential, lineage and membership lookups.
 */
export function credentialEpoch(models: Models): CredentialEpoch {
  const { sequelize } = models;
  const shared = sequelize.getDialect() === 'postgres';
  let local = 0;
  const raise = async (options: HookOptions): Promise<void> => {
    const fields = options.fields ?? Object.keys(options.attributes ?? {});
    if (fields.length && fields.every((field) => BOOKKEEPING.has(field))) return;
    if (shared) {
      await sequelize.query('UPDATE credential_epochs SET value = value + 1 WHERE id = 1', {
        transaction: options.transaction ?? null,
      });
    } else if (options.transaction) {
      options.transaction.afterCommit(() => {
        local += 1;
      });
    } else {
      local += 1;
    }
  };
  for (const name of WATCHED) {
    const model = models[name] as unknown as {
      addHook(event: string, hook: (...args: unknown[]) => Promise<void>): void;
    };
    // Instance hooks get (instance, options); bulk hooks get (options).
    model.addHook('afterUpdate', (_row, options) => raise(options as HookOptions));
    model.addHook('afterDestroy', (_row, options) => raise(options as HookOptions));
    model.addHook('afterBulkUpdate', (options) => raise(options as HookOptions));
    model.addHook('afterBulkDestroy', (options) => raise(options as HookOptions));
  }
  if (!shared) return { read: async () => local };
  return {
    async read() {
      const rows = await sequelize.query<{ value: string | number }>(
        'SELECT value FROM credential_epochs WHERE id = 1',
        { type: QueryTypes.SELECT },
      );
      return Number(rows[0]?.value ?? 0);
    },
  };
}

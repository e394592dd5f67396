import type { Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import * as initialSchema from '../migrations/0001-initial-schema.js';
import * as studyDesign from '../migrations/0002-study-design.js';
import * as accountCredentials from '../migrations/0003-account-credentials.js';
import * as dpwmNames from '../migrations/0004-dpwm-names.js';
import * as credentialEpoch from '../migrations/0005-credential-epoch.js';

/** The migrations in order; listed by hand so src/ and dist/ run the same set. */
export const MIGRATIONS = [
  { name: '0001-initial-schema', up: initialSchema.up, down: initialSchema.down },
  { name: '0002-study-design', up: studyDesign.up, down: studyDesign.down },
  { name: '0003-account-credentials', up: accountCredentials.up, down: accountCredentials.down },
  { name: '0004-dpwm-names', up: dpwmNames.up, down: dpwmNames.down },
  { name: '0005-credential-epoch', up: credentialEpoch.up, down: credentialEpoch.down },
];

/**
 * Applies pending migrations (up to and including `upTo` when given: tests build a database of
 * an earlier release that way). Returns true when the database was new (no migration had run),
 * which is when the demo scenario is seeded.
 */
export async function migrate(
  sequelize: Sequelize,
  upTo?: string,
): Promise<{ fresh: boolean; applied: string[] }> {
  const umzug = new Umzug({
    migrations: MIGRATIONS.map(({ name, up, down }) => ({
      name,
      up: () => up({ context: sequelize.getQueryInterface() }),
      down: () => down({ context: sequelize.getQueryInterface() }),
    })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
  const run = async () => {
    const executed = await umzug.executed();
    const applied = await umzug.up(upTo === undefined ? {} : { to: upTo });
    return { fresh: executed.length === 0, applied: applied.map((m) => m.name) };
  };
  if (sequelize.getDialect() !== 'postgres') return run();
  // Replicas starting together on one PostgreSQL database: one migrates (and, on a new database,
  // is the one that seeds); the others wait on this lock, then find nothing to do. The lock is
  // the transaction's; the migrations run on other connections of the pool.
  return sequelize.transaction(async (transaction) => {
    await sequelize.query('SELECT pg_advisory_xact_lock(hashtext(:key))', {
      replacements: { key: 'pulsewright:migrate' },
      transaction,
    });
    return run();
  });
}

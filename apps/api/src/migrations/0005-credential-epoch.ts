import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Issue 11, throughput with replicas: one row counting the changes that can take a bearer
 * token's rights away (a session ended, a key revoked, a membership changed or removed, a
 * password reset). Each process caches verified credentials and serves them from memory while
 * the count it read before the lookup is still the count; on PostgreSQL, where several replicas
 * share the database, the count is read from this row on each request, so a revocation on one
 * replica bites on the next request to any other (services/credentialEpoch.ts).
 */
export async function up({ context: q }: { context: QueryInterface }): Promise<void> {
  await q.createTable('credential_epochs', {
    id: { type: DataTypes.INTEGER, primaryKey: true },
    value: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
  });
  await q.bulkInsert('credential_epochs', [{ id: 1, value: 0 }]);
}

export async function down({ context: q }: { context: QueryInterface }): Promise<void> {
  await q.dropTable('credential_epochs');
}

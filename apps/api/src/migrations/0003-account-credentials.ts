import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

/** One-time tokens (`pwt_…`), session tokens and API keys as they appear in a mail body. */
const LIVE_SECRET = /pw[tsk]_[A-Za-z0-9_-]{16,}/g;

/**
 * Issue 11, accounts: the outbox belongs to a team (an admin sees only their team's mail) and
 * never keeps a live secret; an API key records the key it was made with (lineage), so it is
 * revoked with it and cannot outlive it. Outbox rows written before this migration hold live
 * one-time links in the local (no SMTP) case: they are masked here, and, having no team, are
 * shown to no one.
 */
export async function up({ context: q }: { context: QueryInterface }): Promise<void> {
  await q.addColumn('outbox', 'teamId', {
    type: DataTypes.UUID,
    allowNull: true,
    references: { model: 'teams', key: 'id' },
    onDelete: 'CASCADE',
  });
  await q.addIndex('outbox', ['teamId', 'createdAt']);
  await q.addColumn('api_keys', 'createdWithKeyId', {
    type: DataTypes.UUID,
    allowNull: true,
    references: { model: 'api_keys', key: 'id' },
    onDelete: 'CASCADE',
  });
  await q.addIndex('api_keys', ['createdWithKeyId']);

  const rows = await q.sequelize.query<{ id: string; text: string; message: string }>(
    'SELECT id, text, message FROM outbox',
    { type: QueryTypes.SELECT },
  );
  for (const row of rows) {
    const text = row.text.replace(LIVE_SECRET, maskSecret);
    const message = row.message.replace(LIVE_SECRET, maskSecret);
    if (text !== row.text || message !== row.message) {
      await q.bulkUpdate('outbox', { text, message }, { id: row.id });
    }
  }
}

export async function down({ context: q }: { context: QueryInterface }): Promise<void> {
  await q.removeIndex('api_keys', ['createdWithKeyId']);
  await q.removeColumn('api_keys', 'createdWithKeyId');
  await q.removeIndex('outbox', ['teamId', 'createdAt']);
  await q.removeColumn('outbox', 'teamId');
}

/** Frozen copy of the mask the mail service applies (a migration must not change with it). */
function maskSecret(secret: string): string {
  return `${secret.slice(0, 4)}[hidden]`;
}

import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The first schema: teams, users, memberships, sessions, API keys, projects, studies with
 * revisions, captures, jobs, audit events, invitations, password resets and the e-mail outbox.
 * Frozen: later changes go into new migrations.
 */
export async function up({ context: q }: { context: QueryInterface }): Promise<void> {
  const id = { type: DataTypes.UUID, primaryKey: true, allowNull: false };
  const ref = (table: string, allowNull = false, onDelete = 'CASCADE') => ({
    type: DataTypes.UUID,
    allowNull,
    references: { model: table, key: 'id' },
    onDelete,
  });
  const text = (allowNull = false) => ({ type: DataTypes.STRING(255), allowNull });
  const date = (allowNull = true) => ({ type: DataTypes.DATE, allowNull });
  const stamps = { createdAt: date(false), updatedAt: date(false) };
  const role = { type: DataTypes.STRING(16), allowNull: false };

  await q.createTable('teams', { id, name: text(), ...stamps });
  await q.createTable('users', {
    id,
    email: { ...text(), unique: true },
    name: text(),
    passwordHash: text(true),
    ...stamps,
  });
  await q.createTable('memberships', {
    id,
    teamId: ref('teams'),
    userId: ref('users'),
    role,
    ...stamps,
  });
  await q.addIndex('memberships', ['teamId', 'userId'], { unique: true });
  await q.createTable('sessions', {
    id,
    userId: ref('users'),
    teamId: ref('teams'),
    tokenHash: { ...text(), unique: true },
    expiresAt: date(false),
    lastUsedAt: date(),
    revokedAt: date(),
    ...stamps,
  });
  await q.createTable('api_keys', {
    id,
    userId: ref('users'),
    teamId: ref('teams'),
    name: text(),
    prefix: text(),
    keyHash: { ...text(), unique: true },
    role,
    lastUsedAt: date(),
    expiresAt: date(),
    revokedAt: date(),
    ...stamps,
  });
  await q.createTable('projects', {
    id,
    teamId: ref('teams'),
    name: text(),
    description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    createdById: ref('users', true, 'SET NULL'),
    ...stamps,
  });
  await q.createTable('studies', {
    id,
    teamId: ref('teams'),
    projectId: ref('projects'),
    currentRevision: { type: DataTypes.INTEGER, allowNull: false },
    name: text(),
    method: text(),
    ...stamps,
  });
  await q.addIndex('studies', ['projectId']);
  await q.createTable('study_revisions', {
    id,
    studyId: ref('studies'),
    revision: { type: DataTypes.INTEGER, allowNull: false },
    name: text(),
    method: text(),
    parameters: { type: DataTypes.JSON, allowNull: false },
    load: { type: DataTypes.JSON, allowNull: true },
    filter: { type: DataTypes.JSON, allowNull: true },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    authorId: ref('users', true, 'SET NULL'),
    restoredFrom: { type: DataTypes.INTEGER, allowNull: true },
    ...stamps,
  });
  // Two edits can never both become revision n + 1: the loser's insert fails.
  await q.addIndex('study_revisions', ['studyId', 'revision'], { unique: true });
  await q.createTable('captures', {
    id,
    teamId: ref('teams'),
    projectId: ref('projects', true, 'SET NULL'),
    name: text(),
    fileName: text(),
    contentType: text(),
    byteSize: { type: DataTypes.INTEGER, allowNull: false },
    original: { type: DataTypes.BLOB, allowNull: false },
    series: { type: DataTypes.JSON, allowNull: false },
    rows: { type: DataTypes.INTEGER, allowNull: false },
    sampleRate: { type: DataTypes.DOUBLE, allowNull: false },
    duration: { type: DataTypes.DOUBLE, allowNull: false },
    columns: { type: DataTypes.JSON, allowNull: false },
    uploadedById: ref('users', true, 'SET NULL'),
    ...stamps,
  });
  await q.createTable('jobs', {
    id,
    teamId: ref('teams'),
    userId: ref('users', true, 'SET NULL'),
    kind: text(),
    status: { type: DataTypes.STRING(16), allowNull: false },
    progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    input: { type: DataTypes.JSON, allowNull: false },
    result: { type: DataTypes.JSON, allowNull: true },
    error: { type: DataTypes.TEXT, allowNull: true },
    startedAt: date(),
    finishedAt: date(),
    ...stamps,
  });
  await q.addIndex('jobs', ['status']);
  await q.createTable('audit_events', {
    id,
    teamId: ref('teams', true, 'SET NULL'),
    actorId: ref('users', true, 'SET NULL'),
    actorEmail: text(true),
    action: text(),
    subjectType: text(),
    subjectId: text(true),
    details: { type: DataTypes.JSON, allowNull: false },
    ...stamps,
  });
  await q.addIndex('audit_events', ['teamId', 'createdAt']);
  await q.createTable('invitations', {
    id,
    teamId: ref('teams'),
    email: text(),
    role,
    tokenHash: { ...text(), unique: true },
    invitedById: ref('users', true, 'SET NULL'),
    expiresAt: date(false),
    acceptedAt: date(),
    withdrawnAt: date(),
    ...stamps,
  });
  await q.createTable('password_resets', {
    id,
    userId: ref('users'),
    tokenHash: { ...text(), unique: true },
    expiresAt: date(false),
    usedAt: date(),
    ...stamps,
  });
  await q.createTable('outbox', {
    id,
    to: text(),
    subject: text(),
    text: { type: DataTypes.TEXT, allowNull: false },
    message: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false },
    error: { type: DataTypes.TEXT, allowNull: true },
    ...stamps,
  });
}

export async function down({ context: q }: { context: QueryInterface }): Promise<void> {
  for (const table of [
    'outbox',
    'password_resets',
    'invitations',
    'audit_events',
    'jobs',
    'captures',
    'study_revisions',
    'studies',
    'projects',
    'api_keys',
    'sessions',
    'memberships',
    'users',
    'teams',
  ]) {
    await q.dropTable(table);
  }
}

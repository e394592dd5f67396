import { DataTypes, Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { InverterDesign } from '@pulsewright/modulation';

export type Role = 'viewer' | 'engineer' | 'admin';
export const ROLES: readonly Role[] = ['viewer', 'engineer', 'admin'];
export type JobStatus = 'queued' | 'running' | 'succeeded' | 'failed';

type Timestamps = { createdAt: Date; updatedAt: Date };
type Row<A extends object, K extends keyof A> = Model<A, Optional<A, K>> & A;
type Generated = 'id' | 'createdAt' | 'updatedAt';

export interface TeamAttributes extends Timestamps {
  id: string;
  name: string;
}
export interface UserAttributes extends Timestamps {
  id: string;
  email: string;
  name: string;
  passwordHash: string | null;
}
export interface MembershipAttributes extends Timestamps {
  id: string;
  teamId: string;
  userId: string;
  role: Role;
}
export interface SessionAttributes extends Timestamps {
  id: string;
  userId: string;
  teamId: string;
  tokenHash: string;
  expiresAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}
export interface ApiKeyAttributes extends Timestamps {
  id: string;
  userId: string;
  teamId: string;
  name: string;
  prefix: string;
  keyHash: string;
  role: Role;
  lastUsedAt: Date | null;
  expiresAt: Date | null;
  revokedAt: Date | null;
  /** The API key this key was made with (null when made in a signed-in session). */
  createdWithKeyId: string | null;
}
export interface ProjectAttributes extends Timestamps {
  id: string;
  teamId: string;
  name: string;
  description: string;
  createdById: string | null;
}
export interface StudyAttributes extends Timestamps {
  id: string;
  teamId: string;
  projectId: string;
  currentRevision: number;
  name: string;
  method: string;
}
export interface StudyRevisionAttributes extends Timestamps {
  id: string;
  studyId: string;
  revision: number;
  name: string;
  method: string;
  /** The revision's InverterDesign (migration 0002 filled it for older rows). */
  design: InverterDesign;
  /** Columns of the previous release, kept as they were (see services/studies.ts, legacyColumns). */
  parameters: Record<string, unknown>;
  load: Record<string, unknown> | null;
  filter: Record<string, unknown> | null;
  note: string;
  authorId: string | null;
  restoredFrom: number | null;
}
export interface CaptureSeries {
  time: number[];
  voltage: number[];
  current?: number[];
}
export interface CaptureAttributes extends Timestamps {
  id: string;
  teamId: string;
  projectId: string | null;
  name: string;
  fileName: string;
  contentType: string;
  byteSize: number;
  original: Buffer;
  series: CaptureSeries;
  rows: number;
  sampleRate: number;
  duration: number;
  columns: string[];
  uploadedById: string | null;
}
export interface JobAttributes extends Timestamps {
  id: string;
  teamId: string;
  userId: string | null;
  kind: string;
  status: JobStatus;
  progress: number;
  input: Record<string, unknown>;
  result: unknown;
  error: string | null;
  startedAt: Date | null;
  finishedAt: Date | null;
}
export interface AuditEventAttributes extends Timestamps {
  id: string;
  teamId: string | null;
  actorId: string | null;
  actorEmail: string | null;
  action: string;
  subjectType: string;
  subjectId: string | null;
  details: Record<string, unknown>;
}
export interface InvitationAttributes extends Timestamps {
  id: string;
  teamId: string;
  email: string;
  role: Role;
  tokenHash: string;
  invitedById: string | null;
  expiresAt: Date;
  acceptedAt: Date | null;
  withdrawnAt: Date | null;
}
export interface PasswordResetAttributes extends Timestamps {
  id: string;
  userId: string;
  tokenHash: string;
  expiresAt: Date;
  usedAt: Date | null;
}
export interface OutboxAttributes extends Timestamps {
  id: string;
  /** The team whose admins may read the message; null for mail of no team. */
  teamId: string | null;
  to: string;
  subject: string;
  text: string;
  message: string;
  status: 'saved' | 'sent' | 'failed';
  error: string | null;
}

export type TeamRow = Row<TeamAttributes, Generated>;
export type UserRow = Row<UserAttributes, Generated | 'passwordHash'>;
export type MembershipRow = Row<MembershipAttributes, Generated>;
export type SessionRow = Row<SessionAttributes, Generated | 'lastUsedAt' | 'revokedAt'>;
export type ApiKeyRow = Row<
  ApiKeyAttributes,
  Generated | 'lastUsedAt' | 'revokedAt' | 'expiresAt' | 'createdWithKeyId'
>;
export type ProjectRow = Row<ProjectAttributes, Generated | 'description' | 'createdById'>;
export type StudyRow = Row<StudyAttributes, Generated>;
export type StudyRevisionRow = Row<
  StudyRevisionAttributes,
  Generated | 'load' | 'filter' | 'note' | 'authorId' | 'restoredFrom'
>;
export type CaptureRow = Row<CaptureAttributes, Generated | 'projectId' | 'uploadedById'>;
export type JobRow = Row<
  JobAttributes,
  Generated | 'progress' | 'result' | 'error' | 'startedAt' | 'finishedAt' | 'userId'
>;
export type AuditEventRow = Row<
  AuditEventAttributes,
  Generated | 'teamId' | 'actorId' | 'actorEmail' | 'subjectId' | 'details'
>;
export type InvitationRow = Row<
  InvitationAttributes,
  Generated | 'acceptedAt' | 'withdrawnAt' | 'invitedById'
>;
export type PasswordResetRow = Row<PasswordResetAttributes, Generated | 'usedAt'>;
export type OutboxRow = Row<OutboxAttributes, Generated | 'error' | 'teamId'>;

/** The models bound to one database; every service receives this object. */
export interface Models {
  sequelize: Sequelize;
  Team: ModelStatic<TeamRow>;
  User: ModelStatic<UserRow>;
  Membership: ModelStatic<MembershipRow>;
  Session: ModelStatic<SessionRow>;
  ApiKey: ModelStatic<ApiKeyRow>;
  Project: ModelStatic<ProjectRow>;
  Study: ModelStatic<StudyRow>;
  StudyRevision: ModelStatic<StudyRevisionRow>;
  Capture: ModelStatic<CaptureRow>;
  Job: ModelStatic<JobRow>;
  AuditEvent: ModelStatic<AuditEventRow>;
  Invitation: ModelStatic<InvitationRow>;
  PasswordReset: ModelStatic<PasswordResetRow>;
  Outbox: ModelStatic<OutboxRow>;
}

const id = { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true };
const uuid = (allowNull = false) => ({ type: DataTypes.UUID, allowNull });
const text = (allowNull = false) => ({ type: DataTypes.STRING(255), allowNull });
const date = (allowNull = true) => ({ type: DataTypes.DATE, allowNull });
const role = {
  type: DataTypes.STRING(16),
  allowNull: false,
  validate: { isIn: [['viewer', 'engineer', 'admin']] },
};

/**
 * Defines the models on one Sequelize instance (a function, not module-level classes, so
 * several databases can be open in one process, as the tests do). The tables themselves are
 * created by the migrations in src/migrations/.
 */
export function defineModels(sequelize: Sequelize): Models {
  const define = <R extends Model>(
    name: string,
    tableName: string,
    attributes: Record<string, unknown>,
  ) => sequelize.define<R>(name, attributes as never, { tableName, timestamps: true });
  const models = defineTables(sequelize, define);
  // Lets the bearer lookup read membership, user and team in one query.
  models.Membership.belongsTo(models.User, { foreignKey: 'userId', as: 'user' });
  models.Membership.belongsTo(models.Team, { foreignKey: 'teamId', as: 'team' });
  // Lets the studies list read each study with its current revision in one query.
  models.Study.hasMany(models.StudyRevision, { foreignKey: 'studyId', as: 'revisions' });
  return models;
}

function defineTables(
  sequelize: Sequelize,
  define: <R extends Model>(
    name: string,
    tableName: string,
    attributes: Record<string, unknown>,
  ) => ModelStatic<R>,
): Models {
  return {
    sequelize,
    Team: define<TeamRow>('Team', 'teams', { id, name: text() }),
    User: define<UserRow>('User', 'users', {
      id,
      email: { ...text(), unique: true },
      name: text(),
      passwordHash: text(true),
    }),
    Membership: define<MembershipRow>('Membership', 'memberships', {
      id,
      teamId: uuid(),
      userId: uuid(),
      role,
    }),
    Session: define<SessionRow>('Session', 'sessions', {
      id,
      userId: uuid(),
      teamId: uuid(),
      tokenHash: { ...text(), unique: true },
      expiresAt: date(false),
      lastUsedAt: date(),
      revokedAt: date(),
    }),
    ApiKey: define<ApiKeyRow>('ApiKey', 'api_keys', {
      id,
      userId: uuid(),
      teamId: uuid(),
      name: text(),
      prefix: text(),
      keyHash: { ...text(), unique: true },
      role,
      lastUsedAt: date(),
      expiresAt: date(),
      revokedAt: date(),
      createdWithKeyId: uuid(true),
    }),
    Project: define<ProjectRow>('Project', 'projects', {
      id,
      teamId: uuid(),
      name: text(),
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      createdById: uuid(true),
    }),
    Study: define<StudyRow>('Study', 'studies', {
      id,
      teamId: uuid(),
      projectId: uuid(),
      currentRevision: { type: DataTypes.INTEGER, allowNull: false },
      name: text(),
      method: text(),
    }),
    StudyRevision: define<StudyRevisionRow>('StudyRevision', 'study_revisions', {
      id,
      studyId: uuid(),
      revision: { type: DataTypes.INTEGER, allowNull: false },
      name: text(),
      method: text(),
      design: { type: DataTypes.JSON, allowNull: false },
      parameters: { type: DataTypes.JSON, allowNull: false },
      load: { type: DataTypes.JSON, allowNull: true },
      filter: { type: DataTypes.JSON, allowNull: true },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      authorId: uuid(true),
      restoredFrom: { type: DataTypes.INTEGER, allowNull: true },
    }),
    Capture: define<CaptureRow>('Capture', 'captures', {
      id,
      teamId: uuid(),
      projectId: uuid(true),
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
      uploadedById: uuid(true),
    }),
    Job: define<JobRow>('Job', 'jobs', {
      id,
      teamId: uuid(),
      userId: uuid(true),
      kind: text(),
      status: { type: DataTypes.STRING(16), allowNull: false },
      progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
      input: { type: DataTypes.JSON, allowNull: false },
      result: { type: DataTypes.JSON, allowNull: true },
      error: { type: DataTypes.TEXT, allowNull: true },
      startedAt: date(),
      finishedAt: date(),
    }),
    AuditEvent: define<AuditEventRow>('AuditEvent', 'audit_events', {
      id,
      teamId: uuid(true),
      actorId: uuid(true),
      actorEmail: text(true),
      action: text(),
      subjectType: text(),
      subjectId: text(true),
      details: { type: DataTypes.JSON, allowNull: false, defaultValue: {} },
    }),
    Invitation: define<InvitationRow>('Invitation', 'invitations', {
      id,
      teamId: uuid(),
      email: text(),
      role,
      tokenHash: { ...text(), unique: true },
      invitedById: uuid(true),
      expiresAt: date(false),
      acceptedAt: date(),
      withdrawnAt: date(),
    }),
    PasswordReset: define<PasswordResetRow>('PasswordReset', 'password_resets', {
      id,
      userId: uuid(),
      tokenHash: { ...text(), unique: true },
      expiresAt: date(false),
      usedAt: date(),
    }),
    Outbox: define<OutboxRow>('Outbox', 'outbox', {
      id,
      teamId: uuid(true),
      to: text(),
      subject: text(),
      text: { type: DataTypes.TEXT, allowNull: false },
      message: { type: DataTypes.TEXT, allowNull: false },
      status: { type: DataTypes.STRING(16), allowNull: false },
      error: { type: DataTypes.TEXT, allowNull: true },
    }),
  };
}

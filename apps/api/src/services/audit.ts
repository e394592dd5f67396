import type { Transaction } from 'sequelize';
import type { AuditEventRow, Models } from '../models/index.js';
import { iso } from './dto.js';
import type { Principal } from './principal.js';

export interface AuditEventDto {
  id: string;
  action: string;
  actorEmail: string | null;
  subjectType: string;
  subjectId: string | null;
  details: Record<string, unknown>;
  createdAt: string;
}

/** Records who did what (never secrets: callers pass ids and names only). */
export class AuditLog {
  constructor(private readonly models: Models) {}

  async record(
    actor:
      Principal | { userId: string | null; email: string | null; teamId: string | null } | null,
    action: string,
    subjectType: string,
    subjectId: string | null,
    details: Record<string, unknown> = {},
    transaction?: Transaction,
  ): Promise<void> {
    const who =
      actor && 'user' in actor
        ? { teamId: actor.teamId, actorId: actor.user.id, actorEmail: actor.user.email }
        : {
            teamId: actor?.teamId ?? null,
            actorId: actor?.userId ?? null,
            actorEmail: actor?.email ?? null,
          };
    await this.models.AuditEvent.create(
      {
        ...who,
        action,
        subjectType,
        subjectId,
        details: actor && 'user' in actor ? { ...details, via: actor.authMethod } : details,
      },
      { transaction },
    );
  }

  async list(teamId: string, limit: number, offset: number): Promise<AuditEventDto[]> {
    const rows = await this.models.AuditEvent.findAll({
      where: { teamId },
      order: [['createdAt', 'DESC']],
      limit,
      offset,
    });
    return rows.map(toDto);
  }
}

function toDto(row: AuditEventRow): AuditEventDto {
  return {
    id: row.id,
    action: row.action,
    actorEmail: row.actorEmail,
    subjectType: row.subjectType,
    subjectId: row.subjectId,
    details: row.details ?? {},
    createdAt: iso(row.createdAt),
  };
}

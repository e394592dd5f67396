import type { ApiKeyRow, Models, Role } from '../models/index.js';
import { forbidden, notFound } from '../http/errors.js';
import type { AuditLog } from './audit.js';
import { iso, isoOrNull } from './dto.js';
import { roleAtLeast, type Principal } from './principal.js';
import { hashToken, newApiKey } from './tokens.js';

export interface ApiKeyDto {
  id: string;
  name: string;
  prefix: string;
  role: Role;
  userId: string;
  userEmail: string;
  createdAt: string;
  lastUsedAt: string | null;
  expiresAt: string | null;
  revokedAt: string | null;
}

/** API keys: created with a role up to the creator's, stored as a hash, shown once, revocable. */
export class ApiKeyService {
  constructor(
    private readonly models: Models,
    private readonly audit: AuditLog,
  ) {}

  async create(
    principal: Principal,
    input: { name: string; role: Role; expiresInDays?: number },
  ): Promise<ApiKeyDto & { key: string }> {
    if (!roleAtLeast(principal.role, input.role)) {
      throw forbidden(`role ${input.role} is above your own role (${principal.role}); a key may have at most the role of the person who makes it.`);
    }
    const { key, prefix } = newApiKey();
    const expiresAt = input.expiresInDays ? new Date(Date.now() + input.expiresInDays * 86400_000) : null;
    const row = await this.models.ApiKey.create({
      userId: principal.user.id,
      teamId: principal.teamId,
      name: input.name,
      prefix,
      keyHash: hashToken(key),
      role: input.role,
      expiresAt,
    });
    await this.audit.record(principal, 'api-key.create', 'api-key', row.id, { name: input.name, role: input.role, prefix });
    return { ...toDto(row, principal.user.email), key };
  }

  /** Own keys; an admin sees every key of the team. */
  async list(principal: Principal): Promise<ApiKeyDto[]> {
    const where = principal.role === 'admin' ? { teamId: principal.teamId } : { teamId: principal.teamId, userId: principal.user.id };
    const rows = await this.models.ApiKey.findAll({ where, order: [['createdAt', 'DESC']] });
    const users = await this.models.User.findAll({ where: { id: [...new Set(rows.map((r) => r.userId))] } });
    const emails = new Map(users.map((u) => [u.id, u.email]));
    return rows.map((row) => toDto(row, emails.get(row.userId) ?? ''));
  }

  async revoke(principal: Principal, id: string): Promise<void> {
    const row = await this.models.ApiKey.findOne({ where: { id, teamId: principal.teamId } });
    if (!row || (row.userId !== principal.user.id && principal.role !== 'admin')) throw notFound('That API key');
    if (!row.revokedAt) {
      await row.update({ revokedAt: new Date() });
      await this.audit.record(principal, 'api-key.revoke', 'api-key', row.id, { name: row.name, prefix: row.prefix });
    }
  }
}

function toDto(row: ApiKeyRow, userEmail: string): ApiKeyDto {
  return {
    id: row.id,
    name: row.name,
    prefix: row.prefix,
    role: row.role,
    userId: row.userId,
    userEmail,
    createdAt: iso(row.createdAt),
    lastUsedAt: isoOrNull(row.lastUsedAt),
    expiresAt: isoOrNull(row.expiresAt),
    revokedAt: isoOrNull(row.revokedAt),
  };
}

import type { Transaction } from 'sequelize';
import type { ApiKeyRow, Models, Role } from '../models/index.js';
import { badRequest, forbidden, notFound, unauthenticated } from '../http/errors.js';
import type { AuditLog } from './audit.js';
import { iso, isoOrNull } from './dto.js';
import { roleAtLeast, type Principal } from './principal.js';
import { MAX_KEY_LINEAGE } from './auth.js';
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

/**
 * API keys: created with a role up to the creator's, stored as a hash, shown once, revocable.
 * A key made with another key (rather than in a signed-in session) records that key
 * (`createdWithKeyId`): it cannot outrank it (the caller's role is already the lower of the key's
 * and its owner's), cannot outlive it (its expiry is at most the parent's), and is revoked with it.
 */
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
      throw forbidden(
        `role ${input.role} is above your own role (${principal.role}); a key may have at most the role of the person who makes it.`,
      );
    }
    const { key, prefix } = newApiKey();
    const now = Date.now();
    const requested = input.expiresInDays ? new Date(now + input.expiresInDays * 86400_000) : null;
    const row = await this.models.sequelize.transaction(async (transaction) => {
      const parent =
        principal.authMethod === 'api-key' ? await this.parentKey(principal, transaction) : null;
      const expiresAt = parent
        ? this.expiryUnder(parent, requested, input.expiresInDays, now)
        : requested;
      return this.models.ApiKey.create(
        {
          userId: principal.user.id,
          teamId: principal.teamId,
          name: input.name,
          prefix,
          keyHash: hashToken(key),
          role: input.role,
          expiresAt,
          createdWithKeyId: parent?.id ?? null,
        },
        { transaction },
      );
    });
    await this.audit.record(principal, 'api-key.create', 'api-key', row.id, {
      name: input.name,
      role: input.role,
      prefix,
      ...(row.createdWithKeyId ? { createdWithKeyId: row.createdWithKeyId } : {}),
    });
    return { ...toDto(row, principal.user.email), key };
  }

  /** The key the caller authenticated with, re-read inside the transaction that makes its child. */
  private async parentKey(principal: Principal, transaction: Transaction): Promise<ApiKeyRow> {
    const parent = await this.models.ApiKey.findByPk(principal.credentialId, { transaction });
    if (
      !parent ||
      parent.revokedAt ||
      (parent.expiresAt && parent.expiresAt.getTime() <= Date.now())
    ) {
      throw unauthenticated('The API key this request was made with is revoked or expired.');
    }
    let depth = 1;
    for (let id = parent.createdWithKeyId; id; depth++) {
      id = (await this.models.ApiKey.findByPk(id, { transaction }))?.createdWithKeyId ?? null;
    }
    if (depth >= MAX_KEY_LINEAGE) {
      throw forbidden(
        `This key is already ${depth} keys down from a signed-in session; make new keys from a session instead.`,
      );
    }
    return parent;
  }

  /**
   * The expiry of a key made with `parent`: the parent's when none was requested or when the
   * requested whole days reach past it by less than a day (rounding), the requested one when it is
   * earlier; further out is refused naming the field and the most it may be.
   */
  private expiryUnder(
    parent: ApiKeyRow,
    requested: Date | null,
    days: number | undefined,
    now: number,
  ): Date | null {
    if (!parent.expiresAt) return requested;
    if (!requested || requested <= parent.expiresAt) return requested ?? parent.expiresAt;
    const most = Math.ceil((parent.expiresAt.getTime() - now) / 86400_000);
    if (days !== undefined && days <= most) return parent.expiresAt;
    const message = `expiresInDays must be at most ${most}: a key made with an API key cannot outlive it, and this one expires at ${parent.expiresAt.toISOString()}`;
    throw badRequest(message, [{ path: 'expiresInDays', message }]);
  }

  /** Own keys; an admin sees every key of the team. */
  async list(principal: Principal): Promise<ApiKeyDto[]> {
    const where =
      principal.role === 'admin'
        ? { teamId: principal.teamId }
        : { teamId: principal.teamId, userId: principal.user.id };
    const rows = await this.models.ApiKey.findAll({ where, order: [['createdAt', 'DESC']] });
    const users = await this.models.User.findAll({
      where: { id: [...new Set(rows.map((r) => r.userId))] },
    });
    const emails = new Map(users.map((u) => [u.id, u.email]));
    return rows.map((row) => toDto(row, emails.get(row.userId) ?? ''));
  }

  /** Revokes a key and every key made with it, directly or through other keys. */
  async revoke(principal: Principal, id: string): Promise<void> {
    const row = await this.models.ApiKey.findOne({ where: { id, teamId: principal.teamId } });
    if (!row || (row.userId !== principal.user.id && principal.role !== 'admin'))
      throw notFound('That API key');
    const revoked = await this.models.sequelize.transaction(async (transaction) => {
      const now = new Date();
      const [own] = await this.models.ApiKey.update(
        { revokedAt: now },
        { where: { id: row.id, revokedAt: null }, transaction },
      );
      const descendants = await this.revokeDescendants([row.id], now, transaction);
      return { own, descendants };
    });
    if (revoked.own || revoked.descendants.length) {
      await this.audit.record(principal, 'api-key.revoke', 'api-key', row.id, {
        name: row.name,
        prefix: row.prefix,
        ...(revoked.descendants.length ? { withKeysMadeWithIt: revoked.descendants.length } : {}),
      });
    }
  }

  /**
   * Revokes every unrevoked key made (directly or not) with one of `parentIds`; returns their
   * ids. Walks the whole lineage, including already revoked links, so no descendant survives.
   */
  async revokeDescendants(
    parentIds: string[],
    now: Date,
    transaction: Transaction,
  ): Promise<string[]> {
    const revoked: string[] = [];
    const seen = new Set(parentIds);
    let frontier = parentIds;
    while (frontier.length) {
      const children = await this.models.ApiKey.findAll({
        where: { createdWithKeyId: frontier },
        transaction,
      });
      const fresh = children.filter((child) => !seen.has(child.id));
      fresh.forEach((child) => seen.add(child.id));
      const live = fresh.filter((child) => !child.revokedAt).map((child) => child.id);
      if (live.length) {
        await this.models.ApiKey.update(
          { revokedAt: now },
          { where: { id: live, revokedAt: null }, transaction },
        );
        revoked.push(...live);
      }
      frontier = fresh.map((child) => child.id);
    }
    return revoked;
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

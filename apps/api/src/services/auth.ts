import { randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { Op, type Transaction } from 'sequelize';
import type { ApiKeyRow, MembershipRow, Models, Role, TeamRow, UserRow } from '../models/index.js';
import { CredentialCache } from './credentialCache.js';
import type { CredentialEpoch } from './credentialEpoch.js';
import type { AuditLog } from './audit.js';
import { iso } from './dto.js';
import { lowerRole, type Principal } from './principal.js';
import { API_KEY_PREFIX, hashToken, newSecret, SESSION_PREFIX } from './tokens.js';
import { unauthenticated } from '../http/errors.js';

/** Touch `lastUsedAt` at most this often, so reads do not each become a write. */
const LAST_USED_RESOLUTION_MS = 60_000;

/** Keys made with keys made with keys…: a chain deeper than this is refused (and never made). */
export const MAX_KEY_LINEAGE = 8;

/** A credential verified against the database, as the cache keeps it. */
interface Verified {
  principal: Principal;
  expiresAt: number;
  touchedAt: number;
}

export interface SessionTokenDto {
  token: string;
  expiresAt: string;
}

/** Sign-in, sessions and the lookup of bearer tokens (sessions and API keys). */
export class AuthService {
  /**
   * A bcrypt hash of a random password at the same cost as stored passwords: an unknown address
   * (or an account without a password) costs the same compare as a wrong password, so the time
   * of an answer does not tell which addresses have accounts.
   */
  private readonly dummyHash: Promise<string>;

  private readonly cache = new CredentialCache();

  constructor(
    private readonly models: Models,
    private readonly audit: AuditLog,
    private readonly options: { sessionHours: number; bcryptRounds: number },
    private readonly epoch: CredentialEpoch,
  ) {
    this.dummyHash = bcrypt.hash(randomBytes(16).toString('base64url'), options.bcryptRounds);
  }

  hashPassword(password: string): Promise<string> {
    return bcrypt.hash(password, this.options.bcryptRounds);
  }

  /**
   * Whether `password` is the user's password. Takes one bcrypt compare whether or not there is
   * a user or a stored hash (see {@link dummyHash}).
   */
  async checkPassword(user: UserRow | null, password: string): Promise<boolean> {
    const ok = await bcrypt.compare(password, user?.passwordHash ?? (await this.dummyHash));
    return ok && Boolean(user?.passwordHash);
  }

  async login(email: string, password: string): Promise<SessionTokenDto> {
    const user = await this.models.User.findOne({ where: { email: email.toLowerCase() } });
    const ok = await this.checkPassword(user, password);
    if (!user || !ok) {
      // Filed under the account's team when the address is known, so its admins see attempts.
      const known = user ? await this.firstTeamOf(user.id) : null;
      await this.audit.record(
        { userId: null, email: null, teamId: known },
        'auth.login-failed',
        'user',
        user?.id ?? null,
        { email: email.toLowerCase() },
      );
      throw unauthenticated('The e-mail address or the password is wrong.');
    }
    const teamId = await this.firstTeamOf(user.id);
    if (!teamId) throw unauthenticated('This account is not a member of any team.');
    const session = await this.startSession(user.id, teamId);
    await this.audit.record(
      { userId: user.id, email: user.email, teamId },
      'auth.login',
      'user',
      user.id,
    );
    return session;
  }

  /** The team a person signs in to: their oldest membership (one team per sign-in for now). */
  async firstTeamOf(userId: string): Promise<string | null> {
    const membership = await this.models.Membership.findOne({
      where: { userId },
      order: [['createdAt', 'ASC']],
    });
    return membership?.teamId ?? null;
  }

  async startSession(userId: string, teamId: string): Promise<SessionTokenDto> {
    const token = newSecret(SESSION_PREFIX);
    const expiresAt = new Date(Date.now() + this.options.sessionHours * 3600_000);
    await this.models.Session.create({ userId, teamId, tokenHash: hashToken(token), expiresAt });
    return { token, expiresAt: iso(expiresAt) };
  }

  async logout(principal: Principal): Promise<void> {
    if (principal.authMethod !== 'session') return;
    await this.models.Session.update(
      { revokedAt: new Date() },
      { where: { id: principal.credentialId } },
    );
    await this.audit.record(principal, 'auth.logout', 'user', principal.user.id);
  }

  /** Ends every session of a user (password change, removal from the team); returns how many. */
  async endSessions(userId: string, teamId?: string, transaction?: Transaction): Promise<number> {
    const [ended] = await this.models.Session.update(
      { revokedAt: new Date() },
      { where: { userId, revokedAt: null, ...(teamId ? { teamId } : {}) }, transaction },
    );
    return ended;
  }

  /**
   * The principal a bearer token stands for, or null when it is unknown, expired or revoked.
   * Verified credentials are served from the cache while the credential epoch read before their
   * lookup holds (services/credentialEpoch.ts), so a revocation on any replica bites on the next
   * request; `lastUsedAt` is still written at most once a minute per credential.
   */
  async authenticate(token: string): Promise<Principal | null> {
    const kind = token.startsWith(SESSION_PREFIX)
      ? 'session'
      : token.startsWith(API_KEY_PREFIX)
        ? 'api-key'
        : null;
    if (!kind) return null;
    const epoch = await this.epoch.read();
    const now = new Date();
    const tokenHash = hashToken(token);
    const cached = this.cache.get(tokenHash, epoch, now.getTime());
    if (cached) {
      if (now.getTime() - cached.touchedAt > LAST_USED_RESOLUTION_MS) {
        cached.touchedAt = now.getTime();
        const where = { id: cached.principal.credentialId };
        if (kind === 'session') await this.models.Session.update({ lastUsedAt: now }, { where });
        else await this.models.ApiKey.update({ lastUsedAt: now }, { where });
      }
      return cached.principal;
    }
    const verified =
      kind === 'session'
        ? await this.verifySession(tokenHash, now)
        : await this.verifyKey(tokenHash, now);
    if (!verified) return null;
    this.cache.set(tokenHash, { ...verified, epoch });
    return verified.principal;
  }

  private async verifySession(tokenHash: string, now: Date): Promise<Verified | null> {
    const session = await this.models.Session.findOne({
      where: { tokenHash, revokedAt: null, expiresAt: { [Op.gt]: now } },
    });
    if (!session) return null;
    const principal = await this.principalFor(
      session.userId,
      session.teamId,
      null,
      'session',
      session.id,
    );
    if (!principal) return null;
    const touchedAt = await this.touch(session.lastUsedAt, now, () =>
      session.update({ lastUsedAt: now }),
    );
    return { principal, expiresAt: session.expiresAt.getTime(), touchedAt };
  }

  private async verifyKey(tokenHash: string, now: Date): Promise<Verified | null> {
    const key = await this.models.ApiKey.findOne({
      where: { keyHash: tokenHash, revokedAt: null },
    });
    if (!key || (key.expiresAt && key.expiresAt <= now)) return null;
    const lineageExpiry = await this.lineageExpiry(key, now);
    if (lineageExpiry === null) return null;
    const principal = await this.principalFor(key.userId, key.teamId, key.role, 'api-key', key.id);
    if (!principal) return null;
    const touchedAt = await this.touch(key.lastUsedAt, now, () => key.update({ lastUsedAt: now }));
    const expiresAt = Math.min(key.expiresAt?.getTime() ?? Infinity, lineageExpiry);
    return { principal, expiresAt, touchedAt };
  }

  /** Writes `lastUsedAt` when it is older than the resolution; returns when it was written. */
  private async touch(
    lastUsedAt: Date | null,
    now: Date,
    write: () => Promise<unknown>,
  ): Promise<number> {
    if (lastUsedAt && now.getTime() - lastUsedAt.getTime() <= LAST_USED_RESOLUTION_MS)
      return lastUsedAt.getTime();
    await write();
    return now.getTime();
  }

  /**
   * When the first key a key was made with (its parent, the parent's parent, …) expires, ms
   * (Infinity when none does), or null when one of them is revoked or expired. Revoking a key
   * revokes its descendants too (ApiKeyService.revoke); this check also covers a key made while
   * its parent was being revoked.
   */
  private async lineageExpiry(key: ApiKeyRow, now: Date): Promise<number | null> {
    let earliest = Infinity;
    let parentId = key.createdWithKeyId;
    for (let depth = 0; parentId; depth++) {
      if (depth >= MAX_KEY_LINEAGE) return null;
      const parent = await this.models.ApiKey.findByPk(parentId);
      if (!parent || parent.revokedAt || (parent.expiresAt && parent.expiresAt <= now)) return null;
      earliest = Math.min(earliest, parent.expiresAt?.getTime() ?? Infinity);
      parentId = parent.createdWithKeyId;
    }
    return earliest;
  }

  private async principalFor(
    userId: string,
    teamId: string,
    keyRole: Role | null,
    authMethod: Principal['authMethod'],
    credentialId: string,
  ): Promise<Principal | null> {
    const membership = await this.models.Membership.findOne<
      MembershipRow & { user?: UserRow; team?: TeamRow }
    >({
      where: { userId, teamId },
      include: [
        { model: this.models.User, as: 'user', required: true },
        { model: this.models.Team, as: 'team', required: true },
      ],
    });
    const user = membership?.user;
    const team = membership?.team;
    // A removed member's sessions and keys stop working at once.
    if (!membership || !user || !team) return null;
    return {
      user: { id: user.id, email: user.email, name: user.name },
      teamId,
      teamName: team.name,
      role: keyRole ? lowerRole(keyRole, membership.role) : membership.role,
      authMethod,
      credentialId,
    };
  }
}

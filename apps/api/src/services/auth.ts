import { randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { Op, type Transaction } from 'sequelize';
import type { ApiKeyRow, MembershipRow, Models, Role, TeamRow, UserRow } from '../models/index.js';
import type { AuditLog } from './audit.js';
import { iso } from './dto.js';
import { lowerRole, type Principal } from './principal.js';
import { API_KEY_PREFIX, hashToken, newSecret, SESSION_PREFIX } from './tokens.js';
import { unauthenticated } from '../http/errors.js';

/** Touch `lastUsedAt` at most this often, so reads do not each become a write. */
const LAST_USED_RESOLUTION_MS = 60_000;

/** Keys made with keys made with keys…: a chain deeper than this is refused (and never made). */
export const MAX_KEY_LINEAGE = 8;

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

  constructor(
    private readonly models: Models,
    private readonly audit: AuditLog,
    private readonly options: { sessionHours: number; bcryptRounds: number },
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

  /** The principal a bearer token stands for, or null when it is unknown, expired or revoked. */
  async authenticate(token: string): Promise<Principal | null> {
    const now = new Date();
    if (token.startsWith(SESSION_PREFIX)) {
      const session = await this.models.Session.findOne({
        where: { tokenHash: hashToken(token), revokedAt: null, expiresAt: { [Op.gt]: now } },
      });
      if (!session) return null;
      const principal = await this.principalFor(
        session.userId,
        session.teamId,
        null,
        'session',
        session.id,
      );
      if (
        principal &&
        (!session.lastUsedAt ||
          now.getTime() - session.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS)
      ) {
        await session.update({ lastUsedAt: now });
      }
      return principal;
    }
    if (token.startsWith(API_KEY_PREFIX)) {
      const key = await this.models.ApiKey.findOne({
        where: { keyHash: hashToken(token), revokedAt: null },
      });
      if (!key || (key.expiresAt && key.expiresAt <= now) || !(await this.lineageStands(key, now)))
        return null;
      const principal = await this.principalFor(
        key.userId,
        key.teamId,
        key.role,
        'api-key',
        key.id,
      );
      if (
        principal &&
        (!key.lastUsedAt || now.getTime() - key.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS)
      ) {
        await key.update({ lastUsedAt: now });
      }
      return principal;
    }
    return null;
  }

  /**
   * Whether every key a key was made with (its parent, the parent's parent, …) is still
   * unrevoked and unexpired. Revoking a key revokes its descendants too (ApiKeyService.revoke);
   * this check also covers a key made while its parent was being revoked.
   */
  private async lineageStands(key: ApiKeyRow, now: Date): Promise<boolean> {
    let parentId = key.createdWithKeyId;
    for (let depth = 0; parentId; depth++) {
      if (depth >= MAX_KEY_LINEAGE) return false;
      const parent = await this.models.ApiKey.findByPk(parentId);
      if (!parent || parent.revokedAt || (parent.expiresAt && parent.expiresAt <= now))
        return false;
      parentId = parent.createdWithKeyId;
    }
    return true;
  }

  private async principalFor(
    userId: string,
    teamId: string,
    keyRole: Role | null,
    authMethod: Principal['authMethod'],
    credentialId: string,
  ): Promise<Principal | null> {
    const membership = (await this.models.Membership.findOne({
      where: { userId, teamId },
      include: [
        { model: this.models.User, as: 'user', required: true },
        { model: this.models.Team, as: 'team', required: true },
      ],
    })) as (MembershipRow & { user?: UserRow; team?: TeamRow }) | null;
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

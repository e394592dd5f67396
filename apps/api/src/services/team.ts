import { Op, type Model, type ModelStatic, type Transaction } from 'sequelize';
import type { InvitationRow, Models, Role } from '../models/index.js';
import { badRequest, conflict, HttpError, notFound } from '../http/errors.js';
import type { AuditLog } from './audit.js';
import type { AuthService, SessionTokenDto } from './auth.js';
import { iso } from './dto.js';
import type { Mailer } from './mail.js';
import type { Principal } from './principal.js';
import { hashToken, newSecret, ONE_TIME_PREFIX } from './tokens.js';

const INVITATION_DAYS = 7;
const RESET_MINUTES = 60;

export interface MemberDto {
  user: { id: string; email: string; name: string };
  role: Role;
  joinedAt: string;
}

export interface InvitationDto {
  id: string;
  email: string;
  role: Role;
  status: 'open' | 'accepted' | 'withdrawn' | 'expired';
  createdAt: string;
  expiresAt: string;
}

/** Members and roles, invitations by e-mail and password resets. */
export class TeamService {
  constructor(
    private readonly models: Models,
    private readonly audit: AuditLog,
    private readonly auth: AuthService,
    private readonly mailer: Mailer,
    private readonly publicUrl: string,
  ) {}

  async listMembers(teamId: string): Promise<MemberDto[]> {
    const memberships = await this.models.Membership.findAll({
      where: { teamId },
      order: [['createdAt', 'ASC']],
    });
    const users = await this.models.User.findAll({
      where: { id: memberships.map((m) => m.userId) },
    });
    const byId = new Map(users.map((u) => [u.id, u]));
    return memberships.flatMap((m) => {
      const user = byId.get(m.userId);
      return user
        ? [
            {
              user: { id: user.id, email: user.email, name: user.name },
              role: m.role,
              joinedAt: iso(m.createdAt),
            },
          ]
        : [];
    });
  }

  async changeRole(principal: Principal, userId: string, role: Role): Promise<MemberDto> {
    return this.models.sequelize.transaction(async (transaction) => {
      const membership = await this.models.Membership.findOne({
        where: { teamId: principal.teamId, userId },
        transaction,
      });
      if (!membership) throw notFound('That member');
      if (membership.role === 'admin' && role !== 'admin')
        await this.assertAnotherAdmin(principal.teamId, userId);
      const before = membership.role;
      await membership.update({ role }, { transaction });
      await this.audit.record(
        principal,
        'member.role-change',
        'user',
        userId,
        { from: before, to: role },
        transaction,
      );
      const user = await this.models.User.findByPk(userId, { transaction });
      return {
        user: { id: userId, email: user?.email ?? '', name: user?.name ?? '' },
        role,
        joinedAt: iso(membership.createdAt),
      };
    });
  }

  async removeMember(principal: Principal, userId: string): Promise<void> {
    const membership = await this.models.Membership.findOne({
      where: { teamId: principal.teamId, userId },
    });
    if (!membership) throw notFound('That member');
    if (membership.role === 'admin') await this.assertAnotherAdmin(principal.teamId, userId);
    await membership.destroy();
    await this.auth.endSessions(userId, principal.teamId);
    await this.models.ApiKey.update(
      { revokedAt: new Date() },
      { where: { userId, teamId: principal.teamId, revokedAt: null } },
    );
    await this.audit.record(principal, 'member.remove', 'user', userId);
  }

  private async assertAnotherAdmin(teamId: string, userId: string): Promise<void> {
    const others = await this.models.Membership.count({
      where: { teamId, role: 'admin', userId: { [Op.ne]: userId } },
    });
    if (others === 0)
      throw conflict('The team must keep at least one admin; make someone else admin first.');
  }

  async listInvitations(teamId: string): Promise<InvitationDto[]> {
    const rows = await this.models.Invitation.findAll({
      where: { teamId },
      order: [['createdAt', 'DESC']],
    });
    return rows.map(invitationDto);
  }

  async invite(principal: Principal, email: string, role: Role): Promise<InvitationDto> {
    const address = email.toLowerCase();
    const existing = await this.models.User.findOne({ where: { email: address } });
    if (
      existing &&
      (await this.models.Membership.count({
        where: { userId: existing.id, teamId: principal.teamId },
      }))
    ) {
      throw conflict(`${address} is already a member of the team.`, [
        { path: 'email', message: `email ${address} is already a member` },
      ]);
    }
    const token = newSecret(ONE_TIME_PREFIX);
    const row = await this.models.Invitation.create({
      teamId: principal.teamId,
      email: address,
      role,
      tokenHash: hashToken(token),
      invitedById: principal.user.id,
      expiresAt: new Date(Date.now() + INVITATION_DAYS * 86400_000),
    });
    const link = `${this.publicUrl}/accept-invitation?token=${token}`;
    await this.mailer.send({
      to: address,
      subject: `You are invited to ${principal.teamName} on Pulsewright`,
      text:
        `${principal.user.name} invited you to join ${principal.teamName} on Pulsewright as ${role}.\n\n` +
        `Accept within ${INVITATION_DAYS} days: ${link}\n(or POST /api/v1/invitations/accept with this token: ${token})\n` +
        (existing
          ? `\n${address} already has a Pulsewright account: sign in with its current password to join; nothing about the account changes.\n`
          : ''),
      teamId: principal.teamId,
      secrets: [token],
    });
    await this.audit.record(principal, 'invitation.create', 'invitation', row.id, {
      email: address,
      role,
    });
    return invitationDto(row);
  }

  async withdraw(principal: Principal, id: string): Promise<void> {
    const row = await this.models.Invitation.findOne({ where: { id, teamId: principal.teamId } });
    if (!row) throw notFound('That invitation');
    // Conditional, like acceptance: an invitation accepted meanwhile stays accepted.
    const [changed] = await this.models.Invitation.update(
      { withdrawnAt: new Date() },
      { where: { id: row.id, acceptedAt: null } },
    );
    if (!changed) throw conflict('That invitation was already accepted.');
    await this.audit.record(principal, 'invitation.withdraw', 'invitation', row.id, {
      email: row.email,
    });
  }

  /**
   * Accepts an invitation. For a new address it makes the account with `name` and `password`.
   * For an address that already has an account, the membership is added only when `password` is
   * that account's current password (a sign-in); the account's password and name never change
   * here, so the holder of an invitation cannot take over the account it is addressed to.
   * The token is consumed by one conditional update, so of concurrent acceptances one wins.
   */
  async accept(token: string, name: string, password: string): Promise<SessionTokenDto> {
    const row = await this.models.Invitation.findOne({ where: { tokenHash: hashToken(token) } });
    if (!row || !isOpen(row)) throw invitationClosed();
    const existing = await this.models.User.findOne({ where: { email: row.email } });
    if (existing) {
      if (!(await this.auth.checkPassword(existing, password))) {
        const detail = `${row.email} already has a Pulsewright account: enter that account's current password to join (it is not changed here). Forgot it? Ask for a password reset first.`;
        // 401 as for a failed sign-in; the item lets a form mark the password field.
        throw new HttpError(401, detail, [
          { path: 'password', message: "password must be the account's current password" },
        ]);
      }
    }
    const passwordHash = existing ? null : await this.auth.hashPassword(password);
    const userId = await this.models.sequelize.transaction(async (transaction) => {
      await this.consume(
        this.models.Invitation,
        { id: row.id, acceptedAt: null, withdrawnAt: null },
        'acceptedAt',
        transaction,
        invitationClosed,
      );
      let user = existing;
      if (!user) {
        // Made meanwhile (two invitations to one new address accepted at once): the unique
        // e-mail index refuses the second, and it is asked to sign in instead.
        user = await this.models.User.create(
          { email: row.email, name, passwordHash },
          { transaction },
        );
      }
      const already = await this.models.Membership.findOne({
        where: { teamId: row.teamId, userId: user.id },
        transaction,
      });
      if (!already)
        await this.models.Membership.create(
          { teamId: row.teamId, userId: user.id, role: row.role },
          { transaction },
        );
      await this.audit.record(
        { userId: user.id, email: user.email, teamId: row.teamId },
        'invitation.accept',
        'invitation',
        row.id,
        { role: row.role, existingAccount: Boolean(existing) },
        transaction,
      );
      return user.id;
    });
    return this.auth.startSession(userId, row.teamId);
  }

  /**
   * Marks a one-time token used with one conditional UPDATE (`… WHERE id = ? AND <field> IS
   * NULL AND expiresAt > now`): of concurrent uses exactly one changes the row; the others
   * change nothing and are refused with `refusal()`.
   */
  private async consume<R extends Model>(
    model: ModelStatic<R>,
    where: Record<string, unknown>,
    field: 'acceptedAt' | 'usedAt',
    transaction: Transaction,
    refusal: () => Error,
  ): Promise<void> {
    const now = new Date();
    const [changed] = await model.update({ [field]: now } as never, {
      where: { ...where, [field]: null, expiresAt: { [Op.gt]: now } } as never,
      transaction,
    });
    if (changed !== 1) throw refusal();
  }

  /** Always succeeds from the caller's view, so it does not reveal which addresses exist. */
  async requestPasswordReset(email: string): Promise<void> {
    const user = await this.models.User.findOne({ where: { email: email.toLowerCase() } });
    if (!user) return;
    const token = newSecret(ONE_TIME_PREFIX);
    await this.models.PasswordReset.create({
      userId: user.id,
      tokenHash: hashToken(token),
      expiresAt: new Date(Date.now() + RESET_MINUTES * 60_000),
    });
    const teamId = await this.auth.firstTeamOf(user.id);
    await this.mailer.send({
      to: user.email,
      subject: 'Reset your Pulsewright password',
      text:
        `Someone asked to reset the password of ${user.email}. If it was you, open within ${RESET_MINUTES} minutes:\n` +
        `${this.publicUrl}/reset-password?token=${token}\n(or POST /api/v1/auth/password-reset/confirm with this token: ${token})\n` +
        'If it was not you, ignore this message; the password stays as it is.\n' +
        'A reset signs you out everywhere and revokes every API key you made; make new keys afterwards.\n',
      teamId,
      secrets: [token],
    });
    await this.audit.record(
      { userId: user.id, email: user.email, teamId },
      'auth.password-reset-request',
      'user',
      user.id,
    );
  }

  /**
   * Sets a new password with a reset token. The token is consumed by one conditional update (one
   * winner under concurrency). Policy (docs/security.md): a reset ends every session of the user
   * and revokes every API key they made, in every team, and voids their other open reset links;
   * whoever knew the old password may have made keys with it, and a reset is what a person does
   * when they fear exactly that.
   */
  async confirmPasswordReset(token: string, password: string): Promise<void> {
    const row = await this.models.PasswordReset.findOne({ where: { tokenHash: hashToken(token) } });
    if (!row || row.usedAt || row.expiresAt <= new Date()) throw resetClosed();
    const passwordHash = await this.auth.hashPassword(password);
    const teamId = await this.auth.firstTeamOf(row.userId);
    await this.models.sequelize.transaction(async (transaction) => {
      await this.consume(
        this.models.PasswordReset,
        { id: row.id },
        'usedAt',
        transaction,
        resetClosed,
      );
      const now = new Date();
      await this.models.User.update({ passwordHash }, { where: { id: row.userId }, transaction });
      const sessionsEnded = await this.auth.endSessions(row.userId, undefined, transaction);
      const [keysRevoked] = await this.models.ApiKey.update(
        { revokedAt: now },
        { where: { userId: row.userId, revokedAt: null }, transaction },
      );
      await this.models.PasswordReset.update(
        { usedAt: now },
        { where: { userId: row.userId, usedAt: null }, transaction },
      );
      await this.audit.record(
        { userId: row.userId, email: null, teamId },
        'auth.password-reset',
        'user',
        row.userId,
        { sessionsEnded, keysRevoked },
        transaction,
      );
    });
  }
}

const isOpen = (row: InvitationRow): boolean =>
  !row.acceptedAt && !row.withdrawnAt && row.expiresAt > new Date();

const invitationClosed = (): HttpError =>
  badRequest(
    'This invitation is unknown, used, withdrawn or expired; ask an admin for a new one.',
    [{ path: 'token', message: 'token is not an open invitation' }],
  );

const resetClosed = (): HttpError =>
  badRequest('This reset link is unknown, used or expired; ask for a new one.', [
    { path: 'token', message: 'token is not an open password reset' },
  ]);

function invitationDto(row: InvitationRow): InvitationDto {
  const status = row.acceptedAt
    ? 'accepted'
    : row.withdrawnAt
      ? 'withdrawn'
      : row.expiresAt <= new Date()
        ? 'expired'
        : 'open';
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    status,
    createdAt: iso(row.createdAt),
    expiresAt: iso(row.expiresAt),
  };
}

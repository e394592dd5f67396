import { Router } from 'express';
import { intQuery } from '../http/query.js';
import { rateLimit } from 'express-rate-limit';
import { principalOf } from '../auth/authorize.js';
import { HttpError } from '../http/errors.js';
import type { Services } from '../services/index.js';
import { dialectOf } from '../db/database.js';

const tooMany = (what: string) => () => {
  throw new HttpError(429, `Too many ${what}; wait a few minutes and try again.`);
};

/** Health, sign-in, the caller, API keys, members, invitations, audit log and outbox. */
export function accountRoutes(
  services: Services,
  options: { loginRateLimit: number; keyRateLimit: number; databaseUrl: string; version: string },
): Router {
  const router = Router();
  const { auth, apiKeys, team, audit, mailer } = services;

  const signInLimiter = rateLimit({
    windowMs: 15 * 60_000,
    limit: options.loginRateLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: tooMany('sign-in attempts from this address'),
  });
  const keyLimiter = rateLimit({
    windowMs: 60 * 60_000,
    limit: options.keyRateLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => principalOf(req).user.id,
    handler: tooMany('API keys made in the last hour'),
  });

  router.get('/api/health', async (_req, res) => {
    await services.models.sequelize.authenticate();
    res.json({ status: 'ok', version: options.version, database: dialectOf(options.databaseUrl) });
  });

  router.post('/api/v1/auth/login', signInLimiter, async (req, res) => {
    res.json(await auth.login(req.body.email, req.body.password));
  });
  router.post('/api/v1/auth/logout', async (req, res) => {
    await auth.logout(principalOf(req));
    res.status(204).end();
  });
  router.post('/api/v1/auth/password-reset', signInLimiter, async (req, res) => {
    await team.requestPasswordReset(req.body.email);
    res.status(202).json({ status: 'accepted' });
  });
  router.post('/api/v1/auth/password-reset/confirm', signInLimiter, async (req, res) => {
    await team.confirmPasswordReset(req.body.token, req.body.password);
    res.status(204).end();
  });

  router.get('/api/v1/me', (req, res) => {
    const p = principalOf(req);
    res.json({ user: p.user, team: { id: p.teamId, name: p.teamName }, role: p.role, authMethod: p.authMethod });
  });

  router.get('/api/v1/api-keys', async (req, res) => {
    res.json(await apiKeys.list(principalOf(req)));
  });
  router.post('/api/v1/api-keys', keyLimiter, async (req, res) => {
    res.status(201).json(await apiKeys.create(principalOf(req), req.body));
  });
  router.delete('/api/v1/api-keys/:id', async (req, res) => {
    await apiKeys.revoke(principalOf(req), req.params.id);
    res.status(204).end();
  });

  router.get('/api/v1/members', async (req, res) => {
    res.json(await team.listMembers(principalOf(req).teamId));
  });
  router.patch('/api/v1/members/:id', async (req, res) => {
    res.json(await team.changeRole(principalOf(req), req.params.id, req.body.role));
  });
  router.delete('/api/v1/members/:id', async (req, res) => {
    await team.removeMember(principalOf(req), req.params.id);
    res.status(204).end();
  });

  router.get('/api/v1/invitations', async (req, res) => {
    res.json(await team.listInvitations(principalOf(req).teamId));
  });
  router.post('/api/v1/invitations', async (req, res) => {
    res.status(201).json(await team.invite(principalOf(req), req.body.email, req.body.role));
  });
  router.post('/api/v1/invitations/accept', signInLimiter, async (req, res) => {
    res.json(await team.accept(req.body.token, req.body.name, req.body.password));
  });
  router.delete('/api/v1/invitations/:id', async (req, res) => {
    await team.withdraw(principalOf(req), req.params.id);
    res.status(204).end();
  });

  router.get('/api/v1/audit-events', async (req, res) => {
    res.json(await audit.list(principalOf(req).teamId, intQuery(req, 'limit', 50), intQuery(req, 'offset', 0)));
  });
  router.get('/api/v1/outbox', async (req, res) => {
    res.json(await mailer.list(intQuery(req, 'limit', 50), intQuery(req, 'offset', 0)));
  });
  return router;
}

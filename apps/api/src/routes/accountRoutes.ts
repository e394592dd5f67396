import { Router, type Request } from 'express';
import type { ApiRequest } from '../http/apiRequest.js';
import type { AppConfig } from '../config.js';
import { intQuery } from '../http/query.js';
import { principalOf } from '../auth/authorize.js';
import type { Services } from '../services/index.js';
import { dialectOf } from '../db/database.js';
import type { RateLimitStores } from '../http/rateLimitStores.js';
import { rateLimiter, type RateLimiterOptions } from '../http/rateLimiter.js';

const FIFTEEN_MINUTES = 15 * 60_000;
const ONE_HOUR = 60 * 60_000;

/** The e-mail address a public account request names, as the key of its per-account bucket. */
const accountOf = (req: Request): string => {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return `account:${typeof email === 'string' ? email.toLowerCase() : ''}`;
};

/** Health, sign-in, the caller, API keys, members, invitations, audit log and outbox. */
export function accountRoutes(
  services: Services,
  options: Pick<
    AppConfig,
    | 'loginRateLimit'
    | 'loginAccountRateLimit'
    | 'resetRateLimit'
    | 'resetAccountRateLimit'
    | 'acceptRateLimit'
    | 'keyRateLimit'
    | 'databaseUrl'
  > & { version: string; rateLimits: RateLimitStores },
): Router {
  const router = Router();
  const { auth, apiKeys, team, audit, mailer } = services;

  // Separate buckets (one store each) for sign-in, password reset and invitation acceptance, per
  // client address (Express's req.ip, which honours TRUST_PROXY) and, where a request names an
  // account, per account. Buckets of attempts that can succeed count failures only
  // (skipSuccessfulRequests), so people signing in behind one proxy address do not lock each
  // other out, while guesses at one account from many addresses still meet the account's limit.
  const limiter = (
    limit: number,
    windowMs: number,
    what: string,
    wait: string,
    extra: Partial<RateLimiterOptions> = {},
  ) => rateLimiter(options.rateLimits, { limit, windowMs, what, wait, ...extra });
  const failuresOnly = { skipSuccessfulRequests: true };
  const signInPerAddress = limiter(
    options.loginRateLimit,
    FIFTEEN_MINUTES,
    'failed sign-ins from this network address',
    '15 minutes',
    failuresOnly,
  );
  const signInPerAccount = limiter(
    options.loginAccountRateLimit,
    FIFTEEN_MINUTES,
    'failed sign-ins to this account',
    '15 minutes',
    {
      ...failuresOnly,
      keyGenerator: accountOf,
    },
  );
  const resetPerAddress = limiter(
    options.resetRateLimit,
    FIFTEEN_MINUTES,
    'password-reset requests from this network address',
    '15 minutes',
  );
  const resetPerAccount = limiter(
    options.resetAccountRateLimit,
    ONE_HOUR,
    'password-reset e-mails to this address',
    'an hour',
    {
      keyGenerator: accountOf,
    },
  );
  const resetConfirmPerAddress = limiter(
    options.resetRateLimit,
    FIFTEEN_MINUTES,
    'failed password-reset confirmations from this network address',
    '15 minutes',
    failuresOnly,
  );
  const acceptPerAddress = limiter(
    options.acceptRateLimit,
    FIFTEEN_MINUTES,
    'failed invitation acceptances from this network address',
    '15 minutes',
    failuresOnly,
  );
  const keyLimiter = limiter(
    options.keyRateLimit,
    ONE_HOUR,
    'API keys made in the last hour',
    'a few minutes',
    {
      keyGenerator: (req) => principalOf(req).user.id,
    },
  );

  router.get('/api/health', async (_req, res) => {
    await services.models.sequelize.authenticate();
    res.json({ status: 'ok', version: options.version, database: dialectOf(options.databaseUrl) });
  });

  router.post(
    '/api/v1/auth/login',
    signInPerAddress,
    signInPerAccount,
    async (req: ApiRequest<'login'>, res) => {
      res.json(await auth.login(req.body.email, req.body.password));
    },
  );
  router.post('/api/v1/auth/logout', async (req: ApiRequest<'logout'>, res) => {
    await auth.logout(principalOf(req));
    res.status(204).end();
  });
  router.post(
    '/api/v1/auth/password-reset',
    resetPerAddress,
    resetPerAccount,
    async (req: ApiRequest<'requestPasswordReset'>, res) => {
      await team.requestPasswordReset(req.body.email);
      res.status(202).json({ status: 'accepted' });
    },
  );
  router.post(
    '/api/v1/auth/password-reset/confirm',
    resetConfirmPerAddress,
    async (req: ApiRequest<'confirmPasswordReset'>, res) => {
      await team.confirmPasswordReset(req.body.token, req.body.password);
      res.status(204).end();
    },
  );

  router.get('/api/v1/me', (req: ApiRequest<'getMe'>, res) => {
    const p = principalOf(req);
    res.json({
      user: p.user,
      team: { id: p.teamId, name: p.teamName },
      role: p.role,
      authMethod: p.authMethod,
    });
  });

  router.get('/api/v1/api-keys', async (req: ApiRequest<'listApiKeys'>, res) => {
    res.json(await apiKeys.list(principalOf(req)));
  });
  router.post('/api/v1/api-keys', keyLimiter, async (req: ApiRequest<'createApiKey'>, res) => {
    res.status(201).json(await apiKeys.create(principalOf(req), req.body));
  });
  router.delete('/api/v1/api-keys/:id', async (req: ApiRequest<'revokeApiKey'>, res) => {
    await apiKeys.revoke(principalOf(req), req.params.id);
    res.status(204).end();
  });

  router.get('/api/v1/members', async (req: ApiRequest<'listMembers'>, res) => {
    res.json(await team.listMembers(principalOf(req).teamId));
  });
  router.patch('/api/v1/members/:id', async (req: ApiRequest<'updateMember'>, res) => {
    res.json(await team.changeRole(principalOf(req), req.params.id, req.body.role));
  });
  router.delete('/api/v1/members/:id', async (req: ApiRequest<'removeMember'>, res) => {
    await team.removeMember(principalOf(req), req.params.id);
    res.status(204).end();
  });

  router.get('/api/v1/invitations', async (req: ApiRequest<'listInvitations'>, res) => {
    res.json(await team.listInvitations(principalOf(req).teamId));
  });
  router.post('/api/v1/invitations', async (req: ApiRequest<'createInvitation'>, res) => {
    res.status(201).json(await team.invite(principalOf(req), req.body.email, req.body.role));
  });
  router.post(
    '/api/v1/invitations/accept',
    acceptPerAddress,
    async (req: ApiRequest<'acceptInvitation'>, res) => {
      res.json(await team.accept(req.body.token, req.body.name, req.body.password));
    },
  );
  router.delete('/api/v1/invitations/:id', async (req: ApiRequest<'revokeInvitation'>, res) => {
    await team.withdraw(principalOf(req), req.params.id);
    res.status(204).end();
  });

  router.get('/api/v1/audit-events', async (req: ApiRequest<'listAuditEvents'>, res) => {
    res.json(
      await audit.list(
        principalOf(req).teamId,
        intQuery(req, 'limit', 50),
        intQuery(req, 'offset', 0),
      ),
    );
  });
  router.get('/api/v1/outbox', async (req: ApiRequest<'listOutbox'>, res) => {
    res.json(
      await mailer.list(
        principalOf(req).teamId,
        intQuery(req, 'limit', 50),
        intQuery(req, 'offset', 0),
      ),
    );
  });
  return router;
}

import { Router } from 'express';
import type { ApiRequest } from '../http/apiRequest.js';
import { principalOf } from '../auth/authorize.js';
import { rateLimiter } from '../http/rateLimiter.js';
import type { Services } from '../services/index.js';
import type { RateLimitStores } from '../http/rateLimitStores.js';

/** E-mailing a study's report (per-user hourly limit, like API key creation). */
export function shareRoutes(
  services: Services,
  options: { shareRateLimit: number; rateLimits: RateLimitStores },
): Router {
  const router = Router();
  const limiter = rateLimiter(options.rateLimits, {
    limit: options.shareRateLimit,
    windowMs: 60 * 60_000,
    what: 'reports e-mailed in the last hour',
    wait: 'a while',
    keyGenerator: (req) => principalOf(req).user.id,
  });
  router.post(
    '/api/v1/studies/:id/share',
    limiter,
    async (req: ApiRequest<'shareStudyReport'>, res) => {
      res
        .status(202)
        .json(await services.shares.share(principalOf(req), String(req.params.id), req.body));
    },
  );
  return router;
}

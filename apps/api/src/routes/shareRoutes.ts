import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { principalOf } from '../auth/authorize.js';
import { HttpError } from '../http/errors.js';
import type { Services } from '../services/index.js';
import type { RateLimitStores } from '../http/rateLimitStores.js';

/** E-mailing a study's report (per-user hourly limit, like API key creation). */
export function shareRoutes(
  services: Services,
  options: { shareRateLimit: number; rateLimits: RateLimitStores },
): Router {
  const router = Router();
  const limiter = rateLimit({
    windowMs: 60 * 60_000,
    limit: options.shareRateLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => principalOf(req).user.id,
    store: options.rateLimits.store('reports e-mailed'),
    handler: () => {
      throw new HttpError(
        429,
        'Too many reports e-mailed in the last hour; wait a while and try again.',
      );
    },
  });
  router.post('/api/v1/studies/:id/share', limiter, async (req, res) => {
    res
      .status(202)
      .json(await services.shares.share(principalOf(req), String(req.params.id), req.body));
  });
  return router;
}

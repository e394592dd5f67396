import { rateLimit, type Options as RateLimitOptions } from 'express-rate-limit';
import type { RequestHandler } from 'express';
import { HttpError } from './errors.js';
import type { RateLimitStores } from './rateLimitStores.js';

/** What one limiter counts and how a refusal reads. */
export interface RateLimiterOptions extends Partial<RateLimitOptions> {
  /** Requests allowed per window. */
  limit: number;
  /** The window, in milliseconds. */
  windowMs: number;
  /** What is counted, as the refusal names it (`failed sign-ins to this account`); also the store's name. */
  what: string;
  /** How long to wait, in words (`15 minutes`). */
  wait: string;
}

/**
 * One express-rate-limit limiter as the service uses them: IETF draft-8 RateLimit headers, its
 * own bucket in `stores` (shared by the replicas on PostgreSQL), and a refusal that is the
 * service's 429 problem: "Too many <what>; wait <wait> and try again." (the final handler adds
 * Retry-After). Other express-rate-limit options (keyGenerator, skipSuccessfulRequests) pass on.
 */
export function rateLimiter(
  stores: RateLimitStores,
  { what, wait, ...options }: RateLimiterOptions,
): RequestHandler {
  return rateLimit({
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: stores.store(what),
    handler: () => {
      throw new HttpError(429, `Too many ${what}; wait ${wait} and try again.`);
    },
    ...options,
  });
}

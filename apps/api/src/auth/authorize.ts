import { inspect } from 'node:util';
import type { Request } from 'express';
import { Strategy as BearerStrategy } from 'passport-http-bearer';
import type { AuthService } from '../services/auth.js';
import { roleAtLeast, type Principal } from '../services/principal.js';
import type { RoleRequirement } from '../openapi.js';

/** An error the validator's security step turns into 401 or 403 with this message. */
class AuthError extends Error {
  constructor(
    readonly status: 401 | 403,
    message: string,
  ) {
    super(message);
  }
}

const principals = new WeakMap<object, Principal>();

/**
 * What passport-http-bearer's strategy calls back with (passport-strategy's contract: an
 * authenticating framework gives each attempt `success`, `fail` and `error`; this strategy never
 * calls `redirect` or `pass`).
 */
interface BearerAttempt {
  authenticate(req: Request): void;
  success(user: Principal): void;
  fail(challengeOrStatus?: unknown): void;
  error(error: unknown): void;
}

/**
 * One attempt of passport-http-bearer's strategy on `req`, run as passport-strategy's contract
 * describes: an object that inherits the strategy and carries this attempt's `success`, `fail`
 * and `error`. It resolves to the principal, or false when the strategy fails the request (no
 * token, a malformed Authorization header, two tokens, an unknown one). passport's own
 * `authenticate` middleware does the same and also installs login, logout and session helpers on
 * every request, which a stateless bearer API never calls: about 11 kB allocated an answer of
 * `POST /api/v1/spectra` (sampled), and 7.19 → 7.00 M instructions an answer without it
 * (callgrind; docs/robustness.md, throughput, seventh pass). The `passport` package itself is
 * no longer used.
 */
function attemptBearer(strategy: object, req: Request): Promise<Principal | false> {
  return new Promise((resolve, reject) => {
    const attempt = Object.create(strategy) as BearerAttempt;
    attempt.success = resolve;
    attempt.fail = () => resolve(false);
    attempt.error = (error) => reject(error instanceof Error ? error : new Error(inspect(error)));
    attempt.authenticate(req);
  });
}

/** The caller of an authorised request (set by {@link createAuthorizer}). */
export function principalOf(req: object): Principal {
  const principal = principals.get(req);
  if (!principal) throw new AuthError(401, 'Sign in first: send Authorization: Bearer <token>.');
  return principal;
}

/**
 * The one role middleware. It runs as express-openapi-validator's security handler, after the
 * route is matched and before the request body is validated, for every operation that is not
 * public. It authenticates the bearer token through passport-http-bearer (session tokens and
 * API keys alike) and compares the caller's role with the operation's `x-pulsewright-role`.
 */
export function createAuthorizer(auth: AuthService): (req: Request) => Promise<boolean> {
  const strategy = new BearerStrategy((token, done) => {
    auth.authenticate(token).then(
      (principal) => done(null, principal ?? false),
      (error: unknown) => done(error),
    );
  });

  return async (req) => {
    const required = (req as Request & { openapi?: { schema?: Record<string, unknown> } }).openapi
      ?.schema?.['x-pulsewright-role'] as RoleRequirement | undefined;
    if (!required)
      throw new AuthError(403, 'This operation has no role requirement; refusing by default.');
    if (!req.headers.authorization)
      throw new AuthError(401, 'Sign in first: send Authorization: Bearer <token>.');
    const principal = await attemptBearer(strategy, req);
    if (!principal)
      throw new AuthError(
        401,
        'The bearer token is unknown, expired or revoked; sign in again or use a current API key.',
      );
    principals.set(req, principal);
    if (required !== 'public' && !roleAtLeast(principal.role, required)) {
      const who = principal.authMethod === 'api-key' ? 'this API key acts' : 'you are signed in';
      throw new AuthError(
        403,
        `This needs the ${required} role or higher; ${who} as ${principal.role}.`,
      );
    }
    return true;
  };
}

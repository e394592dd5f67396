import { inspect } from 'node:util';
import type { Request } from 'express';
import { Passport } from 'passport';
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

/** Where passport puts the authenticated principal on the request (`assignProperty`). */
const PRINCIPAL_PROPERTY = 'bearerPrincipal';

/**
 * What passport is given as the response: on a failed token it sets a status and a
 * `WWW-Authenticate` challenge there before handing the failure on (failWithError), and the
 * answer is this service's own 401 problem, so both are dropped.
 */
const PASSPORT_RESPONSE = { statusCode: 0, setHeader: (): void => undefined };

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
  const passport = new Passport();
  passport.use(
    new BearerStrategy((token, done) => {
      auth.authenticate(token).then(
        (principal) => done(null, principal ?? false),
        (error: unknown) => done(error as Error),
      );
    }),
  );
  // One passport middleware for every request (not one made per request around a callback):
  // the principal lands on the request under PRINCIPAL_PROPERTY, a failure comes back as an
  // AuthenticationError (failWithError), and no auth info is transformed (authInfo: false).
  const middleware = passport.authenticate('bearer', {
    session: false,
    failWithError: true,
    assignProperty: PRINCIPAL_PROPERTY,
    authInfo: false,
  }) as (req: Request, res: unknown, next: (error?: unknown) => void) => void;
  const authenticate = (req: Request): Promise<Principal | false> =>
    new Promise((resolve, reject) => {
      middleware(req, PASSPORT_RESPONSE, (error) => {
        const found = (req as Request & { [PRINCIPAL_PROPERTY]?: Principal })[PRINCIPAL_PROPERTY];
        if (!error) resolve(found ?? false);
        // passport's AuthenticationError: no token, a malformed one (400) or an unknown one (401).
        else if ((error as { name?: unknown }).name === 'AuthenticationError') resolve(false);
        else reject(error instanceof Error ? error : new Error(inspect(error)));
      });
    });

  return async (req) => {
    const required = (req as Request & { openapi?: { schema?: Record<string, unknown> } }).openapi
      ?.schema?.['x-pulsewright-role'] as RoleRequirement | undefined;
    if (!required)
      throw new AuthError(403, 'This operation has no role requirement; refusing by default.');
    if (!req.headers.authorization)
      throw new AuthError(401, 'Sign in first: send Authorization: Bearer <token>.');
    const principal = await authenticate(req);
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

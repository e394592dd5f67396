import type { RequestHandler } from 'express';
import helmet, { type HelmetOptions } from 'helmet';

/** helmet's settings for every answer of the service (the dashboard, the API and its docs). */
export const HELMET_OPTIONS: HelmetOptions = {
  contentSecurityPolicy: {
    directives: {
      // Swagger UI and the dashboard need inline styles and data: images; scripts stay 'self'.
      'style-src': ["'self'", "'unsafe-inline'"],
      'img-src': ["'self'", 'data:', 'blob:'],
      // The service speaks plain HTTP on its port; TLS (and HSTS) belong to the proxy in front.
      'upgrade-insecure-requests': null,
    },
  },
  strictTransportSecurity: false,
};

/** One header operation helmet made: set `name` to `value`, or remove `name` (value undefined). */
type HeaderStep = readonly [name: string, value: string | undefined];

/** An object on which reading any property other than `allowed` stops the start. */
function only<T extends object>(what: string, allowed: T): T {
  return new Proxy(allowed, {
    get(target, property) {
      if (Object.hasOwn(target, property)) return target[property as keyof T];
      throw new Error(
        `helmet read ${what}.${String(property)}: its headers may depend on the request, so they cannot be set once; use helmet itself`,
      );
    },
  });
}

/**
 * helmet's headers, taken once from helmet itself and applied in one step per answer. With
 * {@link HELMET_OPTIONS} (a fixed content security policy, no nonce or function) helmet 8 sets the
 * same thirteen headers on every answer, through a chain of one function per header; this runs
 * helmet's middleware once at start on a recording response, then sets the recorded headers, and
 * removes the removed ones, in helmet's order. Should helmet read anything of the request or of
 * the response beyond `setHeader` and `removeHeader`, or not finish at once, the start fails
 * rather than send headers that could differ from helmet's. hotPath.test.ts checks that the
 * answers' headers equal helmet's own.
 */
export function securityHeaders(options: HelmetOptions = HELMET_OPTIONS): RequestHandler {
  const steps: HeaderStep[] = [];
  let finished = false;
  const recorder = only('res', {
    setHeader(name: string, value: string | number | readonly string[]) {
      if (typeof value !== 'string') throw new Error(`helmet set ${name} to a non-string value`);
      steps.push([name, value]);
    },
    removeHeader(name: string) {
      steps.push([name, undefined]);
    },
  });
  const middleware = helmet(options) as unknown as (
    req: object,
    res: object,
    next: (error?: unknown) => void,
  ) => void;
  middleware(only('req', {}), recorder, (error?: unknown) => {
    if (error) throw error instanceof Error ? error : new Error('helmet refused its settings');
    finished = true;
  });
  if (!finished) throw new Error('helmet did not finish at once; its headers cannot be set once');
  return function securityHeadersMiddleware(_req, res, next) {
    for (const [name, value] of steps) {
      if (value === undefined) res.removeHeader(name);
      else res.setHeader(name, value);
    }
    next();
  };
}

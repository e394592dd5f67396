import { createRequire } from 'node:module';

/** The part of path-to-regexp 8's `pathToRegexp` that express-openapi-validator calls. */
type PathToRegexp = (
  path: string,
  options?: Record<string, unknown>,
) => { regexp: RegExp; keys: unknown[] };

const CACHED = Symbol.for('pulsewright.cachedRouteRegexps');

/**
 * Keeps each documented path's regular expression once made. express-openapi-validator 5.6
 * (`middlewares/openapi.metadata.js`, `lookupRoute`) turns the document's paths into regular
 * expressions with path-to-regexp on every request, one after another until one matches: about
 * 6 % of the service's CPU under a load of `POST /api/v1/spectra` (a `node --cpu-prof` profile,
 * docs/robustness.md). An expression depends only on the path and the two options the validator
 * passes (case sensitivity, strict routing), which are fixed, so this wraps the `pathToRegexp`
 * of the copy of path-to-regexp the validator loads with one that remembers its answers, keyed
 * by both; a call with any other option is passed through uncached. Its expressions carry no `g`
 * or `y` flag, so sharing one keeps `exec` free of state. The paths come
 * from the document (a fixed set), so the cache cannot grow with requests. Express's own router
 * calls path-to-regexp's `match`, which does not go through this export. Installing twice does
 * nothing more.
 */
export function cacheRouteRegexps(): void {
  const fromValidator = createRequire(
    createRequire(import.meta.url).resolve('express-openapi-validator'),
  );
  const module = fromValidator('path-to-regexp') as {
    pathToRegexp: PathToRegexp & { [CACHED]?: true };
  };
  const original = module.pathToRegexp;
  if (original[CACHED]) return;
  // One map per combination of the two options the validator passes; any other options go
  // straight to path-to-regexp, uncached. No key string is built per call.
  const made = [0, 1, 2, 3].map(() => new Map<string, ReturnType<PathToRegexp>>());
  const cached: PathToRegexp & { [CACHED]?: true } = (path, options = {}) => {
    for (const name in options) {
      if (name !== 'sensitive' && name !== 'strict') return original(path, options);
    }
    const byPath = made[(options.sensitive ? 1 : 0) + (options.strict ? 2 : 0)]!;
    let found = byPath.get(path);
    if (found === undefined) {
      found = original(path, options);
      byPath.set(path, found);
    }
    return found;
  };
  cached[CACHED] = true;
  module.pathToRegexp = cached;
}

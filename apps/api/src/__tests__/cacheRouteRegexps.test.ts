import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { cacheRouteRegexps } from '../http/cacheRouteRegexps.js';

type PathToRegexp = (
  path: string,
  options?: Record<string, unknown>,
) => { regexp: RegExp; keys: { name: string }[] };

/** The path-to-regexp the validator loads (not necessarily the one this package would). */
function validatorsPathToRegexp(): { pathToRegexp: PathToRegexp } {
  const require = createRequire(import.meta.url);
  return createRequire(require.resolve('express-openapi-validator'))('path-to-regexp') as {
    pathToRegexp: PathToRegexp;
  };
}

describe('cacheRouteRegexps: the validator’s route expressions made once', () => {
  it('answers a path and options with the expression made the first time, and matches as before', () => {
    cacheRouteRegexps();
    const module = validatorsPathToRegexp();
    const options = { sensitive: false, strict: false };
    const first = module.pathToRegexp('/api/v1/studies/:id', options);
    expect(module.pathToRegexp('/api/v1/studies/:id', { ...options })).toBe(first);
    // Other options, another expression: case sensitivity is part of the key.
    const sensitive = module.pathToRegexp('/api/v1/studies/:id', { ...options, sensitive: true });
    expect(sensitive).not.toBe(first);
    expect(sensitive.regexp.test('/API/v1/studies/x')).toBe(false);
    expect(first.regexp.test('/API/v1/studies/x')).toBe(true);
    // No g or y flag: a shared expression keeps no lastIndex between requests.
    expect(first.regexp.flags).not.toMatch(/[gy]/);
    expect(first.regexp.exec('/api/v1/studies/abc')?.[1]).toBe('abc');
    expect(first.regexp.exec('/api/v1/studies/def')?.[1]).toBe('def');
    expect(first.keys.map((k) => k.name)).toEqual(['id']);
    // An option the validator does not pass is not cached (its expression differs).
    const open = module.pathToRegexp('/api/v1/studies/:id', { ...options, end: false });
    expect(open).not.toBe(module.pathToRegexp('/api/v1/studies/:id', { ...options, end: false }));
    expect(open.regexp.test('/api/v1/studies/x/revisions')).toBe(true);
    expect(first.regexp.test('/api/v1/studies/x/revisions')).toBe(false);
  });

  it('installs once however often the app is built', () => {
    cacheRouteRegexps();
    const wrapper = validatorsPathToRegexp().pathToRegexp;
    cacheRouteRegexps();
    expect(validatorsPathToRegexp().pathToRegexp).toBe(wrapper);
  });
});

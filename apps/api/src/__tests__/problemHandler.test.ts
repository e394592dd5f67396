import express from 'express';
import { ParameterRangeError, ParameterTypeError } from '@pulsewright/modulation';
import request from 'supertest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { HttpError } from '../http/errors.js';
import { problemHandler } from '../http/problemHandler.js';
import { loadOpenApiDocument } from '../openapi.js';
import { asBadRequest, callLibrary } from '../services/library.js';

/** An app whose one route throws `error`, answered by the service's final handler (logging on). */
function throwingApp(error: () => unknown): express.Express {
  const app = express();
  app.get('/api/v1/broken', () => {
    throw error();
  });
  app.use(problemHandler(loadOpenApiDocument(), true));
  return app;
}

/** Recurses until V8 raises its own RangeError ("Maximum call stack size exceeded"). */
function overflow(depth: number): number {
  return overflow(depth + 1) + 1;
}

describe('errors: only the library and the contract blame the client', () => {
  afterEach(() => {
    vi.restoreAllMocks();
  });

  const bugs: [string, () => unknown][] = [
    ['a bare RangeError', () => new RangeError('Invalid array length')],
    [
      'V8 stack overflow',
      () => {
        try {
          return overflow(0);
        } catch (error) {
          return error;
        }
      },
    ],
    ['a TypeError', () => new TypeError("Cannot read properties of undefined (reading 'x')")],
    [
      'a storage error with no known code',
      () => Object.assign(new Error('no such column'), { name: 'SequelizeDatabaseError' }),
    ],
  ];
  for (const [label, make] of bugs) {
    it(`${label} is a 500, its cause logged once`, async () => {
      const cause = make();
      expect(cause).toBeInstanceOf(Error);
      const log = vi.spyOn(console, 'error').mockImplementation(() => undefined);
      const res = await request(throwingApp(() => cause)).get('/api/v1/broken');
      expect(res.status).toBe(500);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(res.body).toMatchObject({ status: 500, title: 'Internal error', errors: [] });
      expect(log).toHaveBeenCalledTimes(1);
      expect(log.mock.calls[0]).toContain(cause);
    });
  }

  it('the library ParameterRangeError / ParameterTypeError are a 400 naming the field, not logged', async () => {
    const log = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    const range = await request(
      throwingApp(() => new ParameterRangeError('ma', 'a finite number > 0', -1)),
    ).get('/api/v1/broken');
    expect(range.status).toBe(400);
    expect(range.body.errors).toEqual([
      { path: 'ma', message: 'ma must be a finite number > 0; got -1' },
    ]);
    const type = await request(
      throwingApp(() => new ParameterTypeError('edges', 'an array of numbers', 'x')),
    ).get('/api/v1/broken');
    expect(type.status).toBe(400);
    expect(type.body.errors[0].path).toBe('edges');
    expect(log).not.toHaveBeenCalled();
  });

  it('callLibrary prefixes the library field and passes any other error through unchanged', () => {
    const named = (() => {
      try {
        return callLibrary('modulation.', () => {
          throw new ParameterRangeError('ma', 'a finite number > 0', 0);
        });
      } catch (error) {
        return error;
      }
    })();
    expect(named).toBeInstanceOf(HttpError);
    expect((named as HttpError).status).toBe(400);
    expect((named as HttpError).errors).toEqual([
      { path: 'modulation.ma', message: 'modulation.ma must be a finite number > 0; got 0' },
    ]);
    const bug = new RangeError('Invalid array length');
    expect(asBadRequest('modulation.', bug)).toBe(bug);
    const typeBug = new TypeError('x is not a function');
    expect(asBadRequest('modulation.', typeBug)).toBe(typeBug);
  });

  it('a unique constraint broken meanwhile is a 409, not logged', async () => {
    const log = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    const res = await request(
      throwingApp(() =>
        Object.assign(new Error('Validation error'), { name: 'SequelizeUniqueConstraintError' }),
      ),
    ).get('/api/v1/broken');
    expect(res.status).toBe(409);
    expect(log).not.toHaveBeenCalled();
  });
});

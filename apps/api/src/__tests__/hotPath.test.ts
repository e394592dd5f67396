import { createHash } from 'node:crypto';
import express, { type Request, type RequestHandler } from 'express';
import helmet from 'helmet';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cacheOpenApiMetadata } from '../http/cacheOpenApiMetadata.js';
import { HttpError } from '../http/errors.js';
import { HELMET_OPTIONS, securityHeaders } from '../http/securityHeaders.js';
import { finiteResult, finiteSpectrum } from '../services/library.js';
import { hashToken } from '../services/tokens.js';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

/**
 * Issue 11's throughput pass (docs/robustness.md, throughput): each shortcut on the path of a
 * compute answer keeps what it replaced. Non-finite numbers: IEEE 754 (NaN and ±∞), which
 * `JSON.stringify` writes as `null` (ECMA-262, SerializeJSONProperty), so they must not reach it.
 */
describe('finiteResult: NaN and ±∞ refused with the field and the place, finite results passed on', () => {
  const refusal = (result: unknown): HttpError => {
    try {
      finiteResult('modulation', result);
    } catch (error) {
      if (error instanceof HttpError) return error;
      throw error;
    }
    throw new Error('finiteResult accepted a non-finite result');
  };

  it('passes a finite result on unchanged (the same object)', () => {
    const result = {
      name: 'bridge output',
      harmonics: [
        { order: 0, amplitude: 0, phase: 0 },
        { order: 1, amplitude: -1e308, phase: Math.PI },
      ],
      thd: 0.5,
      nested: [[1, 2], { deep: [Number.MIN_VALUE] }],
      nothing: null,
    };
    expect(finiteResult('modulation', result)).toBe(result);
    expect(finiteResult('modulation', 3)).toBe(3);
    expect(finiteResult('modulation', 'text')).toBe('text');
  });

  it.each([
    [
      'NaN in an array element’s field',
      { harmonics: [{ amplitude: 1 }, { amplitude: NaN }] },
      'harmonics[1].amplitude',
    ],
    ['+∞ at the top', { thd: Infinity }, 'thd'],
    ['−∞ in a nested array', { traces: [{ values: [0, 1, -Infinity] }] }, 'traces[0].values[2]'],
    ['NaN as an array element', { series: [1, NaN] }, 'series[1]'],
  ])('refuses %s with a 400 naming the field and where', (_what, result, where) => {
    const error = refusal(result);
    expect(error.status).toBe(400);
    expect(error.message).toContain(
      `modulation holds values so extreme that ${where} is not a finite number`,
    );
    expect(error.errors).toEqual([{ path: 'modulation', message: error.message }]);
  });

  it('refuses a non-finite result that is a bare number', () => {
    expect(refusal(NaN).status).toBe(400);
  });

  it('ignores inherited enumerable numbers, which JSON.stringify does not write', () => {
    const result = Object.create({ inherited: NaN, deeper: { x: Infinity } }) as Record<
      string,
      unknown
    >;
    result.own = 1;
    expect(JSON.stringify(result)).toBe('{"own":1}');
    expect(finiteResult('modulation', result)).toBe(result);
  });
});

describe('finiteSpectrum: a spectrum answer checked as finiteResult checks it', () => {
  const spectrum = (
    change: (harmonics: { order: number; amplitude: number; phase: number }[]) => void,
  ) => {
    const harmonics = Array.from({ length: 50 }, (_, order) => ({
      order,
      amplitude: 1 / (order + 1),
      phase: -order,
    }));
    change(harmonics);
    return { name: 'bridge output', harmonics, thd: 0.5, wthd: 0.01, spectrumThd: 0.4 };
  };
  const refusalOf = (result: ReturnType<typeof spectrum>): string => {
    try {
      finiteSpectrum('modulation', result);
    } catch (error) {
      if (error instanceof HttpError && error.status === 400) return error.message;
      throw error;
    }
    return 'accepted';
  };

  it('passes a finite spectrum on unchanged (the same object)', () => {
    const result = spectrum(() => undefined);
    expect(finiteSpectrum('modulation', result)).toBe(result);
  });

  it.each([
    ['order', 7, NaN],
    ['amplitude', 31, Infinity],
    ['phase', 49, -Infinity],
  ] as const)(
    'refuses a non-finite %s of a harmonic, naming it as finiteResult does',
    (key, at, value) => {
      const result = spectrum((harmonics) => {
        harmonics[at]![key] = value;
      });
      expect(refusalOf(result)).toContain(`harmonics[${at}].${key} is not a finite number`);
    },
  );

  it('refuses a non-finite figure beside the harmonics', () => {
    const result = { ...spectrum(() => undefined), wthd: NaN };
    expect(refusalOf(result)).toContain('modulation holds values so extreme that wthd is not');
  });
});

describe('hashToken: SHA-256 as hex, from the one-shot crypto.hash', () => {
  it('gives the published digest of "abc" and the UTF-8 digest of any text', () => {
    // FIPS 180-2, appendix B.1: SHA-256("abc").
    expect(hashToken('abc')).toBe(
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
    );
    // Stored hashes were made by createHash('sha256').update(token, 'utf8'): the same digests.
    for (const token of ['pwk_abcdefgh_secret', 'pws_caf\u00e9 \u2212 \u03c9', ''])
      expect(hashToken(token)).toBe(createHash('sha256').update(token, 'utf8').digest('hex'));
  });
});

const SPECTRUM = {
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.9, mf: 21, vdc: 400 },
  maxOrder: 1050,
};

describe('the hot path of a compute answer, against the same service with response validation on', () => {
  let plain: TestApp;
  let checked: TestApp;
  let plainToken: string;
  let checkedToken: string;

  beforeAll(async () => {
    // Response validation off, as in production; on, as in development and the other suites
    // (answers then go through Express's res.json, wrapped by the validator).
    plain = await testApp({ validateResponses: false });
    checked = await testApp({ validateResponses: true });
    plainToken = await signIn(plain.app, DEMO.viewer);
    checkedToken = await signIn(checked.app, DEMO.viewer);
  }, 120_000); // two services start (migrations, seeding) on a loaded machine
  afterAll(async () => {
    await plain.dispose();
    await checked.dispose();
  });

  it('answers POST /spectra with the same status, headers and bytes as res.json does', async () => {
    const a = await request(plain.app)
      .post('/api/v1/spectra')
      .set('authorization', `Bearer ${plainToken}`)
      .send(SPECTRUM);
    const b = await request(checked.app)
      .post('/api/v1/spectra')
      .set('authorization', `Bearer ${checkedToken}`)
      .send(SPECTRUM);
    expect(a.status).toBe(200);
    expect(b.status).toBe(200);
    expect(a.text).toBe(b.text);
    expect(a.headers['content-type']).toBe('application/json; charset=utf-8');
    expect(Number(a.headers['content-length'])).toBe(Buffer.byteLength(a.text));
    const { date: _a, ...headersA } = a.headers as Record<string, string>;
    const { date: _b, ...headersB } = b.headers as Record<string, string>;
    expect(headersA).toEqual(headersB);
    expect((a.body as { harmonics: unknown[] }).harmonics).toHaveLength(1051);
  });

  it('answers POST /designs/report serialised in the worker with the same bytes as the validated res.json', async () => {
    // A report big enough to run in the worker pool (three-phase, mf 301, LC filter, 4000 points).
    const body = {
      design: {
        vdc: 600,
        fundamentalFrequency: 50,
        carrierFrequency: 50 * 301,
        modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'min-max' },
        filter: { l: 1e-3, c: 10e-6 },
        load: { r: 10, l: 1e-3 },
      },
      points: 4000,
    };
    const a = await request(plain.app)
      .post('/api/v1/designs/report')
      .set('authorization', `Bearer ${plainToken}`)
      .send(body);
    const b = await request(checked.app)
      .post('/api/v1/designs/report')
      .set('authorization', `Bearer ${checkedToken}`)
      .send(body);
    expect(a.status).toBe(200);
    expect(b.status).toBe(200);
    expect(a.text).toBe(b.text);
    expect(a.headers['content-type']).toBe('application/json; charset=utf-8');
    expect(Number(a.headers['content-length'])).toBe(Buffer.byteLength(a.text));
    // The worker's UTF-8 bytes go out with the headers res.json gives the same report.
    const { date: _a, ...headersA } = a.headers as Record<string, string>;
    const { date: _b, ...headersB } = b.headers as Record<string, string>;
    expect(headersA).toEqual(headersB);
  });

  it('answers the CSV form and a refused request as before', async () => {
    const csv = await request(plain.app)
      .post('/api/v1/spectra?format=csv')
      .set('authorization', `Bearer ${plainToken}`)
      .send(SPECTRUM);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toBe('text/csv; charset=utf-8');
    const refused = await request(plain.app)
      .post('/api/v1/spectra')
      .set('authorization', `Bearer ${plainToken}`)
      .send({ ...SPECTRUM, maxOrder: -1 });
    expect(refused.status).toBe(400);
    expect(refused.headers['content-type']).toMatch(/^application\/problem\+json/);
  });
});

/** An answer's headers without the clock's. */
function headersOf(res: request.Response): Record<string, string> {
  const { date: _date, ...rest } = res.headers as Record<string, string>;
  return rest;
}

describe('securityHeaders: helmet’s headers, taken once', () => {
  /** A small app answering JSON, text, an error and a HEAD behind `headers`. */
  const appWith = (headers: RequestHandler) => {
    const app = express();
    app.set('etag', false);
    app.use(headers);
    app.get('/json', (_req, res) => {
      res.json({ a: 1 });
    });
    app.get('/text', (_req, res) => {
      res.type('text/plain').send('text');
    });
    app.get('/fail', (_req, res) => {
      res.status(500).json({ error: 'boom' });
    });
    return app;
  };

  it.each([
    ['GET', '/json'],
    ['GET', '/text'],
    ['GET', '/fail'],
    ['GET', '/nowhere'],
    ['HEAD', '/json'],
  ])('%s %s: the same headers as helmet itself sets', async (method, path) => {
    const call = (app: express.Express) =>
      method === 'HEAD' ? request(app).head(path) : request(app).get(path);
    const fromHelmet = await call(appWith(helmet(HELMET_OPTIONS)));
    const once = await call(appWith(securityHeaders()));
    expect(once.status).toBe(fromHelmet.status);
    expect(headersOf(once)).toEqual(headersOf(fromHelmet));
    expect(once.headers['x-content-type-options']).toBe('nosniff');
    expect(once.headers['x-powered-by']).toBeUndefined();
    // Express's own 404 page sets a stricter policy of its own, after helmet's.
    if (path !== '/nowhere')
      expect(once.headers['content-security-policy']).toContain("script-src 'self'");
  });

  it('refuses at start settings whose headers depend on the request (a nonce function)', () => {
    expect(() =>
      securityHeaders({
        contentSecurityPolicy: {
          directives: {
            'script-src': [
              "'self'",
              (_req, res) =>
                `'nonce-${(res as unknown as { locals: { nonce: string } }).locals.nonce}'`,
            ],
          },
        },
      }),
    ).toThrow(/cannot be set once/);
  });
});

describe('cacheOpenApiMetadata: the validator’s route lookup kept per method and documented path', () => {
  /** A stand-in for the validator's metadata step: counts its calls, matches two documented paths. */
  const fakeStep = () => {
    const calls: string[] = [];
    const step = function metadataMiddleware(
      req: Request,
      _res: unknown,
      next: (e?: unknown) => void,
    ) {
      calls.push(req.originalUrl);
      const path = req.originalUrl.split('?')[0]!;
      const studies = /^\/api\/v1\/studies\/([^/]+)$/.exec(path);
      if (path === '/api/v1/spectra' || path === '/api/v1/Spectra') {
        const pathParams = {};
        Object.assign(req, {
          openapi: {
            expressRoute: '/api/v1/spectra',
            openApiRoute: '/api/v1/spectra',
            pathParams,
            schema: { id: 'spectra' },
            serial: -1,
          },
          params: pathParams,
        });
      } else if (studies) {
        const pathParams = { id: studies[1]! };
        Object.assign(req, {
          openapi: {
            expressRoute: '/api/v1/studies/:id',
            openApiRoute: '/api/v1/studies/{id}',
            pathParams,
            schema: { id: 'study' },
            serial: -1,
          },
          params: pathParams,
        });
      }
      next();
    } as unknown as RequestHandler;
    return { calls, step };
  };
  const run = async (steps: RequestHandler[], method: string, url: string) => {
    const req = { method, originalUrl: url, params: {} } as unknown as Request & {
      openapi?: { pathParams: object };
    };
    let error: unknown = 'not called';
    await steps[0]!(req, {} as never, (e?: unknown) => {
      error = e;
    });
    return { req, error };
  };

  it('asks the step once for a documented path without parameters, then answers a fresh copy', async () => {
    const { calls, step } = fakeStep();
    const steps = cacheOpenApiMetadata([step]);
    const first = await run(steps, 'POST', '/api/v1/spectra');
    const second = await run(steps, 'POST', '/api/v1/spectra?format=csv');
    expect(calls).toEqual(['/api/v1/spectra']);
    expect(first.error).toBeUndefined();
    expect(second.error).toBeUndefined();
    expect(second.req.openapi).toEqual(first.req.openapi);
    expect(second.req.openapi).not.toBe(first.req.openapi);
    expect(second.req.openapi?.pathParams).not.toBe(first.req.openapi?.pathParams);
    expect(second.req.params).toBe(second.req.openapi?.pathParams);
    // Another method is another key: the step decides it.
    await run(steps, 'GET', '/api/v1/spectra');
    expect(calls).toHaveLength(2);
  });

  it('always asks the step for paths with parameters, other spellings and unknown paths', async () => {
    const { calls, step } = fakeStep();
    const steps = cacheOpenApiMetadata([step]);
    for (const url of [
      '/api/v1/studies/a',
      '/api/v1/studies/a',
      '/api/v1/Spectra',
      '/api/v1/Spectra',
      '/nowhere',
      '/nowhere',
    ])
      await run(steps, 'GET', url);
    expect(calls).toHaveLength(6);
    const b = await run(steps, 'GET', '/api/v1/studies/b');
    expect(b.req.openapi?.pathParams).toEqual({ id: 'b' });
  });

  it('stops the start when the validator has no step of that name', () => {
    const other: RequestHandler = (_req, _res, next) => next();
    expect(() => cacheOpenApiMetadata([other])).toThrow(/metadataMiddleware was not found/);
  });
});

describe('the whole stack after the shortcuts: validation, revocation and headers on every answer', () => {
  let t: TestApp;
  let admin: Record<string, string>;
  beforeAll(async () => {
    t = await testApp({ validateResponses: false });
    admin = { Authorization: `Bearer ${await signIn(t.app, DEMO.admin)}` };
  });
  afterAll(() => t.dispose());

  const spectra = (key: string, body: object = SPECTRUM) =>
    request(t.app).post('/api/v1/spectra').set('authorization', `Bearer ${key}`).send(body);

  it('refuses a bad body and a wrong method after the route is cached, and revocation bites on the next request', async () => {
    const made = await request(t.app)
      .post('/api/v1/api-keys')
      .set(admin)
      .send({ name: 'hot path', role: 'viewer' });
    expect(made.status).toBe(201);
    const key = made.body.key as string;
    expect((await spectra(key)).status).toBe(200);
    expect((await spectra(key)).status).toBe(200); // route metadata and credential both cached
    const bad = await spectra(key, {
      ...SPECTRUM,
      modulation: { ...SPECTRUM.modulation, ma: 'high' },
    });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain('modulation');
    const unknownField = await spectra(key, { ...SPECTRUM, extra: 1 });
    expect(unknownField.status).toBe(400);
    const wrongMethod = await request(t.app)
      .get('/api/v1/spectra')
      .set('authorization', `Bearer ${key}`);
    expect(wrongMethod.status).toBe(405);
    expect((await spectra('pwk_not-a-key')).status).toBe(401);
    const revoked = await request(t.app).delete(`/api/v1/api-keys/${made.body.id}`).set(admin);
    expect(revoked.status).toBe(204);
    expect((await spectra(key)).status).toBe(401);
  });

  it('sends helmet’s headers on an answer, a refusal and the health check', async () => {
    const key = (
      await request(t.app)
        .post('/api/v1/api-keys')
        .set(admin)
        .send({ name: 'headers', role: 'viewer' })
    ).body.key as string;
    const bare = express();
    bare.use(helmet(HELMET_OPTIONS));
    bare.get('/', (_req, res) => res.end());
    const expected = headersOf(await request(bare).get('/'));
    for (const res of [
      await spectra(key),
      await spectra('pwk_not-a-key'),
      await request(t.app).get('/api/health'),
    ]) {
      for (const [name, value] of Object.entries(expected)) {
        if (['connection', 'content-length', 'transfer-encoding'].includes(name)) continue;
        expect(res.headers[name], name).toBe(value);
      }
    }
  });
});

import { gzipSync } from 'node:zlib';
import express, {
  type ErrorRequestHandler,
  type Request,
  type RequestHandler,
  type Response,
} from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cacheOpenApiMetadata } from '../http/cacheOpenApiMetadata.js';
import { computeFastPath } from '../http/computeFastPath.js';
import type { OpenApiDocument } from '../openapi.js';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

/**
 * Issue 11's throughput pass (docs/robustness.md, throughput): compute requests with a plain JSON
 * body take the validator's own steps without the Express layers between them. What must hold:
 * the same steps in the same order, the same body as express.json would give (and the same
 * errors), every other request on the whole chain, and the same answers from the whole service.
 */

type Log = { log: string[] };

/** A validator step of the given name that logs itself, and fails when `fail` says so. */
function step(name: string, fail?: (req: Request) => unknown): RequestHandler {
  const named = {
    [name]: (req: Request, _res: Response, next: (error?: unknown) => void) => {
      (req as Request & Log).log.push(name);
      // The validator's steps answer through a promise (pContext.then); so does this one.
      return Promise.resolve().then(() => next(fail?.(req)));
    },
  };
  return named[name] as RequestHandler;
}

/** The validator's metadata step for one documented path, logging its calls. */
const metadataStep = step('metadataMiddleware', (req) => {
  if (req.originalUrl.split('?')[0] === '/api/v1/spectra') {
    const pathParams = {};
    Object.assign(req, {
      openapi: { expressRoute: '/api/v1/spectra', openApiRoute: '/api/v1/spectra', pathParams },
      params: pathParams,
    });
  }
  return undefined;
});

const DOCUMENT = {
  openapi: '3.1.0',
  info: { title: 'test', version: '1' },
  paths: {
    '/api/v1/spectra': { post: { requestBody: { content: { 'application/json': {} } } } },
    '/api/v1/uploads': { post: { requestBody: { content: { 'multipart/form-data': {} } } } },
  },
} as unknown as OpenApiDocument;

/**
 * A small app shaped like the service: the fast path first, then a marker for "the whole chain"
 * (which answers with what it saw), express.json, the validator's six steps, the router, and an
 * error handler that answers the error's status and type.
 */
function miniApp(options: { failAt?: string; limit?: number } = {}) {
  const fail = (name: string) =>
    options.failAt === name ? { status: 418, type: name } : undefined;
  const validator = cacheOpenApiMetadata([
    step('pathParamsMiddleware'),
    metadataStep,
    step('securityMiddleware', () => fail('securityMiddleware')),
    step('multipartMiddleware'),
    step('requestMiddleware', () => fail('requestMiddleware')),
  ]);
  const router = express.Router();
  const answer: RequestHandler = (req, res) => {
    res.json({ body: req.body as unknown, log: (req as Request & Log).log });
  };
  router.post('/api/v1/spectra', answer);
  router.post('/api/v1/uploads', answer);
  const headers: RequestHandler = (req, res, next) => {
    (req as Request & Log).log.push('headers');
    res.setHeader('x-test-headers', 'set');
    next();
  };
  const app = express();
  app.use((req, _res, next) => {
    (req as Request & Log).log = [];
    next();
  });
  app.use(
    computeFastPath({
      headers,
      validator,
      router,
      document: DOCUMENT,
      bodyLimit: options.limit ?? 1024,
    }),
  );
  app.use((req, _res, next) => {
    (req as Request & Log).log.push('whole chain');
    next();
  });
  app.use(headers);
  app.use(express.json({ limit: options.limit ?? 1024 }));
  app.use(validator);
  app.use(router);
  const errors: ErrorRequestHandler = (
    error: { status?: number; type?: string },
    req,
    res,
    _next,
  ) => {
    res.status(error.status ?? 500).json({ type: error.type, log: (req as Request & Log).log });
  };
  app.use(errors);
  return app;
}

const post = (app: express.Express, body = '{"ma":0.9}', type = 'application/json') =>
  request(app).post('/api/v1/spectra').set('content-type', type).send(body);

describe('computeFastPath: the validator’s steps without the layers between them', () => {
  it('takes the whole chain the first time, then the same steps in the same order without it', async () => {
    const app = miniApp();
    const first = await post(app);
    expect(first.status).toBe(200);
    expect(first.body).toEqual({
      body: { ma: 0.9 },
      log: [
        'whole chain',
        'headers',
        'pathParamsMiddleware',
        'metadataMiddleware',
        'securityMiddleware',
        'multipartMiddleware',
        'requestMiddleware',
      ],
    });
    const second = await post(app);
    expect(second.status).toBe(200);
    expect(second.headers['x-test-headers']).toBe('set');
    // The route lookup comes from cacheOpenApiMetadata (the step logs only when it is asked).
    expect(second.body).toEqual({
      body: { ma: 0.9 },
      log: ['headers', 'securityMiddleware', 'requestMiddleware'],
    });
  });

  it.each([
    ['a query string', (app: express.Express) => request(app).post('/api/v1/spectra?format=csv')],
    ['a trailing slash', (app: express.Express) => request(app).post('/api/v1/spectra/')],
    ['a path of another body type', (app: express.Express) => request(app).post('/api/v1/uploads')],
  ])('leaves requests with %s to the whole chain', async (_what, make) => {
    const app = miniApp();
    await post(app);
    const res = await make(app).set('content-type', 'application/json').send('{"ma":0.9}');
    expect(res.body.log?.[0] ?? res.body.type).toBe('whole chain');
  });

  it.each([
    ['another type', { 'content-type': 'text/plain' }, 'x'],
    ['another charset', { 'content-type': 'application/json; charset=utf-16le' }, '{}'],
    ['a Content-Encoding', { 'content-encoding': 'gzip' }, gzipSync('{"ma":0.9}')],
    ['a body over the limit', {}, JSON.stringify({ text: 'x'.repeat(2000) })],
  ])('leaves a body with %s to express.json and the validator', async (_what, headers, body) => {
    const app = miniApp();
    await post(app);
    const res = await request(app)
      .post('/api/v1/spectra')
      .set({ 'content-type': 'application/json', ...headers })
      .send(body);
    expect(res.body.log[0]).toBe('whole chain');
  });

  it('leaves a chunked body (no Content-Length) to express.json', async () => {
    const app = miniApp();
    await post(app);
    const server = app.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    const { port } = server.address() as { port: number };
    const res = await fetch(`http://127.0.0.1:${port}/api/v1/spectra`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: new Blob(['{"ma":0.9}']).stream(),
      duplex: 'half',
    });
    const answer = (await res.json()) as Log & { body: unknown };
    server.close();
    expect(answer.log[0]).toBe('whole chain');
    expect(answer.body).toEqual({ ma: 0.9 });
  });

  // The bodies express.json (body-parser 2) reads one way or refuses as `entity.parse.failed`.
  it.each([
    '{"ma":0.9,"nested":[1,{"a":null}]}',
    '[1,2,3]',
    ' \r\n\t{"leading":"white space"}',
    '\ufeff{"byte order":"mark"}',
    '{"text":"caf\u00e9 \u2212 \u03c9"}',
    '{"broken":',
    '"a string"',
    'null',
    '42',
    '{"a":1} trailing',
    '\ufeff',
  ])('reads %j as express.json does', async (body) => {
    const app = miniApp();
    await post(app);
    const fast = await post(app, body);
    const whole = await post(app, body, 'application/json;charset=utf-8');
    expect(whole.body.log?.[0] ?? 'whole chain').toBe('whole chain');
    expect(fast.status).toBe(whole.status);
    expect(fast.body.body).toEqual(whole.body.body);
    expect(fast.body.type).toBe(whole.body.type);
    if (fast.status === 200) expect(fast.body.log[0]).toBe('headers');
  });

  it.each(['securityMiddleware', 'requestMiddleware'])(
    'passes an error of the %s step to the error handler and runs nothing after it',
    async (failAt) => {
      const app = miniApp({ failAt });
      await post(app);
      const res = await post(app);
      expect(res.status).toBe(418);
      expect(res.body.type).toBe(failAt);
      expect(res.body.log.at(-1)).toBe(failAt);
      expect(res.body.log).not.toContain('whole chain');
    },
  );

  it('stops the start when the validator has a step it does not know', () => {
    const validator = cacheOpenApiMetadata([metadataStep, step('somethingNew')]);
    expect(() =>
      computeFastPath({
        headers: (_req, _res, next) => next(),
        validator,
        router: express.Router(),
        document: DOCUMENT,
        bodyLimit: 1024,
      }),
    ).toThrow(/somethingNew/);
  });
});

describe('the service’s compute answers, fast path against the whole chain', () => {
  let t: TestApp;
  let token: string;
  beforeAll(async () => {
    t = await testApp({ validateResponses: false });
    token = await signIn(t.app, DEMO.viewer);
  });
  afterAll(() => t.dispose());

  const SPECTRUM = {
    modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.9, mf: 21, vdc: 400 },
    maxOrder: 200,
  };
  // `application/json` takes the fast path once the path is known; the same type spelled without
  // the space before its charset is the same request to Express and the validator, and goes the
  // whole way (the fast path takes only the two common spellings).
  const send = (path: string, body: string, type: string, auth = `Bearer ${token}`) =>
    request(t.app)
      .post(path)
      .set({ 'content-type': type, ...(auth ? { authorization: auth } : {}) })
      .send(body);

  it.each([
    ['a spectrum', '/api/v1/spectra', JSON.stringify(SPECTRUM), undefined],
    [
      'a spectrum with defaults filled in',
      '/api/v1/spectra',
      '{"modulation":{"method":"sine-triangle","scheme":"unipolar","ma":0.8,"mf":15,"vdc":300}}',
      undefined,
    ],
    [
      'a waveform',
      '/api/v1/waveforms',
      JSON.stringify({ modulation: SPECTRUM.modulation }),
      undefined,
    ],
    ['a bad value', '/api/v1/spectra', JSON.stringify({ ...SPECTRUM, maxOrder: -1 }), undefined],
    ['an unknown field', '/api/v1/spectra', JSON.stringify({ ...SPECTRUM, extra: 1 }), undefined],
    ['a body that is not JSON', '/api/v1/spectra', '{"modulation":', undefined],
    [
      'a library refusal',
      '/api/v1/spectra',
      JSON.stringify({ ...SPECTRUM, modulation: { ...SPECTRUM.modulation, ma: 1e308 } }),
      undefined,
    ],
    ['no token', '/api/v1/spectra', JSON.stringify(SPECTRUM), ''],
    ['an unknown token', '/api/v1/spectra', JSON.stringify(SPECTRUM), 'Bearer pwk_unknown'],
    ['another scheme', '/api/v1/spectra', JSON.stringify(SPECTRUM), 'Basic dXNlcjpwYXNz'],
  ])('answers %s with the same status, headers and bytes', async (_what, path, body, auth) => {
    await send(path, body, 'application/json', auth ?? `Bearer ${token}`); // the path is now known
    const fast = await send(path, body, 'application/json', auth ?? `Bearer ${token}`);
    const whole = await send(
      path,
      body,
      'application/json;charset=utf-8',
      auth ?? `Bearer ${token}`,
    );
    expect(fast.status).toBe(whole.status);
    expect(fast.text).toBe(whole.text);
    const { date: _a, ...fastHeaders } = fast.headers as Record<string, string>;
    const { date: _b, ...wholeHeaders } = whole.headers as Record<string, string>;
    expect(fastHeaders).toEqual(wholeHeaders);
  });

  it('refuses a revoked key on the next request, which takes the fast path', async () => {
    const admin = `Bearer ${await signIn(t.app, DEMO.admin)}`;
    const made = await request(t.app)
      .post('/api/v1/api-keys')
      .set('authorization', admin)
      .send({ name: 'fast path', role: 'viewer' });
    const key = `Bearer ${made.body.key as string}`;
    expect(
      (await send('/api/v1/spectra', JSON.stringify(SPECTRUM), 'application/json', key)).status,
    ).toBe(200);
    expect(
      (await send('/api/v1/spectra', JSON.stringify(SPECTRUM), 'application/json', key)).status,
    ).toBe(200);
    await request(t.app).delete(`/api/v1/api-keys/${made.body.id}`).set('authorization', admin);
    const after = await send('/api/v1/spectra', JSON.stringify(SPECTRUM), 'application/json', key);
    expect(after.status).toBe(401);
    expect(after.headers['www-authenticate']).toBe('Bearer realm="pulsewright"');
  });
});

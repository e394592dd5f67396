import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';
import { SINE_TRIANGLE, SINE_TRIANGLE_DESIGN as DESIGN, withMa } from './fixtures.js';

describe('bad input: 400 problem+json naming the field and the range, nothing changed', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  let projectId = '';
  let studyId = '';
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
    projectId = (
      await request(t.app).post('/api/v1/projects').set(auth).send({ name: 'Validation' })
    ).body.id;
    studyId = (
      await request(t.app)
        .post('/api/v1/studies')
        .set(auth)
        .send({ projectId, name: 'S', design: DESIGN })
    ).body.id;
  });
  afterAll(async () => t.dispose());

  /** Row counts of every table that a write could touch. */
  const snapshot = async () => {
    const m = t.app.services.models;
    return Promise.all(
      [m.Project, m.Study, m.StudyRevision, m.Capture, m.Job, m.ApiKey].map((model) =>
        (model as { count(): Promise<number> }).count(),
      ),
    );
  };

  const cases: {
    name: string;
    method: 'post' | 'put';
    path: () => string;
    body: unknown;
    field: string;
    words: string[];
  }[] = [
    {
      name: 'ma above 4',
      method: 'post',
      path: () => '/api/v1/spectra',
      body: { modulation: { ...SINE_TRIANGLE, ma: 7 }, maxOrder: 10 },
      field: 'modulation.ma',
      words: ['> 0', '≤ 4', 'got 7'],
    },
    {
      name: 'ma zero',
      method: 'post',
      path: () => '/api/v1/spectra',
      body: { modulation: { ...SINE_TRIANGLE, ma: 0 } },
      field: 'modulation.ma',
      words: ['> 0'],
    },
    {
      name: 'mf not an integer',
      method: 'post',
      path: () => '/api/v1/spectra',
      body: { modulation: { ...SINE_TRIANGLE, mf: 20.5 } },
      field: 'modulation.mf',
      words: ['integer', '≥ 1', '≤ 1000'],
    },
    {
      name: 'mf too large',
      method: 'post',
      path: () => '/api/v1/waveforms',
      body: { modulation: { ...SINE_TRIANGLE, mf: 100000 } },
      field: 'modulation.mf',
      words: ['≤ 1000'],
    },
    {
      name: 'maxOrder too large',
      method: 'post',
      path: () => '/api/v1/spectra',
      body: { modulation: SINE_TRIANGLE, maxOrder: 50001 },
      field: 'maxOrder',
      words: ['≤ 5000'],
    },
    {
      name: 'ma as text',
      method: 'post',
      path: () => '/api/v1/spectra',
      body: { modulation: { ...SINE_TRIANGLE, ma: 'lots' } },
      field: 'modulation.ma',
      words: ['a number', 'got "lots"'],
    },
    {
      name: 'unknown method',
      method: 'post',
      path: () => '/api/v1/spectra',
      body: { modulation: { ...SINE_TRIANGLE, method: 'wobble' } },
      field: 'modulation.method',
      words: ['sine-triangle', 'three-phase'],
    },
    {
      name: 'unknown scheme',
      method: 'post',
      path: () => '/api/v1/spectra',
      body: { modulation: { ...SINE_TRIANGLE, scheme: 'tripolar' } },
      field: 'modulation.scheme',
      words: ['"bipolar", "unipolar"'],
    },
    {
      name: 'missing vdc',
      method: 'post',
      path: () => '/api/v1/spectra',
      body: { modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.5, mf: 3 } },
      field: 'modulation.vdc',
      words: ['required', '> 0'],
    },
    {
      name: 'extra field',
      method: 'post',
      path: () => '/api/v1/spectra',
      body: { modulation: { ...SINE_TRIANGLE, turbo: true } },
      field: 'modulation.turbo',
      words: ['not a known field', 'scheme'],
    },
    {
      name: 'zero sequence unknown',
      method: 'post',
      path: () => '/api/v1/spectra',
      body: { modulation: { method: 'three-phase', ma: 1, mf: 9, vdc: 10, zeroSequence: 'fifth' } },
      field: 'modulation.zeroSequence',
      words: ['min-max'],
    },
    {
      name: 'sweep too many points',
      method: 'post',
      path: () => '/api/v1/jobs/ma-sweeps',
      body: { modulation: SINE_TRIANGLE, ma: { from: 0.1, to: 1, points: 401 } },
      field: 'ma.points',
      words: ['≤ 400'],
    },
    {
      name: 'SHE too many angles',
      method: 'post',
      path: () => '/api/v1/jobs/she-sweeps',
      body: {
        kind: 'bipolar',
        vdc: 1,
        count: 32,
        eliminate: [3],
        fundamental: { from: 0.1, to: 1, points: 3 },
      },
      field: 'count',
      words: ['≤ 31'],
    },
    {
      name: 'negative load resistance',
      method: 'post',
      path: () => '/api/v1/load-current',
      body: { design: { ...DESIGN, load: { r: -1, l: 0.01 } } },
      field: 'design.load.r',
      words: ['≥ 0.000001'],
    },
    {
      name: 'space vector angle',
      method: 'post',
      path: () => '/api/v1/space-vector',
      body: { m: 0.5, theta: 7 },
      field: 'theta',
      words: ['< 6.28'],
    },
    {
      name: 'timer clock zero',
      method: 'post',
      path: () => '/api/v1/timer-tables',
      body: {
        modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.5 },
        fundamentalFrequency: 50,
        carrierFrequency: 1000,
        timerClock: 0,
      },
      field: 'timerClock',
      words: ['> 0'],
    },
    {
      name: 'study edit with ma out of range',
      method: 'put',
      path: () => `/api/v1/studies/${studyId}`,
      body: { baseRevision: 1, name: 'S', design: withMa(DESIGN, -1) },
      field: 'design.modulation.ma',
      words: ['> 0', '≤ 4', 'got -1'],
    },
    {
      name: 'study with an empty name',
      method: 'post',
      path: () => '/api/v1/studies',
      body: () => ({ projectId, name: '', design: DESIGN }),
      field: 'name',
      words: ['1 to 120 characters'],
    },
    {
      name: 'study with the old modulation field',
      method: 'post',
      path: () => '/api/v1/studies',
      body: () => ({ projectId, name: 'S', modulation: SINE_TRIANGLE }),
      field: 'modulation',
      words: ['not a known field', 'design'],
    },
    {
      name: 'study with a filter and a carrier whose span costs too much',
      method: 'post',
      path: () => '/api/v1/studies',
      body: () => ({
        projectId,
        name: 'S',
        design: {
          ...DESIGN,
          fundamentalFrequency: 37,
          carrierFrequency: 3000,
          filter: { l: 0.002, c: 50e-6 },
        },
      }),
      field: 'design.carrierFrequency',
      words: ['or for a design with a filter a ratio p/q', 'got 3000'],
    },
    {
      name: 'study with a frequency ratio above 1000',
      method: 'post',
      path: () => '/api/v1/studies',
      body: () => ({ projectId, name: 'S', design: { ...DESIGN, carrierFrequency: 50_050 } }),
      field: 'design.carrierFrequency',
      words: ['1 to 1000'],
    },
    {
      name: 'design with the filter resistor of the old shape',
      method: 'post',
      path: () => '/api/v1/designs/report',
      body: { design: { ...DESIGN, filter: { l: 0.001, c: 1e-5, loadR: 10 } } },
      field: 'design.filter.loadR',
      words: ['not a known field'],
    },
    {
      name: 'design with vdc inside the modulation',
      method: 'post',
      path: () => '/api/v1/designs/report',
      body: { design: { ...DESIGN, modulation: { ...DESIGN.modulation, vdc: 400 } } },
      field: 'design.modulation.vdc',
      words: ['not a known field'],
    },
    {
      name: 'design with a fundamental frequency of zero',
      method: 'post',
      path: () => '/api/v1/designs/report',
      body: { design: { ...DESIGN, fundamentalFrequency: 0 } },
      field: 'design.fundamentalFrequency',
      words: ['≥ 0.001', '≤ 100000', 'got 0'],
    },
    {
      name: 'design with a capacitance of zero',
      method: 'post',
      path: () => '/api/v1/designs/report',
      body: { design: { ...DESIGN, filter: { l: 0.001, c: 0 } } },
      field: 'design.filter.c',
      words: ['≥ 1e-12', '≤ 1'],
    },
    {
      name: 'report with a maxOrder below 50',
      method: 'post',
      path: () => '/api/v1/designs/report',
      body: { design: DESIGN, maxOrder: 10 },
      field: 'maxOrder',
      words: ['≥ 50', '≤ 5000'],
    },
    {
      name: 'load-current of a design without a load',
      method: 'post',
      path: () => '/api/v1/load-current',
      body: { design: DESIGN },
      field: 'design.load',
      words: ['required'],
    },
    {
      name: 'filters/lc of a design without a filter',
      method: 'post',
      path: () => '/api/v1/filters/lc',
      body: { design: { ...DESIGN, filter: null } },
      field: 'design.filter',
      words: ['required'],
    },
    {
      name: 'spectra asking a leg of a single-phase bridge',
      method: 'post',
      path: () => '/api/v1/spectra',
      body: { modulation: SINE_TRIANGLE, output: 'leg' },
      field: 'output',
      words: ["'phase'", 'single-phase'],
    },
  ];

  for (const c of cases) {
    it(c.name, async () => {
      const before = await snapshot();
      const body = typeof c.body === 'function' ? (c.body as () => object)() : c.body;
      const agent = request(t.app);
      const res = await agent[c.method](c.path())
        .set(auth)
        .send(body as object);
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(res.body).toMatchObject({
        type: expect.stringContaining('validation'),
        title: 'Bad request',
        status: 400,
      });
      const item = res.body.errors.find((e: { path: string }) => e.path === c.field);
      expect(item, JSON.stringify(res.body.errors)).toBeDefined();
      for (const word of c.words) expect(item.message).toContain(word);
      expect(res.body.detail).toContain(c.field);
      expect(await snapshot()).toEqual(before);
    });
  }

  it('reports every bad field at once', async () => {
    const res = await request(t.app)
      .post('/api/v1/spectra')
      .set(auth)
      .send({ modulation: { ...SINE_TRIANGLE, ma: 9, mf: 0, vdc: -5 }, maxOrder: 0 });
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { path: string }) => e.path).sort()).toEqual([
      'maxOrder',
      'modulation.ma',
      'modulation.mf',
      'modulation.vdc',
    ]);
  });

  it('passes the library ParameterRangeError on as 400 with its own words', async () => {
    // Beyond the hexagon at this angle: only the library knows the angle-dependent limit.
    const res = await request(t.app)
      .post('/api/v1/space-vector')
      .set(auth)
      .send({ m: 1.15, theta: 0.1 });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe('m');
    expect(res.body.errors[0].message).toMatch(/^m must be .* got 1\.15$/);
  });

  it('answers malformed requests as problems, never 500', async () => {
    const bad = [
      await request(t.app)
        .post('/api/v1/spectra')
        .set(auth)
        .set('Content-Type', 'application/json')
        .send('{"modulation":'),
      await request(t.app).post('/api/v1/spectra').set(auth).send([1, 2, 3]),
      await request(t.app).post('/api/v1/spectra').set(auth).send({ modulation: null }),
      await request(t.app)
        .post('/api/v1/spectra')
        .set(auth)
        .send({ modulation: { ...SINE_TRIANGLE, ma: 1e308 * 10 } }),
      await request(t.app).get('/api/v1/studies/not-a-uuid').set(auth),
      await request(t.app).get('/api/v1/studies').query({ limit: 'many' }).set(auth),
      await request(t.app).get('/api/v1/studies').query({ sort: 'x' }).set(auth),
    ];
    for (const [i, res] of bad.entries()) {
      expect(res.status, `case ${i}: ${JSON.stringify(res.body)}`).toBe(400);
      expect(res.headers['content-type']).toMatch(/problem\+json/);
    }
    const missing = await request(t.app).get('/api/v1/nothing-here').set(auth);
    expect(missing.status).toBe(404);
    expect(missing.headers['content-type']).toMatch(/problem\+json/);
    const method = await request(t.app).delete('/api/v1/spectra').set(auth);
    expect(method.status).toBe(405);
    const unknownStudy = await request(t.app)
      .get('/api/v1/studies/00000000-0000-4000-8000-000000000000')
      .set(auth);
    expect(unknownStudy.status).toBe(404);
    expect(unknownStudy.body.detail).toBe('That study was not found.');
  });
});

import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';
import { captureCsv, SINE_TRIANGLE_DESIGN as DESIGN, withMa } from './fixtures.js';

describe('capture uploads', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
  });
  afterAll(async () => t.dispose());

  const upload = (content: string | Buffer, fileName = 'bench.csv') =>
    request(t.app)
      .post('/api/v1/captures')
      .set(auth)
      .attach('file', Buffer.from(content), fileName);
  const stored = () => t.app.services.models.Capture.count();

  const good = captureCsv().split('\n');
  const withLine = (line: number, text: string) =>
    good.map((l, i) => (i === line - 1 ? text : l)).join('\n');

  const bad: {
    name: string;
    content: () => string | Buffer;
    file?: string;
    status: number;
    words: string[];
  }[] = [
    { name: 'an empty file', content: () => '', status: 400, words: ['empty'] },
    {
      name: 'a header only',
      content: () => 'time,voltage\n',
      status: 400,
      words: ['0 data rows', 'at least 16'],
    },
    {
      name: 'wrong columns',
      content: () => good.join('\n').replace('time,voltage,current', 'time,pressure,current'),
      status: 400,
      words: ['line 1', '"pressure"', 'time, voltage'],
    },
    {
      name: 'no voltage column',
      content: () => good.map((l) => l.split(',').slice(0, 1).join(',')).join('\n'),
      status: 400,
      words: ['no voltage column'],
    },
    {
      name: 'a non-numeric cell',
      content: () => withLine(7, '0.001000,twelve,0.1'),
      status: 400,
      words: ['line 7', 'voltage', '"twelve"', 'not a finite number'],
    },
    {
      name: 'time going backwards',
      content: () => withLine(10, '0.000100,1,0.1'),
      status: 400,
      words: ['line 10', 'does not rise'],
    },
    {
      name: 'uneven time',
      content: () => withLine(10, '0.001750,1,0.1'),
      status: 400,
      words: ['line 10', 'evenly spaced'],
    },
    {
      name: 'a ragged row',
      content: () => withLine(5, '0.000800,1'),
      status: 400,
      words: ['not valid CSV'],
    },
    {
      name: 'binary content named .csv',
      content: () => Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 0, 0, 0x0d]),
      file: 'photo.csv',
      status: 400,
      words: ['not text'],
    },
    {
      name: 'a file above 5 MB',
      content: () => 'time,voltage\n' + '0.000001,1.000000000000000000\n'.repeat(190_000),
      status: 413,
      words: ['5 MB'],
    },
  ];

  for (const c of bad) {
    it(`rejects ${c.name} with ${c.status}, naming the reason, and stores nothing`, async () => {
      const before = await stored();
      const res = await upload(c.content(), c.file);
      expect(res.status, JSON.stringify(res.body)).toBe(c.status);
      expect(res.headers['content-type']).toMatch(/problem\+json/);
      for (const word of c.words) expect(res.body.detail).toContain(word);
      expect(await stored()).toBe(before);
    });
  }

  it('rejects a request without a file', async () => {
    const before = await stored();
    const res = await request(t.app).post('/api/v1/captures').set(auth).field('name', 'no file');
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe('file');
    expect(await stored()).toBe(before);
  });

  it('stores a good capture with a safe file name and gives the original back byte for byte', async () => {
    const content = captureCsv();
    const res = await upload(content, '../../etc/<bench> run.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({
      fileName: '_bench_ run.csv',
      rows: 200,
      sampleRate: expect.any(Number),
      columns: ['time', 'voltage', 'current'],
    });
    expect(res.body.sampleRate).toBeCloseTo(5000, 6);
    const file = await request(t.app)
      .get(`/api/v1/captures/${res.body.id}/file`)
      .set(auth)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(file.headers['content-type']).toMatch(/^text\/csv/);
    expect(file.headers['content-disposition']).toBe('attachment; filename="_bench_ run.csv"');
    expect((file.body as Buffer).equals(Buffer.from(content))).toBe(true);
    const full = await request(t.app).get(`/api/v1/captures/${res.body.id}`).set(auth);
    expect(full.body.series.voltage).toHaveLength(200);
  });

  it('analyses a capture with the window gain corrected and compares it with a study', async () => {
    // A 50 Hz sine of 100 V peak sampled at 10 kS/s for 0.2 s (10 whole periods), with a 10 mV
    // disturbance at an unrelated frequency so that it is not exactly periodic: read with a window.
    const lines = ['t,v'];
    for (let k = 0; k < 2000; k++) {
      const v = 100 * Math.sin(2 * Math.PI * 50 * (k / 10000)) + 0.01 * Math.sin(1.2345 * k);
      lines.push(`${(k / 10000).toFixed(6)},${v.toFixed(6)}`);
    }
    const id = (await upload(lines.join('\n'), 'sine.csv')).body.id;
    const spectrum = await request(t.app)
      .post(`/api/v1/captures/${id}/spectrum`)
      .set(auth)
      .send({ window: 'hann', fundamentalFrequency: 50, maxOrder: 5 });
    expect(spectrum.status, JSON.stringify(spectrum.body)).toBe(200);
    // Hann coherent gain 0.5 (Harris, Proc. IEEE, 1978); corrected, the peak reads 100 V.
    expect(spectrum.body).toMatchObject({ periodic: false, window: 'hann' });
    expect(spectrum.body.coherentGain).toBeCloseTo(0.5, 3);
    const first = spectrum.body.harmonics.find((h: { order: number }) => h.order === 1);
    expect(first.amplitude).toBeGreaterThan(95);
    expect(first.amplitude).toBeLessThan(105);

    const projectId = (
      await request(t.app).post('/api/v1/projects').set(auth).send({ name: 'Bench' })
    ).body.id;
    const studyId = (
      await request(t.app)
        .post('/api/v1/studies')
        .set(auth)
        .send({ projectId, name: 'Prediction', design: withMa(DESIGN, 0.25) })
    ).body.id;
    const comparison = await request(t.app)
      .post(`/api/v1/captures/${id}/comparison`)
      .set(auth)
      .send({ studyId, fundamentalFrequency: 50, maxOrder: 3 });
    expect(comparison.status, JSON.stringify(comparison.body)).toBe(200);
    const order1 = comparison.body.orders.find((o: { order: number }) => o.order === 1);
    // Predicted fundamental = ma·vdc = 0.25·400 = 100 V (linear range; Holmes and Lipo, 2003, ch. 3).
    expect(order1.predicted).toBeCloseTo(100, 6);
    expect(Math.abs(order1.ratio - 1)).toBeLessThan(0.05);

    const noCurrent = await request(t.app)
      .post(`/api/v1/captures/${id}/spectrum`)
      .set(auth)
      .send({ column: 'current' });
    expect(noCurrent.status).toBe(400);
    expect(noCurrent.body.errors[0].path).toBe('column');
  });
  it('reads the exact square wave over whole periods and compares to the third carrier group', async () => {
    // Issue 10's capture: ±100 V, 50 Hz, sampled at 100 kHz over 5 periods (10 000 rows).
    const lines = ['time,voltage'];
    for (let k = 0; k < 10_000; k++)
      lines.push(`${(k / 100_000).toFixed(5)},${k % 2000 < 1000 ? 100 : -100}`);
    const id = (await upload(lines.join('\n'), 'square.csv')).body.id;
    const spectrum = await request(t.app)
      .post(`/api/v1/captures/${id}/spectrum`)
      .set(auth)
      .send({ maxOrder: 3 });
    expect(spectrum.status, JSON.stringify(spectrum.body)).toBe(200);
    expect(spectrum.body).toMatchObject({ periodic: true, periods: 5, fftSize: 10_000 });
    // Fourier series of a ±V square wave, 4V/(nπ) on odd n (a fact of the trade), within the
    // sampling's (πn/M)²/6 for M = 2000 samples a period: 127.324 V and 42.441 V.
    expect(Math.abs(spectrum.body.fundamentalFrequency - 50)).toBeLessThan(50e-9);
    expect(spectrum.body.harmonics[0].amplitude).toBeCloseTo(400 / Math.PI, 3);
    expect(spectrum.body.harmonics[2].amplitude).toBeCloseTo(400 / (3 * Math.PI), 3);

    const projectId = (
      await request(t.app).post('/api/v1/projects').set(auth).send({ name: 'Square' })
    ).body.id;
    const study = (fundamentalFrequency: number) =>
      request(t.app)
        .post('/api/v1/studies')
        .set(auth)
        .send({
          projectId,
          name: `Square at ${fundamentalFrequency} Hz`,
          design: {
            ...DESIGN,
            fundamentalFrequency,
            carrierFrequency: 41 * fundamentalFrequency,
          },
        });
    const matching = (await study(50)).body.id;
    const comparison = await request(t.app)
      .post(`/api/v1/captures/${id}/comparison`)
      .set(auth)
      .send({ studyId: matching });
    expect(comparison.status, JSON.stringify(comparison.body)).toBe(200);
    // mf 41: the third carrier group and its sidebands reach 3·41 + 20 = 143.
    expect(comparison.body.maxOrder).toBe(143);
    expect(comparison.body.orders).toHaveLength(143);
    expect(comparison.body.warnings).toEqual([]);
    const byOrder = (n: number) =>
      comparison.body.orders.find((o: { order: number }) => o.order === n);
    // Bipolar sine-triangle has no even harmonics at odd mf (half-wave symmetry, common
    // practice): those predictions are below the 0.1 % floor and get no ratio.
    expect(byOrder(2).ratio).toBeNull();
    expect(byOrder(2).predicted).toBeLessThan(comparison.body.noiseFloor);
    // The carrier (order 41) is predicted well above the floor: a ratio is shown.
    expect(byOrder(41).predicted).toBeGreaterThan(comparison.body.noiseFloor);
    expect(byOrder(41).ratio).not.toBeNull();

    const other = (await study(60)).body.id;
    const mismatched = await request(t.app)
      .post(`/api/v1/captures/${id}/comparison`)
      .set(auth)
      .send({ studyId: other, maxOrder: 5 });
    expect(mismatched.status, JSON.stringify(mismatched.body)).toBe(200);
    expect(mismatched.body.warnings[0]).toMatch(/differs from the study's \(60 Hz\) by 16.67 %/);
  });
});

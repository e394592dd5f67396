import {
  cascadedPatternWaveform,
  harmonics,
  sheWaveform,
  type Waveform,
} from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

// Harmonic elimination for cascaded H-bridge cells through the service (issue 13): a staircase
// of unequal DC sources, b_n = (4/(nπ))·Σ V_k cos nα_k (L. M. Tolbert, J. N. Chiasson, Z. Du,
// K. J. McKenzie, IEEE Trans. Ind. Appl., 2005, from memory), and one unipolar pattern per cell
// solved jointly (H. S. Patel and R. G. Hoft, IEEE Trans. Ind. Appl., 1973, for the method;
// Holmes and Lipo 2003, ch. 11, for the string as the sum of its cells). Every figure below is
// read back by the library's exact `harmonics` of the waveform the route returns or stores, not
// by the solver's own model. Cell voltages are invented (PV strings at different operating points).

/** The signed sine coefficient of an exact spectrum entry (amplitude·cos phase). */
function sineCoefficient(h: { amplitude: number; phase: number } | undefined): number {
  return h === undefined ? NaN : h.amplitude * Math.cos(h.phase);
}

/** Eliminated orders below 1e-9 of the fundamental, which is `fundamental` to 1e-9, by the exact spectrum. */
function expectEliminated(waveform: Waveform, orders: number[], fundamental: number): void {
  const spectrum = harmonics(waveform, Math.max(1, ...orders));
  const v1 = sineCoefficient(spectrum[1]);
  expect(Math.abs(v1 - fundamental)).toBeLessThan(1e-9 * fundamental);
  for (const order of orders) {
    expect(spectrum[order]?.amplitude ?? NaN, `order ${order}`).toBeLessThan(1e-9 * v1);
  }
}

describe('cascaded cells: unequal-source staircases and per-cell patterns (issue 13)', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  let projectId: string;
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
    projectId = (
      await request(t.app).post('/api/v1/projects').set(auth).send({ name: 'Cascaded cells' })
    ).body.id;
  });
  afterAll(async () => {
    await t.dispose();
  });

  const cellVoltages = [455, 390, 420, 370];
  // The largest fundamental of a staircase of these sources, every angle at 0: 4ΣV_k/π.
  const limit = (4 * (455 + 390 + 420 + 370)) / Math.PI;
  const sweep = {
    kind: 'staircase',
    vdc: 400,
    count: 4,
    eliminate: [5, 7, 11],
    cellVoltages,
    fundamental: { from: 0.75 * limit, to: 0.85 * limit, points: 5 },
  };

  async function solvedPoints(): Promise<{ fundamental: number; angles: number[] }[]> {
    const created = await request(t.app).post('/api/v1/jobs/she-sweeps').set(auth).send(sweep);
    expect(created.status, JSON.stringify(created.body)).toBe(202);
    await t.app.services.jobs.idle();
    const job = (await request(t.app).get(`/api/v1/jobs/${created.body.id}`).set(auth)).body;
    expect(job.status, JSON.stringify(job.error)).toBe('succeeded');
    return (job.result.points as { fundamental: number; angles: number[]; converged: boolean }[])
      .filter((p) => p.converged)
      .map(({ fundamental, angles }) => ({ fundamental, angles }));
  }

  it('a SHE sweep of unequal sources: eliminated orders below 1e-9 of the fundamental', async () => {
    const points = await solvedPoints();
    expect(points.length).toBeGreaterThan(0);
    for (const { fundamental, angles } of points) {
      const waveform = sheWaveform(angles, { kind: 'staircase', vdc: 400, cellVoltages });
      expectEliminated(waveform, sweep.eliminate, fundamental);
    }
  });

  it('the same angles with equal sources do not eliminate: the cell voltages were used', async () => {
    const [point] = await solvedPoints();
    const equal = harmonics(sheWaveform(point!.angles, { kind: 'staircase', vdc: 400 }), 11);
    // From the series above: the solution has Σ V_k cos nα_k = 0 at n = 5, 7, 11, so with every
    // V_k = 400 what is left is b_n = (4/(nπ))·Σ(400 − V_k)·cos nα_k, not zero.
    for (const n of sweep.eliminate) {
      const left =
        (4 / (n * Math.PI)) *
        point!.angles.reduce((s, a, k) => s + (400 - cellVoltages[k]!) * Math.cos(n * a), 0);
      expect(Math.abs(left)).toBeGreaterThan(1e-3);
      expect(Math.abs(equal[n]!.amplitude - Math.abs(left)), `order ${n}`).toBeLessThan(
        1e-9 * limit,
      );
    }
  });

  it('a SHE sweep refuses bad cell voltages with 400 naming the field, creating no job', async () => {
    const before = await t.app.services.models.Job.count();
    const cases = [
      { body: { ...sweep, kind: 'bipolar', count: 4 }, path: 'cellVoltages', words: 'staircase' },
      {
        body: { ...sweep, cellVoltages: [455, 390, 420] },
        path: 'cellVoltages.length',
        words: '4',
      },
      { body: { ...sweep, cellVoltages: [455, 0, 420, 370] }, path: 'cellVoltages', words: '' },
      {
        body: { ...sweep, fundamental: { from: 0.5 * limit, to: 1.1 * limit, points: 5 } },
        path: 'fundamental.to',
        words: limit.toPrecision(5),
      },
    ];
    for (const c of cases) {
      const res = await request(t.app).post('/api/v1/jobs/she-sweeps').set(auth).send(c.body);
      expect(res.status, JSON.stringify(c.body)).toBe(400);
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      const paths = (res.body.errors as { path: string }[]).map((e) => e.path);
      expect(
        paths.some((p) => p.startsWith(c.path)),
        JSON.stringify(paths),
      ).toBe(true);
      expect(JSON.stringify(res.body)).toContain(c.words);
    }
    expect(await t.app.services.models.Job.count()).toBe(before);
  });

  it('a saved study of an unequal-source staircase reads back its report', async () => {
    const [point] = await solvedPoints();
    const design = {
      vdc: 400,
      fundamentalFrequency: 50,
      modulation: {
        method: 'selective-harmonic-elimination',
        kind: 'staircase',
        angles: point!.angles,
        cellVoltages,
        eliminate: sweep.eliminate,
        fundamental: point!.fundamental,
      },
    };
    const created = await request(t.app)
      .post('/api/v1/studies')
      .set(auth)
      .send({ projectId, name: 'Unequal PV cells', design });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body.design).toEqual(design);
    const report = await request(t.app)
      .get(`/api/v1/studies/${created.body.id}/report`)
      .query({ maxOrder: 50 })
      .set(auth);
    expect(report.status, JSON.stringify(report.body)).toBe(200);
    // The report's bridge voltage is the staircase of these sources: its exact spectrum has the
    // solved fundamental and the eliminated orders gone (same acceptance as above).
    const [bridge] = report.body.voltages as { waveform: Waveform }[];
    expectEliminated(bridge!.waveform, sweep.eliminate, point!.fundamental);
    // The report's own figures say the same: its fundamental and its spectrum.
    const figures = report.body.bridge as {
      fundamental: number;
      spectrum: { order: number; amplitude: number }[];
    };
    expect(Math.abs(figures.fundamental - point!.fundamental)).toBeLessThan(1e-9 * limit);
    for (const order of sweep.eliminate) {
      const h = figures.spectrum.find((x) => x.order === order);
      expect(h!.amplitude).toBeLessThan(1e-9 * figures.fundamental);
    }

    const bad = await request(t.app)
      .post('/api/v1/studies')
      .set(auth)
      .send({
        projectId,
        name: 'One source short',
        design: { ...design, modulation: { ...design.modulation, cellVoltages: [455, 390, 420] } },
      });
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe('design.modulation.cellVoltages.length');
  });

  const scale = (4 * 100) / Math.PI;
  const solve = {
    cells: 3,
    vdc: 100,
    count: 2,
    eliminate: [5, 7, 11, 13, 17],
    fundamental: 0.3 * 3 * scale,
  };

  it('solves one unipolar pattern per cell jointly: the string eliminates every order', async () => {
    const res = await request(t.app).post('/api/v1/cascaded-patterns/solve').set(auth).send(solve);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.converged, res.body.message).toBe(true);
    expect(res.body.patterns).toHaveLength(3);
    expectEliminated(res.body.output.waveform as Waveform, solve.eliminate, solve.fundamental);
    // The returned patterns rebuild the returned string (the library's cascadedPatternWaveform).
    const rebuilt = cascadedPatternWaveform({ cells: res.body.patterns });
    expectEliminated(rebuilt.output, solve.eliminate, solve.fundamental);
    // The spectrum answered is the exact one of the string, to maxOrder (default 100).
    const exact = harmonics(res.body.output.waveform as Waveform, 100);
    expect(res.body.spectrum.harmonics).toHaveLength(101);
    for (const order of [1, 19, 23, 99]) {
      const answered = res.body.spectrum.harmonics[order].amplitude as number;
      expect(Math.abs(answered - exact[order]!.amplitude)).toBeLessThan(1e-12 * scale);
    }
  });

  it('refuses a bad joint solve with 400 naming the field and its range', async () => {
    const cases = [
      { body: { ...solve, eliminate: [5, 7] }, path: 'eliminate.length' },
      { body: { ...solve, fundamental: 400 }, path: 'fundamental', words: '381.9' },
      { body: { ...solve, cells: 17 }, path: 'cells' },
      { body: { ...solve, cells: 8, count: 9 }, path: 'count', words: '64' },
      { body: { ...solve, angles: [[0.1, 0.2]] }, path: 'angles.length' },
      { body: { ...solve, eliminate: [5, 7, 11, 13, 16] }, path: 'eliminate[4]', words: 'odd' },
    ];
    for (const c of cases) {
      const res = await request(t.app)
        .post('/api/v1/cascaded-patterns/solve')
        .set(auth)
        .send(c.body);
      expect(res.status, JSON.stringify(c.body)).toBe(400);
      const paths = (res.body.errors as { path: string }[]).map((e) => e.path);
      expect(
        paths.some((p) => p.startsWith(c.path)),
        JSON.stringify(paths),
      ).toBe(true);
      if (c.words) expect(JSON.stringify(res.body)).toContain(c.words);
    }
  });

  it('prices the largest joint solve before work: refused naming cells, count and starts', async () => {
    const eliminate = Array.from({ length: 63 }, (_, i) => 3 + 2 * i);
    const started = Date.now();
    const res = await request(t.app)
      .post('/api/v1/cascaded-patterns/solve')
      .set(auth)
      .send({ cells: 16, vdc: 100, count: 4, eliminate, fundamental: 1000, starts: 200 });
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    const paths = (res.body.errors as { path: string }[]).map((e) => e.path);
    expect(paths).toEqual(['cells', 'count', 'starts']);
    expect(res.body.detail).toContain('COMPUTE_WORK_BUDGET');
    // Refused from the estimate, not after a solve of seconds (common practice: well under one).
    expect(Date.now() - started).toBeLessThan(1000);
  });

  it("draws a string of a bipolar and a unipolar cell: the spectrum is the cells' closed forms", async () => {
    const bipolar = [0.3, 0.7, 1.1];
    const unipolar = [0.25, 0.9];
    const body = {
      cells: [
        { kind: 'bipolar', vdc: 120, angles: bipolar },
        { kind: 'unipolar', vdc: 80, angles: unipolar },
      ],
      maxOrder: 15,
    };
    const res = await request(t.app)
      .post('/api/v1/cascaded-patterns/waveform')
      .set(auth)
      .send(body);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.cells.map((c: { name: string }) => c.name)).toEqual(['cell 1', 'cell 2']);
    expect(res.body.output.name).toBe('string output');
    // Bipolar: b_n = (−1)^N·(4vdc/(nπ))·[1 + 2Σ(−1)^k cos nα_k] (Patel and Hoft 1973); unipolar:
    // b_n = (4vdc/(nπ))·Σ(−1)^(k+1) cos nα_k (pen and paper from the quarter-wave integral).
    const b = (n: number): number => {
      const sb = bipolar.reduce((s, a, k) => s + (k % 2 === 0 ? -1 : 1) * Math.cos(n * a), 0);
      const su = unipolar.reduce((s, a, k) => s + (k % 2 === 0 ? 1 : -1) * Math.cos(n * a), 0);
      return ((4 * 120) / (n * Math.PI)) * -(1 + 2 * sb) + ((4 * 80) / (n * Math.PI)) * su;
    };
    for (const n of [1, 3, 5, 7, 9, 11, 13, 15]) {
      const answered = sineCoefficient(res.body.spectrum.harmonics[n]);
      expect(Math.abs(answered - b(n)), `order ${n}`).toBeLessThan(1e-9 * 120);
    }
    for (const n of [0, 2, 4, 14]) {
      expect(res.body.spectrum.harmonics[n].amplitude).toBeLessThan(1e-9 * 120);
    }

    const bad = await request(t.app)
      .post('/api/v1/cascaded-patterns/waveform')
      .set(auth)
      .send({ cells: [body.cells[0], { kind: 'unipolar', vdc: 80, angles: [0.9, 0.25] }] });
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe('cells[1].angles[1]');
  });
});

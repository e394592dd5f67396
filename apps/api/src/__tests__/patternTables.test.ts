import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { harmonics, sheWaveform } from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

const SHE = {
  method: 'selective-harmonic-elimination',
  kind: 'bipolar',
  vdc: 300,
  eliminate: [5, 7, 11, 13],
};

describe('programmed patterns to firmware (issue 17)', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
  });
  afterAll(async () => {
    await t.dispose();
  });

  it('runs an optimal-pattern sweep job with progress to a typed result', async () => {
    const created = await request(t.app)
      .post('/api/v1/jobs/optimal-sweeps')
      .set(auth)
      .send({
        kind: 'bipolar',
        vdc: 100,
        count: 3,
        maxOrder: 49,
        fundamental: { from: 40, to: 100, points: 12 },
      });
    expect(created.status, JSON.stringify(created.body)).toBe(202);
    expect(created.body.kind).toBe('optimal-sweep');
    await t.app.services.jobs.idle();
    const job = (await request(t.app).get(`/api/v1/jobs/${created.body.id}`).set(auth)).body;
    expect(job.status, job.error).toBe('succeeded');
    expect(job.progress).toBe(1);
    expect(job.result.points).toHaveLength(12);
    for (const p of job.result.points.filter((q: { converged: boolean }) => q.converged)) {
      // Each optimum meets its fundamental on the exact spectrum (Patel and Hoft 1973 model).
      const v1 =
        harmonics(sheWaveform(p.angles, { kind: 'bipolar', vdc: 100 }), 1)[1]?.amplitude ?? NaN;
      expect(Math.abs(v1 - p.fundamental)).toBeLessThan(1e-9 * p.fundamental);
      expect(p.objective).toBeGreaterThan(0);
    }
    // Chunks follow one family: after the first point, each point continues the one before.
    expect(job.result.points.slice(1).every((p: { continued: boolean }) => p.continued)).toBe(true);
  });

  it('refuses an optimal sweep over the job budget before any work, naming the fields', async () => {
    const res = await request(t.app)
      .post('/api/v1/jobs/optimal-sweeps')
      .set(auth)
      .send({
        kind: 'staircase',
        vdc: 10,
        count: 31,
        maxOrder: 199,
        fundamental: { from: 10, to: 100, points: 400 },
      });
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { path: string }) => e.path)).toContain('fundamental.points');
  });

  it('angle table as JSON: rows eliminate the orders, intervals carry the midpoint errors', async () => {
    const res = await request(t.app)
      .post('/api/v1/angle-tables')
      .set(auth)
      .send({
        pattern: SHE,
        ma: { from: 0.2, to: 0.8 },
        rows: 16,
        timerClock: 72e6,
        fundamentalFrequency: 50,
      });
    expect(res.status, res.text).toBe(200);
    expect(res.headers['content-disposition']).toContain('angle_table.json');
    const { table, midpointErrors, fixedPoint } = res.body;
    expect(table.rows).toHaveLength(16);
    for (const row of table.rows) {
      const spectrum = harmonics(sheWaveform(row.angles, { kind: 'bipolar', vdc: 300 }), 13);
      const v1 = spectrum[1]?.amplitude ?? NaN;
      // Patel and Hoft (1973): the eliminated orders vanish; V₁ = ma·vdc for a bipolar pattern.
      for (const n of [5, 7, 11, 13])
        expect((spectrum[n]?.amplitude ?? NaN) / v1).toBeLessThan(1e-9);
      expect(Math.abs(v1 - row.ma * 300)).toBeLessThan(1e-9 * v1);
    }
    expect(midpointErrors.intervals).toHaveLength(15);
    expect(midpointErrors.worstResidual).toBeGreaterThan(0);
    expect(fixedPoint.ticksPerPeriod).toBe(1_440_000);
  });

  it('angle table for an error target, as a C header that compiles', async () => {
    const res = await request(t.app)
      .post('/api/v1/angle-tables?format=c-header')
      .set(auth)
      .send({
        pattern: SHE,
        ma: { from: 0.2, to: 0.8 },
        target: { metric: 'eliminated-residual', value: 1e-3 },
        maxRows: 64,
        timerClock: 72e6,
        fundamentalFrequency: 50,
        prefix: 'pump',
      });
    expect(res.status, res.text).toBe(200);
    expect(res.headers['content-type']).toContain('text/x-c');
    const dir = mkdtempSync(path.join(tmpdir(), 'angle-header-'));
    try {
      writeFileSync(path.join(dir, 'pump.h'), res.text);
      writeFileSync(
        path.join(dir, 'main.c'),
        '#include "pump.h"\nint main(void) { return (int)PUMP_ROWS - (int)(sizeof pump_ticks / sizeof pump_ticks[0]); }\n',
      );
      execFileSync('cc', [
        '-std=c99',
        '-Wall',
        '-Werror',
        '-o',
        path.join(dir, 'main'),
        path.join(dir, 'main.c'),
      ]);
      execFileSync(path.join(dir, 'main')); // exit status 0: ROWS equals the array's rows
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
    const rows = Number(/#define PUMP_ROWS (\d+)u/.exec(res.text)?.[1]);
    expect(rows).toBeGreaterThan(2);
  });

  it('angle table as CSV', async () => {
    const res = await request(t.app)
      .post('/api/v1/angle-tables?format=csv')
      .set(auth)
      .send({
        pattern: { method: 'optimal-pattern', kind: 'bipolar', vdc: 100, count: 3, maxOrder: 49 },
        ma: { from: 0.4, to: 0.9 },
        rows: 5,
        timerClock: 1e6,
        fundamentalFrequency: 50,
      });
    expect(res.status, res.text).toBe(200);
    expect(res.text.split('\r\n')[0]).toMatch(/^row,ma,solved,continued,angle_1_rad/);
    expect(res.text.trimEnd().split('\r\n')).toHaveLength(6);
  });

  it('bad input is a 400 naming the field', async () => {
    const base = {
      pattern: SHE,
      ma: { from: 0.2, to: 0.8 },
      timerClock: 72e6,
      fundamentalFrequency: 50,
    };
    const cases: [Record<string, unknown>, string][] = [
      // Staircase of 2 cells removing the 3rd has no solution below V₁/(4vdc/π) = √3/2 (pen and paper).
      [
        {
          ...base,
          pattern: { ...SHE, kind: 'staircase', vdc: 10, eliminate: [3] },
          ma: { from: 0.3, to: 0.9 },
          rows: 8,
        },
        'ma.from',
      ],
      [{ ...base, rows: 5000 }, 'rows'],
      [
        { ...base, target: { metric: 'eliminated-residual', value: 1e-9 }, maxRows: 16 },
        'target.value',
      ],
      [{ ...base, ma: { from: 0.2, to: 1.3 } }, 'ma.to'],
      // Refused by the cost model before any work: 1024 rows of a 31-angle optimal pattern.
      [
        {
          ...base,
          pattern: {
            method: 'optimal-pattern',
            kind: 'bipolar',
            vdc: 100,
            count: 31,
            maxOrder: 199,
          },
          rows: 1024,
        },
        'rows',
      ],
    ];
    for (const [body, field] of cases) {
      const res = await request(t.app).post('/api/v1/angle-tables').set(auth).send(body);
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.headers['content-type']).toContain('application/problem+json');
      expect(
        res.body.errors.map((e: { path: string }) =>
          e.path.replace(/^\/body\//, '').replace(/\//g, '.'),
        ),
      ).toContain(field);
    }
  });

  it('compare events of a stored pattern with the dead-time effect', async () => {
    const table = await request(t.app)
      .post('/api/v1/angle-tables')
      .set(auth)
      .send({
        pattern: SHE,
        ma: { from: 0.5, to: 0.6 },
        rows: 2,
        timerClock: 1e6,
        fundamentalFrequency: 50,
      });
    const angles = table.body.table.rows[0].angles;
    const res = await request(t.app)
      .post('/api/v1/pattern-compare-events')
      .set(auth)
      .send({
        pattern: { kind: 'bipolar', vdc: 300, angles },
        fundamentalFrequency: 50,
        timerClock: 1e6,
        deadTime: 2e-6,
        orders: [5, 7, 11, 13],
      });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.devices).toHaveLength(4);
    expect(res.body.deadTimeTicks).toBe(2);
    // Dead time with the current in phase lowers the fundamental (fact of the trade; Murai et al. 1987).
    expect(res.body.deadTimeFundamentalChange).toBeLessThan(0);
    const bad = await request(t.app)
      .post('/api/v1/pattern-compare-events')
      .set(auth)
      .send({
        pattern: { kind: 'bipolar', vdc: 300, angles: [0.5, 0.2] },
        fundamentalFrequency: 50,
        timerClock: 1e6,
      });
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe('pattern.angles[1]');
  });
});

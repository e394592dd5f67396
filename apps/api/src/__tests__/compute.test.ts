import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { modulationVoltages, waveformThd, waveformWthd } from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';
import { SINE_TRIANGLE } from './fixtures.js';

function hasCompiler(): boolean {
  try {
    execFileSync('cc', ['--version'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

describe('compute routes', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
  });
  afterAll(async () => t.dispose());

  it('answers POST /api/v1/spectra with { harmonics, thd, wthd } matching facts of the trade', async () => {
    const res = await request(t.app)
      .post('/api/v1/spectra')
      .set(auth)
      .send({ modulation: SINE_TRIANGLE, maxOrder: 100 });
    expect(res.status).toBe(200);
    expect(Object.keys(res.body).sort()).toEqual([
      'harmonics',
      'name',
      'spectrumThd',
      'thd',
      'wthd',
    ]);
    expect(res.body.name).toBe('bridge output');
    expect(res.body.harmonics).toHaveLength(101);
    // Linear range: fundamental = ma·vdc for a bipolar full bridge (common practice; Holmes and Lipo, 2003, ch. 3).
    expect(res.body.harmonics[1].amplitude).toBeCloseTo(320, 6);
    // Odd mf gives half-wave symmetry: no even harmonics, no DC (common practice).
    for (const h of res.body.harmonics.filter((x: { order: number }) => x.order % 2 === 0))
      expect(h.amplitude).toBeLessThan(1e-9);
    // The first significant harmonics sit at and around mf (common practice).
    const largest = res.body.harmonics
      .slice(2)
      .reduce((a: { amplitude: number }, b: { amplitude: number }) =>
        b.amplitude > a.amplitude ? b : a,
      );
    expect(Math.abs(largest.order - 21)).toBeLessThanOrEqual(2);
    expect(res.body.thd).toBeGreaterThan(0.5);
    // thd and wthd are the whole waveform's (every order), spectrumThd stops at maxOrder.
    const { waveform } = modulationVoltages(SINE_TRIANGLE).phases[0]!;
    expect(res.body.thd).toBe(waveformThd(waveform));
    expect(res.body.wthd).toBe(waveformWthd(waveform));
    expect(res.body.spectrumThd).toBeLessThan(res.body.thd);
  });

  it('computes a three-phase line-to-line spectrum, where triplen carrier sidebands cancel', async () => {
    const res = await request(t.app)
      .post('/api/v1/spectra')
      .set(auth)
      .send({ modulation: { method: 'three-phase', ma: 0.8, mf: 21, vdc: 600 }, maxOrder: 60 });
    expect(res.status).toBe(200);
    // Line-to-line fundamental = (√3/2)·ma·vdc in the linear range (Holmes and Lipo, 2003, ch. 5).
    expect(res.body.harmonics[1].amplitude).toBeCloseTo((Math.sqrt(3) / 2) * 0.8 * 600, 6);
    // The carrier harmonic at mf = 21 (a multiple of 3) is common to all legs and cancels.
    expect(res.body.harmonics[21].amplitude).toBeLessThan(1e-9);
    expect(res.body.name).toBe('line a−b');
    // The phase to star point of a balanced star load carries 1/√3 of it (standard circuit analysis).
    const phase = await request(t.app)
      .post('/api/v1/spectra')
      .set(auth)
      .send({
        modulation: { method: 'three-phase', ma: 0.8, mf: 21, vdc: 600 },
        maxOrder: 10,
        output: 'phase',
      });
    expect(phase.body.name).toBe('phase a to star point');
    expect(phase.body.harmonics[1].amplitude).toBeCloseTo(0.8 * 300, 6);
  });

  it('downloads timer tables as JSON, CSV and a C header with the right type and file name', async () => {
    const body = {
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.8 },
      fundamentalFrequency: 50,
      carrierFrequency: 10000,
      timerClock: 72_000_000,
      countingMode: 'centre-aligned',
      deadTime: 1e-6,
      prefix: 'pump_pwm',
    };
    const expected = {
      json: [/^application\/json/, 'pump_pwm.json'],
      csv: [/^text\/csv/, 'pump_pwm.csv'],
      'c-header': [/^text\/x-c/, 'pump_pwm.h'],
    } as const;
    for (const [format, [type, file]] of Object.entries(expected)) {
      const res = await request(t.app)
        .post('/api/v1/timer-tables')
        .query({ format })
        .set(auth)
        .send(body)
        .buffer(true);
      expect(res.status, res.text).toBe(200);
      expect(res.headers['content-type']).toMatch(type);
      expect(res.headers['content-disposition']).toBe(`attachment; filename="${file}"`);
      if (format === 'json') expect(JSON.parse(res.text).periodRegister).toBe(3600); // 72 MHz / (2·10 kHz)
      if (format === 'c-header') {
        expect(res.text).toContain('#include <stdint.h>');
        if (hasCompiler()) {
          const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-h-'));
          writeFileSync(path.join(dir, 'pump_pwm.h'), res.text);
          writeFileSync(
            path.join(dir, 'main.c'),
            '#include "pump_pwm.h"\nint main(void) { return 0; }\n',
          );
          execFileSync('cc', [
            '-std=c99',
            '-Wall',
            '-Werror',
            '-fsyntax-only',
            path.join(dir, 'main.c'),
          ]);
        }
      }
    }
  });

  it('checks against IEEE Std 519-2022 limits marked as recalled from memory', async () => {
    const res = await request(t.app)
      .post('/api/v1/harmonic-limits/check')
      .set(auth)
      .send({
        design: {
          vdc: 400,
          fundamentalFrequency: 50,
          carrierFrequency: 750,
          modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.9 },
        },
        busVoltage: 400,
      });
    expect(res.status).toBe(200);
    // IEEE Std 519-2022 Table 1, bus ≤ 1 kV: individual 5 %, THD 8 % (from memory).
    expect(res.body.standard).toMatchObject({
      name: 'IEEE Std 519',
      edition: '2022',
      recalledFromMemory: true,
      maxOrder: 50,
    });
    expect(res.body.limits).toMatchObject({ individual: 0.05, thd: 0.08, maxOrder: 50 });
    expect(res.body.busVoltage).toBe(400);
    expect(res.body.caution).toContain('confirm them with the standard and the local utility');
    expect(res.body.table).toHaveLength(49);
    // Unfiltered two-level PWM at mf 15 has large sidebands below the 50th order: it fails.
    expect(res.body.pass).toBe(false);
    expect(res.body.violations.map((v: { order: unknown }) => v.order)).toEqual(
      expect.arrayContaining(['thd-whole-waveform', 'thd', 15]),
    );
  });

  it('runs an ma sweep as a job with progress and a result', async () => {
    const created = await request(t.app)
      .post('/api/v1/jobs/ma-sweeps')
      .set(auth)
      .send({
        modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.5, mf: 21, vdc: 100 },
        ma: { from: 0.1, to: 1, points: 40 },
        maxOrder: 60,
        orders: [1],
      });
    expect(created.status).toBe(202);
    expect(created.body.status).toBe('running');
    expect(created.body.progress).toBeGreaterThan(0);
    expect(created.body.progress).toBeLessThan(1);
    const seen: number[] = [];
    for (let i = 0; i < 200; i++) {
      const job = (await request(t.app).get(`/api/v1/jobs/${created.body.id}`).set(auth)).body;
      seen.push(job.progress);
      if (job.status !== 'running') break;
    }
    await t.app.services.jobs.idle();
    const job = (await request(t.app).get(`/api/v1/jobs/${created.body.id}`).set(auth)).body;
    expect(job.status).toBe('succeeded');
    expect(job.progress).toBe(1);
    for (let i = 1; i < seen.length; i++)
      expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1] as number);
    expect(job.result.ma).toHaveLength(40);
    // The voltage analysed is named as the library names it (docs/methods.md glossary).
    expect(job.result.voltage).toBe('bridge output');
    expect(job.result.ma[0]).toBeCloseTo(0.1, 12);
    expect(job.result.ma[39]).toBeCloseTo(1, 12);
    // Linear range: fundamental = ma·vdc at every point (Holmes and Lipo, 2003, ch. 3).
    job.result.ma.forEach((ma: number, k: number) =>
      expect(job.result.fundamental[k]).toBeCloseTo(ma * 100, 6),
    );
    // THD and WTHD at every point are the whole waveform's, as the design report gives them;
    // spectrumThd stops at maxOrder 60 and so holds less.
    job.result.ma.forEach((ma: number, k: number) => {
      const { waveform } = modulationVoltages({
        method: 'sine-triangle',
        scheme: 'unipolar',
        ma,
        mf: 21,
        vdc: 100,
      }).phases[0]!;
      expect(job.result.thd[k]).toBe(waveformThd(waveform));
      expect(job.result.wthd[k]).toBe(waveformWthd(waveform));
      expect(job.result.spectrumThd[k]).toBeLessThanOrEqual(job.result.thd[k] * (1 + 1e-12));
    });
    const listed = (await request(t.app).get('/api/v1/jobs').set(auth)).body;
    expect(listed.some((j: { id: string }) => j.id === job.id)).toBe(true);
  });

  it("names the line voltage a three-phase ma sweep reads, and its fundamental is the line's", async () => {
    const created = await request(t.app)
      .post('/api/v1/jobs/ma-sweeps')
      .set(auth)
      .send({
        modulation: { method: 'three-phase', ma: 0.5, mf: 21, vdc: 600 },
        ma: { from: 0.2, to: 1, points: 9 },
        maxOrder: 60,
      });
    expect(created.status, JSON.stringify(created.body)).toBe(202);
    await t.app.services.jobs.idle();
    const job = (await request(t.app).get(`/api/v1/jobs/${created.body.id}`).set(auth)).body;
    expect(job.status).toBe('succeeded');
    expect(job.result.voltage).toBe('line a−b');
    // Linear range of sinusoidal PWM: the line-to-line fundamental is √3·ma·vdc/2 (Holmes and
    // Lipo, 2003, ch. 5), √3 times the phase's.
    job.result.ma.forEach((ma: number, k: number) =>
      expect(job.result.fundamental[k]).toBeCloseTo((Math.sqrt(3) * ma * 600) / 2, 6),
    );
  });

  it('runs a SHE sweep whose solutions are ordered first-quarter angles', async () => {
    const created = await request(t.app)
      .post('/api/v1/jobs/she-sweeps')
      .set(auth)
      .send({
        kind: 'bipolar',
        vdc: 100,
        count: 3,
        eliminate: [3, 5],
        fundamental: { from: 30, to: 90, points: 25 },
      });
    expect(created.status, JSON.stringify(created.body)).toBe(202);
    await t.app.services.jobs.idle();
    const job = (await request(t.app).get(`/api/v1/jobs/${created.body.id}`).set(auth)).body;
    expect(job.status).toBe('succeeded');
    expect(job.result.points).toHaveLength(25);
    const solved = job.result.points.filter((p: { converged: boolean }) => p.converged);
    expect(solved.length).toBeGreaterThan(0);
    for (const p of solved) {
      expect(p.angles).toHaveLength(3);
      for (let i = 0; i < 3; i++) {
        expect(p.angles[i]).toBeGreaterThan(i === 0 ? 0 : p.angles[i - 1]);
        expect(p.angles[i]).toBeLessThan(Math.PI / 2);
      }
    }
  });

  it('refuses a SHE sweep the library rejects with 400, creating no job', async () => {
    const before = await t.app.services.models.Job.count();
    const res = await request(t.app)
      .post('/api/v1/jobs/she-sweeps')
      .set(auth)
      .send({
        kind: 'bipolar',
        vdc: 100,
        count: 3,
        eliminate: [3],
        fundamental: { from: 30, to: 90, points: 5 },
      });
    expect(res.status).toBe(400);
    expect(res.body.detail).toContain('eliminate');
    expect(await t.app.services.models.Job.count()).toBe(before);
  });

  it('serves the OpenAPI document and the docs page', async () => {
    const spec = await request(t.app).get('/api/openapi.json');
    expect(spec.body.openapi).toBe('3.1.0');
    expect(spec.body.paths['/api/v1/spectra']).toBeDefined();
    const docs = await request(t.app).get('/api/docs/');
    expect(docs.status).toBe(200);
    expect(docs.text).toContain('swagger');
    const page = await request(t.app).get('/some/dashboard/route');
    expect(page.status).toBe(200);
    expect(page.text).toContain('dashboard is not built');
  });
});

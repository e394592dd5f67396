import { EXAMPLE_IGBT, lossesByPowerFactor, type IgbtDevice } from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

// An invented device (not from any real part).
const igbt: IgbtDevice = { ...EXAMPLE_IGBT };
const body = { device: igbt, vdc: 650, ma: 0.9, peakCurrent: 28, switchingFrequency: 10_000 };

describe('POST /api/v1/losses/power-factor-sweeps', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
  });
  afterAll(async () => t.dispose());

  it('answers the library’s sweep, every zero sequence at 100 angles by default', async () => {
    const res = await request(t.app)
      .post('/api/v1/losses/power-factor-sweeps')
      .set(auth)
      .send(body);
    expect(res.status).toBe(200);
    expect(res.body).toEqual(lossesByPowerFactor(body));
    expect(res.body.series).toHaveLength(11);
    // DPWM1 at unity power factor switches half as much as continuous PWM (Hava, Kerkman and
    // Lipo 1998; from memory): the 100 default angles straddle 0, so read the nearest pair.
    const none = res.body.series[0];
    const dpwm1 = res.body.series.find((s: { zeroSequence: string }) => s.zeroSequence === 'dpwm1');
    expect(dpwm1.switching[49] / none.switching[49]).toBeCloseTo(0.5, 1);
  });

  it('at equal average switching frequency runs the clamps 1.5× faster', async () => {
    const res = await request(t.app)
      .post('/api/v1/losses/power-factor-sweeps')
      .set(auth)
      .send({ ...body, angles: [0], zeroSequences: ['none', 'dpwm1'], basis: 'equal-switching' });
    expect(res.status).toBe(200);
    expect(res.body.series[1].carrierFrequency).toBeCloseTo(15_000, 6);
  });

  it('answers bad input with a 400 naming the field, and refuses expensive work before it starts', async () => {
    const bad = await request(t.app)
      .post('/api/v1/losses/power-factor-sweeps')
      .set(auth)
      .send({ ...body, angles: [0, 4] });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain('angles');
    const unknown = await request(t.app)
      .post('/api/v1/losses/power-factor-sweeps')
      .set(auth)
      .send({ ...body, zeroSequences: ['dpwm7'] });
    expect(unknown.status).toBe(400);
    const heavy = await request(t.app)
      .post('/api/v1/losses/power-factor-sweeps')
      .set(auth)
      .send({ ...body, switchingFrequency: 200_000, points: 1000 });
    expect(heavy.status).toBe(400);
    expect(heavy.body.detail ?? JSON.stringify(heavy.body)).toMatch(
      /points and zeroSequences and switchingFrequency/,
    );
  });

  it('names a bad device energy, not the sweep’s size, and never prices work at Infinity (fuzz finding)', async () => {
    // The fuzzer's request (tests/robustness/fuzz.test.ts): eon 1e308 J, far past any part (some
    // 10 J a pulse for the largest modules, from memory), with a fundamental of 4.4e-323 Hz that
    // asks for ~1e331 carrier periods; the cost model answered 'points … ask for Infinity units'.
    const res = await request(t.app)
      .post('/api/v1/losses/power-factor-sweeps')
      .set(auth)
      .send({
        ...body,
        device: { ...igbt, eon: 1e308 },
        switchingFrequency: 100_000_000,
        fundamentalFrequency: 4.4e-323,
      });
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { path: string }) => e.path)).toEqual(['device.eon']);
    expect(res.body.detail).toMatch(/^device\.eon must be/);
    // With a good device the tiny fundamental itself is named, with the sweep's limit (the ratio
    // does overflow to Infinity; the cost model never sees it).
    const tiny = await request(t.app)
      .post('/api/v1/losses/power-factor-sweeps')
      .set(auth)
      .send({ ...body, fundamentalFrequency: 4.4e-323 });
    expect(tiny.status).toBe(400);
    expect(tiny.body.errors[0].path).toBe('switchingFrequency/fundamentalFrequency');
    expect(tiny.body.detail).toMatch(/at most 5000 carrier periods/);
    expect(tiny.body.detail).not.toMatch(/units of work/);
  });
});

import { compensateDeadTime, timerTable, type TimerTableOptions } from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

const options: TimerTableOptions = {
  modulation: { method: 'three-phase', zeroSequence: 'dpwm1', ma: 0.9 },
  fundamentalFrequency: 50,
  carrierFrequency: 5000,
  timerClock: 16_000_000,
  deadTime: 1e-6,
  vdc: 650,
};

describe('POST /api/v1/timer-tables with deadTimeCompensation (Murai et al. 1987)', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
  });
  afterAll(async () => t.dispose());

  it('answers the library’s corrected table: compare values moved by the dead time, clamps kept', async () => {
    const res = await request(t.app)
      .post('/api/v1/timer-tables')
      .set(auth)
      .send({ ...options, deadTimeCompensation: { predictedCurrentAngle: 0.4 } });
    expect(res.status).toBe(200);
    const body = JSON.parse(res.text);
    const expected = compensateDeadTime(timerTable(options), { predictedCurrentAngle: 0.4 }).table;
    expect(body.channels.map((c: { compare: number[] }) => c.compare)).toEqual(
      expected.channels.map((c) => c.compare),
    );
    const plain = timerTable(options);
    // 16 ticks of dead time, centre-aligned: 8 counts either way (a count is two ticks of pulse).
    const moved = body.channels[0].compare.map(
      (c: number, i: number) => c - plain.channels[0]!.compare[i]!,
    );
    expect(new Set(moved)).toEqual(new Set([8, -8, 0]));
    expect(JSON.stringify(body.warnings)).toContain('corrected for dead time');
  });

  it('the C header carries the corrected values too, and a bad angle is a 400 naming the field', async () => {
    const header = await request(t.app)
      .post('/api/v1/timer-tables')
      .query({ format: 'c-header' })
      .set(auth)
      .send({ ...options, deadTimeCompensation: {} });
    expect(header.status).toBe(200);
    const first = compensateDeadTime(timerTable(options)).table.channels[0]!.highSide;
    expect(header.text).toContain(
      first
        .slice(0, 8)
        .map((v) => `${v}u`)
        .join(', '),
    );
    const bad = await request(t.app)
      .post('/api/v1/timer-tables')
      .set(auth)
      .send({ ...options, deadTimeCompensation: { predictedCurrentAngle: 9 } });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain('predictedCurrentAngle');
  });
});

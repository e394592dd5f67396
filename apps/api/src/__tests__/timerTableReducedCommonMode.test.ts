import { timerTable, timerTableToCsv, type TimerTableOptions } from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

// The reduced common-mode methods (A. M. Hava and E. Ün, IEEE Trans. Power Electronics, 2009):
// the middle phase's entries compare with the inverted carrier (sense 'above'). The library
// checks the table against its own threePhase and the common mode; here: the route serves the
// library's table in every format, the sense included, and refuses a timer that cannot run it.
const options: TimerTableOptions = {
  modulation: { method: 'three-phase', zeroSequence: 'azspwm1', ma: 0.9 },
  fundamentalFrequency: 50,
  carrierFrequency: 5000,
  timerClock: 16_000_000,
  deadTime: 1e-6,
  vdc: 650,
};

describe('POST /api/v1/timer-tables for azspwm1 and nspwm', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
  });
  afterAll(async () => t.dispose());

  it('answers the library’s table with its compare senses, as JSON, CSV and a C header', async () => {
    for (const zeroSequence of ['azspwm1', 'nspwm'] as const) {
      const body = { ...options, modulation: { ...options.modulation, zeroSequence } };
      const expected = timerTable(body);
      const json = await request(t.app).post('/api/v1/timer-tables').set(auth).send(body);
      expect(json.status, json.text.slice(0, 300)).toBe(200);
      const table = JSON.parse(json.text) as typeof expected;
      expect(table.channels.map((c) => c.sense)).toEqual(expected.channels.map((c) => c.sense));
      expect(table.channels[1]?.sense).toContain('above');
      expect(table.parameters.deadTimeMethod).toBe('dead-time-register');
      const csv = await request(t.app)
        .post('/api/v1/timer-tables')
        .query({ format: 'csv' })
        .set(auth)
        .send(body)
        .buffer(true);
      expect(csv.text).toBe(timerTableToCsv(expected));
      const header = await request(t.app)
        .post('/api/v1/timer-tables')
        .query({ format: 'c-header' })
        .set(auth)
        .send(body)
        .buffer(true);
      expect(header.text).toContain('static const uint8_t pwm_table_c_above[PWM_TABLE_LENGTH]');
    }
  });

  it('refuses symmetric sampling and compare-offset dead time with a 400 naming the field', async () => {
    for (const [change, field] of [
      [{ sampling: 'regular-symmetric' }, 'sampling'],
      [{ deadTimeMethod: 'compare-offset' }, 'deadTimeMethod'],
      [{ countingMode: 'edge-aligned' }, 'countingMode'],
    ] as const) {
      const res = await request(t.app)
        .post('/api/v1/timer-tables')
        .set(auth)
        .send({ ...options, ...change });
      expect(res.status, res.text).toBe(400);
      expect(res.headers['content-type']).toMatch(/problem\+json/);
      expect(JSON.stringify(res.body)).toContain(`${field} must be`);
    }
  });
});

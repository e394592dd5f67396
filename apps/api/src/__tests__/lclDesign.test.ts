import { designLclFilter } from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

// The route adds no arithmetic: its answer is the library's designLclFilter (whose steps are
// checked in packages/modulation against Liserre, Blaabjerg and Hansen 2005, from memory).
const RATED = {
  power: 10_000,
  lineVoltage: 400,
  gridFrequency: 50,
  switchingFrequency: 10_000,
  vdc: 700,
};

describe('POST /filters/lcl-design', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
  });
  afterAll(async () => t.dispose());

  it("answers the library's LCL filter, with the document's defaults filled in", async () => {
    const res = await request(t.app).post('/api/v1/filters/lcl-design').set(auth).send(RATED);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual(
      designLclFilter({ ...RATED, rippleRatio: 0.1, capacitorRatio: 0.05, attenuation: 0.2 }),
    );
    // C = 5 % of 1/(2π·50·16 Ω) (Z_b = 400²/10 kW): hand-worked.
    expect(Math.abs(res.body.c / 9.947e-6 - 1)).toBeLessThan(1e-3);
  });

  it('refuses a switching frequency within 10× the grid frequency, naming it', async () => {
    const res = await request(t.app)
      .post('/api/v1/filters/lcl-design')
      .set(auth)
      .send({ ...RATED, switchingFrequency: 400 });
    expect(res.status).toBe(400);
    expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
    const item = (res.body.errors as { path: string; message: string }[])[0]!;
    expect(item.path).toBe('switchingFrequency');
    expect(item.message).toContain('> 500');
  });
});

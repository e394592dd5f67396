import { analyseDesign, EXAMPLE_IGBT, type InverterDesign } from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

/**
 * A design with a device (issue 12): the report's losses by device reach the client as the
 * library computed them (the service adds no arithmetic), a stored study keeps its device, and a
 * device value out of range is a 400 naming the field by its path in the design.
 */
const DESIGN: InverterDesign = {
  vdc: 650,
  fundamentalFrequency: 50,
  carrierFrequency: 4950,
  modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'dpwm1' },
  load: { r: 8, l: 0.01 },
  device: { ...EXAMPLE_IGBT },
};

describe('design losses through the service', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
  });
  afterAll(async () => t.dispose());

  it('POST /designs/report and a saved study give the library’s losses', async () => {
    const expected = analyseDesign(DESIGN, { points: 64 }).losses;
    expect(expected).not.toBeNull();
    const res = await request(t.app)
      .post('/api/v1/designs/report')
      .set(auth)
      .send({ design: DESIGN, points: 64 });
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(200);
    // JSON keeps every double: the same numbers exactly.
    expect(res.body.losses).toEqual(expected);

    const projectId = (
      await request(t.app).post('/api/v1/projects').set(auth).send({ name: 'Losses' })
    ).body.id as string;
    const created = await request(t.app)
      .post('/api/v1/studies')
      .set(auth)
      .send({ projectId, name: 'DPWM1 with a device', design: DESIGN });
    expect(created.status, JSON.stringify(created.body).slice(0, 400)).toBe(201);
    const stored = await request(t.app)
      .get(`/api/v1/studies/${created.body.id as string}/report`)
      .query({ points: 64 })
      .set(auth);
    expect(stored.status).toBe(200);
    expect(stored.body.losses).toEqual(expected);
  });

  it('a device value out of range is a 400 naming design.device.<field>', async () => {
    const res = await request(t.app)
      .post('/api/v1/designs/report')
      .set(auth)
      .send({ design: { ...DESIGN, device: { ...EXAMPLE_IGBT, eon: -1 } } });
    expect(res.status).toBe(400);
    expect(res.headers['content-type']).toContain('application/problem+json');
    // The device's kind picks its schema, so the bad value is named alone.
    expect(res.body.errors).toEqual([
      { path: 'design.device.eon', message: expect.stringContaining('≥ 0') as unknown },
    ]);
  });
});

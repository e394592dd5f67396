import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

// The largest fundamental of a bipolar quarter-wave pattern is 4·vdc/π, the square wave's
// (Patel and Hoft, IEEE Trans. Ind. Appl., 1973; the Fourier series of a square wave): 127.32 V
// for vdc = 100. Each request below has a first chunk inside that limit and a last range end
// past it, so only a check of the whole request refuses it before a job exists.
const LIMIT = (4 * 100) / Math.PI;

describe('sweep jobs: the whole request checked before the job is queued (issue 17)', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
  });
  afterAll(async () => {
    await t.dispose();
  });

  const cases = [
    {
      route: '/api/v1/jobs/optimal-sweeps',
      // Chunks of 5 points: with 40 points the first ends at 40 + 160·4/39 ≈ 56 V, inside the limit.
      body: { kind: 'bipolar', vdc: 100, count: 3, maxOrder: 49 },
    },
    {
      route: '/api/v1/jobs/she-sweeps',
      // Chunks of 10 points: with 40 points the first ends at 40 + 160·9/39 ≈ 77 V, inside the limit.
      body: { kind: 'bipolar', vdc: 100, count: 3, eliminate: [5, 7] },
    },
  ];

  for (const { route, body } of cases) {
    it(`${route}: fundamental.to above 4·vdc/π is a 400 naming it and its range, no job stored`, async () => {
      const before = await t.app.services.models.Job.count();
      const res = await request(t.app)
        .post(route)
        .set(auth)
        .send({ ...body, fundamental: { from: 40, to: 200, points: 40 } });
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.errors[0].path).toBe('fundamental.to');
      expect(res.body.detail).toContain('fundamental.to must be');
      // The allowed range names the limit to 5 significant figures at least (127.32 V).
      expect(res.body.detail).toContain(LIMIT.toPrecision(5));
      expect(await t.app.services.models.Job.count()).toBe(before);
    });

    it(`${route}: a bad initialAngles is named as the request names it`, async () => {
      const res = await request(t.app)
        .post(route)
        .set(auth)
        .send({
          ...body,
          fundamental: { from: 40, to: 100, points: 3 },
          initialAngles: [0.3, 0.2, 0.4],
        });
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.errors[0].path).toBe('initialAngles[1]');
    });
  }
});

import {
  designCarrierSpan,
  designSpanSpectrum,
  type InverterDesign,
  type RationalRatio,
} from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

/**
 * A study whose carrier is no whole multiple of the fundamental (issue 12 item 5): its predicted
 * spectrum spans q fundamental periods (components at every n/q), and a bench capture is compared
 * with it at whole orders, the components between them named rather than dropped silently.
 */

// Bipolar sine-triangle, 400 V, 50 Hz, a 1025 Hz carrier: mf 41/2, a two-period span.
const halfRatio: InverterDesign = {
  vdc: 400,
  fundamentalFrequency: 50,
  carrierFrequency: 1025,
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.25 },
};
// A drive with a fixed 4 kHz carrier at 37 Hz: mf 4000/37.
const drive: InverterDesign = {
  vdc: 560,
  fundamentalFrequency: 37,
  carrierFrequency: 4000,
  modulation: { method: 'three-phase', ma: 0.7, zeroSequence: 'none' },
};

describe('a study whose carrier spans several fundamental periods', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  let projectId: string;
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
    projectId = (await request(t.app).post('/api/v1/projects').set(auth).send({ name: 'Spans' }))
      .body.id;
  });
  afterAll(async () => t.dispose());

  const createStudy = async (name: string, design: InverterDesign): Promise<string> => {
    const res = await request(t.app)
      .post('/api/v1/studies')
      .set(auth)
      .send({ projectId, name, design });
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(201);
    return res.body.id as string;
  };

  it('GET /studies/{id}/spectrum gives every n/q component of the span, the library’s numbers', async () => {
    const studyId = await createStudy('Carrier at 41/2', halfRatio);
    const res = await request(t.app)
      .get(`/api/v1/studies/${studyId}/spectrum`)
      .query({ maxOrder: 60 })
      .set(auth);
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(200);
    expect(res.body.carrierSpan).toMatchObject({ p: 41, q: 2, baseFrequency: 25 });
    expect(res.body.harmonics).toHaveLength(2 * 60 + 1);
    expect(res.body.harmonics[1].order).toBe(0.5);
    // Naturally sampled bipolar sine-triangle in the linear range: fundamental ma·vdc = 100 V
    // (Holmes and Lipo, 2003, ch. 3; the sidebands that could land on order 1, m = 2k with
    // n = 1 − 41k, carry J_40(π·0.25) and smaller: far below rounding).
    expect(Math.abs(res.body.harmonics[2].amplitude - 100)).toBeLessThan(1e-9);
    // The carrier itself at 41/2 = 20.5: the largest component of the first carrier group.
    const carrier = res.body.harmonics[41];
    expect(carrier.order).toBe(20.5);
    // The route adds no arithmetic: the library's spectrum, number for number.
    const span = designCarrierSpan(halfRatio) as RationalRatio;
    const expected = designSpanSpectrum(halfRatio, span, { maxOrder: 60 });
    expect(res.body.thd).toBe(expected.thd);
    expect(res.body.harmonics.map((h: { amplitude: number }) => h.amplitude)).toEqual(
      expected.harmonics.map((h) => h.amplitude),
    );
    const csv = await request(t.app)
      .get(`/api/v1/studies/${studyId}/spectrum`)
      .query({ maxOrder: 60, format: 'csv' })
      .set({ ...auth, Accept: 'text/csv' });
    expect(csv.status).toBe(200);
    expect(csv.text.trim().split('\n')[2]).toMatch(/^0\.5,/);
  });

  it('a span spectrum beyond its cost bound is refused before any work, naming maxOrder', async () => {
    // 4000/37: q·maxOrder components each summed over about 4p edges, p·q·maxOrder ≤ 2e7, so
    // maxOrder ≤ 135.
    const studyId = await createStudy('Fixed carrier at 37 Hz', drive);
    const res = await request(t.app)
      .get(`/api/v1/studies/${studyId}/spectrum`)
      .query({ maxOrder: 1000 })
      .set(auth);
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(400);
    expect(res.body.errors[0].path).toBe('maxOrder');
  });

  it('a capture is compared with a span study at whole orders, the sub- and inter-harmonics named', async () => {
    // A 100 V, 50 Hz sine sampled at 10 kHz over 10 periods: what the study predicts at order 1.
    const lines = ['t,v'];
    for (let k = 0; k < 2000; k++)
      lines.push(
        `${(k / 10000).toFixed(6)},${(100 * Math.sin(2 * Math.PI * 50 * (k / 10000))).toFixed(6)}`,
      );
    const captureId = (
      await request(t.app)
        .post('/api/v1/captures')
        .set(auth)
        .attach('file', Buffer.from(lines.join('\n')), 'sine.csv')
    ).body.id;
    const studyId = await createStudy('Carrier at 41/2, bench', halfRatio);
    const comparison = await request(t.app)
      .post(`/api/v1/captures/${captureId}/comparison`)
      .set(auth)
      .send({ studyId, fundamentalFrequency: 50, maxOrder: 30 });
    expect(comparison.status, JSON.stringify(comparison.body).slice(0, 400)).toBe(200);
    const byOrder = (n: number) =>
      comparison.body.orders.find((o: { order: number }) => o.order === n);
    // Order 1 predicted ma·vdc = 100 V (as above), measured 100 V: ratio 1.
    expect(Math.abs(byOrder(1).predicted - 100)).toBeLessThan(1e-9);
    expect(Math.abs(byOrder(1).ratio - 1)).toBeLessThan(1e-3);
    // The first carrier group (20.5 + n, n whole) lies wholly between whole orders; whole order
    // 21 is read from the span's prediction at span order 42.
    const spectrum = await request(t.app)
      .get(`/api/v1/studies/${studyId}/spectrum`)
      .query({ maxOrder: 30 })
      .set(auth);
    const predicted = spectrum.body.harmonics as { order: number; amplitude: number }[];
    expect(byOrder(21).predicted).toBe(predicted[42]?.amplitude);
    // What lies between whole orders: the RMS sum of the half orders over the fundamental (the
    // first carrier group among them, so well above 10 %).
    let between = 0;
    for (const h of predicted) if (!Number.isInteger(h.order)) between += h.amplitude ** 2;
    expect(comparison.body.uncomparedDistortion).toBeCloseTo(Math.sqrt(between) / 100, 12);
    expect(comparison.body.uncomparedDistortion).toBeGreaterThan(0.1);
    expect(comparison.body.warnings.join(' ')).toMatch(
      /repeats every 2 fundamental periods .* not compared/,
    );
  });
});

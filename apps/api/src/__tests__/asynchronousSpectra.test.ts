import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SINE_TRIANGLE_DESIGN, THREE_PHASE_DESIGN } from './fixtures.js';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

const ROUTE = '/api/v1/designs/asynchronous-spectra';

interface Component {
  order: number;
  spanOrder: number;
  label: string;
  amplitude: number;
}
interface Spectrum {
  fundamental: number;
  thd: number;
  wthd: number;
  components: Component[];
}
interface Figures {
  name: string;
  fundamental: number;
  thd: number;
  wthd: number;
  spectrum: { amplitude: number }[];
}

/** Bessel function of the first kind J_n(x) by its power series (a fact of analysis; x ≤ 15 here). */
function besselJ(n: number, x: number): number {
  let term = (x / 2) ** n;
  for (let k = 1; k <= n; k++) term /= k;
  let sum = term;
  for (let k = 1; k < 200; k++) {
    term *= -((x / 2) ** 2) / (k * (k + n));
    sum += term;
  }
  return sum;
}

describe('POST /api/v1/designs/asynchronous-spectra', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
  });
  afterAll(async () => t.dispose());

  for (const design of [SINE_TRIANGLE_DESIGN, THREE_PHASE_DESIGN]) {
    it(`a whole ratio (q = 1) answers /designs/report's figures: ${design.modulation.method}`, async () => {
      const mine = await request(t.app).post(ROUTE).set(auth).send({ design, maxOrder: 50 });
      const report = await request(t.app)
        .post('/api/v1/designs/report')
        .set(auth)
        .send({ design, maxOrder: 50, points: 64 });
      expect(mine.status).toBe(200);
      expect(report.status).toBe(200);
      expect(mine.body).toMatchObject({ q: 1, carrierError: 0 });
      expect(mine.body.p).toBe(design.carrierFrequency / design.fundamentalFrequency);
      const pairs: [{ name: string; spectrum: Spectrum } | undefined, Figures | null][] = [
        [mine.body.voltages[0], report.body.bridge],
        [mine.body.voltages[2], report.body.lineToLine],
      ];
      for (const [voltage, figures] of pairs) {
        if (!figures) continue;
        expect(voltage?.name).toBe(figures.name);
        const spectrum = voltage!.spectrum;
        expect(Math.abs(spectrum.fundamental - figures.fundamental)).toBeLessThan(1e-9);
        expect(Math.abs(spectrum.thd - figures.thd)).toBeLessThan(1e-12);
        expect(Math.abs(spectrum.wthd - figures.wthd)).toBeLessThan(1e-12);
        expect(spectrum.components).toHaveLength(51);
        figures.spectrum.forEach((h, n) => {
          expect(Math.abs(spectrum.components[n]!.amplitude - h.amplitude)).toBeLessThan(1e-9);
        });
      }
    });
  }

  it('a 7/3 ratio spans 3 periods and shows the 1/3 sub-harmonic of the double Fourier series (Black 1953; Holmes and Lipo 2003, ch. 3)', async () => {
    const vdc = 400;
    const ma = 0.5;
    const design = {
      vdc,
      fundamentalFrequency: 30,
      carrierFrequency: 70,
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma },
    };
    const res = await request(t.app).post(ROUTE).set(auth).send({ design, maxOrder: 10 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ p: 7, q: 3, baseFrequency: 10 });
    expect(Math.abs(res.body.carrierError)).toBeLessThan(1e-9);
    expect(res.body.voltages).toHaveLength(1);
    const spectrum: Spectrum = res.body.voltages[0].spectrum;
    expect(spectrum.components).toHaveLength(31);
    const third = spectrum.components[1]!;
    expect(third).toMatchObject({ spanOrder: 1, label: '1/3' });
    expect(third.order).toBeCloseTo(1 / 3, 12);
    // Naturally sampled two-level output ±vdc: the baseband is ma·vdc at order 1 and the
    // component at m·mf + n has amplitude (4·vdc/(mπ))·|J_n(mπ·ma/2)·sin((m + n)π/2)|. At mf = 7/3
    // the pairs with 7m + 3n = ±k fall on order k/3; their phasors add, so each amplitude lies
    // within its main term ± the sum of the others.
    const term = (m: number, n: number) =>
      ((4 * vdc) / (m * Math.PI)) *
      Math.abs(besselJ(Math.abs(n), (m * Math.PI * ma) / 2) * Math.sin(((m + n) * Math.PI) / 2));
    const carrierTerms = (k: number) => {
      const found: number[] = [];
      for (let m = 1; m <= 12; m++) {
        for (const target of [k, -k]) {
          const n = (target - 7 * m) / 3;
          if (Number.isInteger(n)) found.push(term(m, n));
        }
      }
      return found;
    };
    // Order 1/3: the main term is m = 1, n = −2.
    const main = term(1, -2);
    const rest = carrierTerms(1).reduce((sum, a) => sum + a, 0) - main;
    expect(rest).toBeLessThan(0.05 * main);
    expect(third.amplitude).toBeGreaterThan(main - rest - 1e-9);
    expect(third.amplitude).toBeLessThan(main + rest + 1e-9);
    // Order 1: the baseband ma·vdc, moved by the carrier terms that beat onto it at this low mf
    // (m = 3, n = −6 the largest), which a whole mf would not put there.
    const beat = carrierTerms(3).reduce((sum, a) => sum + a, 0);
    expect(beat).toBeGreaterThan(1e-3 * ma * vdc);
    expect(Math.abs(spectrum.fundamental - ma * vdc)).toBeLessThan(beat + 1e-9);
  });

  it('a fixed carrier that is no fraction with q ≤ 64 is analysed at the nearest one, its error stated in hertz', async () => {
    const design = { ...THREE_PHASE_DESIGN, fundamentalFrequency: 37.3, carrierFrequency: 2000 };
    const res = await request(t.app).post(ROUTE).set(auth).send({ design, maxOrder: 5 });
    expect(res.status).toBe(200);
    const { p, q, carrierError, carrierFrequency } = res.body;
    expect(q).toBeGreaterThan(1);
    expect(q).toBeLessThanOrEqual(64);
    expect(Math.abs(carrierFrequency - (p / q) * 37.3)).toBeLessThan(1e-9);
    expect(Math.abs(carrierError - (carrierFrequency - 2000))).toBeLessThan(1e-9);
    // A best approximation with denominator ≤ 64 is within 1/(q·65) of the ratio (continued fractions).
    expect(Math.abs(carrierError)).toBeLessThan(37.3 / (q * 65));
    expect(res.body.voltages.map((v: { name: string }) => v.name)).toHaveLength(3);
  });

  it('answers bad input with a 400 naming the field, and refuses expensive work before it starts', async () => {
    const slow = await request(t.app)
      .post(ROUTE)
      .set(auth)
      .send({ design: { ...SINE_TRIANGLE_DESIGN, carrierFrequency: 20 } });
    expect(slow.status).toBe(400);
    expect(slow.body.errors[0].path).toBe('design.carrierFrequency');
    const pattern = await request(t.app)
      .post(ROUTE)
      .set(auth)
      .send({
        design: {
          vdc: 400,
          fundamentalFrequency: 50,
          modulation: {
            method: 'selective-harmonic-elimination',
            kind: 'bipolar',
            angles: [0.2, 0.5, 0.9],
            eliminate: [5, 7],
          },
        },
      });
    expect(pattern.status).toBe(400);
    expect(pattern.body.errors[0].path).toBe('design.modulation.method');
    // ma is bounded to (0, 4] by the design's rules (library DESIGN_BOUNDS).
    const ma = await request(t.app)
      .post(ROUTE)
      .set(auth)
      .send({
        design: {
          ...SINE_TRIANGLE_DESIGN,
          carrierFrequency: 1075,
          modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 5 },
        },
      });
    expect(ma.status).toBe(400);
    expect(ma.body.errors[0].path).toBe('design.modulation.ma');
    const heavy = await request(t.app)
      .post(ROUTE)
      .set(auth)
      .send({
        design: { ...THREE_PHASE_DESIGN, fundamentalFrequency: 37.3, carrierFrequency: 20_000 },
        maxOrder: 5000,
      });
    expect(heavy.status).toBe(400);
    expect(heavy.body.errors[0].path).toBe('maxOrder');
  });
});

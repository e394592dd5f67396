import { describe, expect, it } from 'vitest';
import { abs, add, div, mul, polar, sub, type HandComplex } from '../../testing/handComplex.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { analyseDesign, DESIGN_CAUTION } from '../analyseDesign.js';
import { analyseDesignSpan } from '../analyseDesignSpan.js';
import { designCarrierSpan } from '../designCarrierSpan.js';
import type { RationalRatio } from '../designRationalRatio.js';
import { designSpanMaxOrder } from '../designSpanMaxOrder.js';
import type { DesignReport } from '../DesignReport.js';
import type { InverterDesign } from '../InverterDesign.js';
import type { SpanLabelledHarmonic } from '../labelSpanHarmonics.js';

// Complex numbers written without the library (testing/handComplex), for the hand-solved networks below.
type C = HandComplex;
const TAU = 2 * Math.PI;

/** |a − b| within `relative`·|b| (and an absolute floor for values near zero). */
const close = (actual: number, expected: number, relative: number, label: string): void =>
  assertInDelta(actual, expected, relative * Math.abs(expected) + 1e-9, label);

// Invented values: a 400 V grid fed from 700 V through an LCL filter (as gridFigures.test.ts),
// at 60 Hz with a 10 kHz carrier: mf = 500/3, so the pattern repeats after q = 3 periods.
const l1 = 2e-3;
const c = 10e-6;
const rd = 2;
const l2 = 0.5e-3;
const gridR = 0.05;
const gridL = 0.2e-3;
const gridPhase = -0.1;
const gridDesign: InverterDesign = {
  vdc: 700,
  fundamentalFrequency: 60,
  carrierFrequency: 10_000,
  modulation: { method: 'three-phase', ma: 0.95, zeroSequence: 'none' },
  filter: { l: l1, c, rDamping: rd },
  grid: { lineVoltage: 400, phase: gridPhase, r: gridR, l: gridL, l2, controlBandwidth: 1000 },
};
// An LC filter feeding an R-L load (no damping, no EMF), the same carrier at 60 Hz.
const lcDesign: InverterDesign = {
  vdc: 700,
  fundamentalFrequency: 60,
  carrierFrequency: 10_000,
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
  filter: { l: 1e-3, c: 10e-6 },
  load: { r: 5, l: 1e-3 },
};

describe('a carrier span with an LC filter or a grid (issue 12 items 5 and 6)', () => {
  const grid = analyseDesign(gridDesign, { maxOrder: 400, points: 16_384 });
  const lc = analyseDesign(lcDesign, { maxOrder: 400, points: 16_384 });

  it('spans 500/3 and reports the filter, its output and the grid over the span', () => {
    expect(grid.carrierSpan).toMatchObject({ p: 500, q: 3, baseFrequency: 20 });
    expect(lc.carrierSpan).toMatchObject({ p: 500, q: 3 });
    // The one-period report's 10·mf + 10, in fundamentals.
    expect(grid.analysisOrder).toBe(Math.ceil(5000 / 3) + 10);
    expect(lc.output?.spectrum[3]?.order).toBe(1);
    expect(lc.output?.spectrum.map((h) => (h as SpanLabelledHarmonic).kind)).toContain(
      'inter-harmonic',
    );
    expect(grid.grid?.gridCurrentSpectrum[4]?.order).toBeCloseTo(4 / 3, 15);
    expect(grid.currents.map((x) => x.load?.name)).toEqual([
      'grid current, phase a',
      'grid current, phase b',
      'grid current, phase c',
    ]);
    expect(grid.cautions).toHaveLength(3);
    expect(grid.grid?.harmonicGrouping?.groups).toHaveLength(50);
    expect(grid.grid?.harmonicGrouping?.rule).toMatch(/IEC 61000-4-7.*from memory.*utility/);
  });

  it('with q = 1 the span gives the integer filtered and grid reports (1e-9)', () => {
    // The same designs at a whole mf read by the one-period path and by the span path with
    // p/q = mf/1: agreement checks the span's generalisation (fundamental at order q) at its limit.
    const designs: InverterDesign[] = [
      { ...lcDesign, fundamentalFrequency: 50, carrierFrequency: 2550 },
      { ...gridDesign, fundamentalFrequency: 50, carrierFrequency: 5050 },
    ];
    for (const design of designs) {
      const mf = (design.carrierFrequency as number) / design.fundamentalFrequency;
      const whole = analyseDesign(design, { maxOrder: 400, points: 512 });
      const span = analyseDesignSpan(
        design,
        { p: mf, q: 1, error: 0 },
        { maxOrder: 400, points: 512, caution: DESIGN_CAUTION },
      );
      const label = `mf ${mf}`;
      expect(span.analysisOrder).toBe(whole.analysisOrder);
      for (const key of ['fundamental', 'rms', 'thd', 'thdUpperBound', 'wthd'] as const)
        close(
          span.output?.[key] ?? NaN,
          whole.output?.[key] ?? NaN,
          1e-9,
          `${label} output ${key}`,
        );
      span.output?.spectrum.forEach((h, n) =>
        assertInDelta(h.amplitude, whole.output?.spectrum[n]?.amplitude ?? NaN, 1e-9, `${n}`),
      );
      span.currents.forEach((x, k) => {
        for (const part of ['inverter', 'capacitor', 'load'] as const)
          for (const key of ['rms', 'peak', 'fundamental', 'ripplePeakToPeak'] as const)
            close(
              x[part]?.[key] ?? NaN,
              whole.currents[k]?.[part]?.[key] ?? NaN,
              1e-9,
              `${label} ${part} ${key}`,
            );
      });
      close(span.loadPower ?? NaN, whole.loadPower ?? NaN, 1e-9, `${label} load power`);
      close(span.dcLink?.rms ?? NaN, whole.dcLink?.rms ?? NaN, 1e-9, `${label} DC link`);
      close(
        span.filter?.gainAtCarrier ?? NaN,
        whole.filter?.gainAtCarrier ?? NaN,
        1e-12,
        `${label} gain`,
      );
      if (whole.grid !== null) {
        const [g, w] = [span.grid as NonNullable<DesignReport['grid']>, whole.grid];
        for (const key of [
          'gridCurrentFundamental',
          'gridCurrentThd',
          'power',
          'reactivePower',
          'dampingLoss',
        ] as const)
          close(g[key], w[key], 1e-9, `${label} grid ${key}`);
        close(g.limits.ieee519.total, w.limits.ieee519.total, 1e-9, `${label} TDD`);
        expect(g.harmonicGrouping).toBeUndefined();
      }
    }
  });

  it('the output at each n/q is the bridge component times the LC divider there', () => {
    // Circuit theory (voltage divider): H(ω) = Z_p/(jωL + Z_p), Z_p = (1/jωC) ∥ (R + jωL_load),
    // at ω = 2π·(n/q)·f₁ for each span order n; the fundamental too (no back-EMF).
    const bridge = lc.bridge.spectrum;
    const output = lc.output?.spectrum ?? [];
    for (const n of [1, 2, 3, 4, 5, 497, 499, 500, 501, 503, 998, 1000, 1003]) {
      const w = TAU * 20 * n;
      const zc: C = [0, -1 / (w * 10e-6)];
      const zl: C = [5, w * 1e-3];
      const zp = div(mul(zc, zl), add(zc, zl));
      const h = div(zp, add([0, w * 1e-3], zp));
      const b = bridge[n] as SpanLabelledHarmonic;
      const o = output[n] as SpanLabelledHarmonic;
      expect(o.order).toBe(n / 3);
      const expected = mul(h, polar(b.amplitude, b.phase));
      assertInDelta(
        o.amplitude,
        abs(expected),
        1e-9 * Math.max(abs(expected), 1e-3),
        `order ${n}/3`,
      );
      if (abs(expected) > 1e-6)
        assertInDelta(o.phase, Math.atan2(expected[1], expected[0]), 1e-9, `phase ${n}/3`);
    }
  });

  it('the filter’s gain and the LCL resonance are read at the carrier analysed, p/q·f₁', () => {
    // Voltage divider at 10 kHz (circuit theory) and the LCL resonance
    // (1/2π)·√((L1 + L2')/(L1·L2'·C)), L2' = l2 + l (Liserre, Blaabjerg and Hansen, 2005).
    const w = TAU * 10_000;
    const zc: C = [0, -1 / (w * 10e-6)];
    const zl: C = [5, w * 1e-3];
    const zp = div(mul(zc, zl), add(zc, zl));
    close(lc.filter?.gainAtCarrier ?? NaN, abs(div(zp, add([0, w * 1e-3], zp))), 1e-12, 'gain');
    const l2p = l2 + gridL;
    const resonance = Math.sqrt((l1 + l2p) / (l1 * l2p * c)) / TAU;
    const r = grid.grid?.resonance;
    close(r?.frequency ?? NaN, resonance, 1e-12, 'resonance');
    close(r?.carrierRatio ?? NaN, 10_000 / resonance, 1e-12, 'carrier over resonance');
  });

  it('Parseval over the span: each current’s rms is its samples’ over the q periods', () => {
    // The load current's series holds 16384 evenly spaced samples of the span (16 a cycle of
    // its highest order), so their mean square equals the sum of its components' (discrete
    // Parseval, orthogonality of the sampled sinusoids); the rms is read from the phasors.
    for (const report of [lc, grid]) {
      const load = report.currents[0]?.load;
      const values = load?.series.values ?? [];
      expect(values.length).toBe(16_384);
      const meanSquare = values.reduce((s, v) => s + v * v, 0) / values.length;
      close(Math.sqrt(meanSquare), load?.rms ?? NaN, 1e-9, 'load rms');
    }
    // The grid current's spectrum to maxOrder holds all but the tail above it: never more.
    const g = grid.grid as NonNullable<DesignReport['grid']>;
    const shown = g.gridCurrentSpectrum.reduce(
      (s, h) => s + (h.order === 0 ? 0 : h.amplitude ** 2 / 2),
      0,
    );
    expect(Math.sqrt(shown)).toBeLessThanOrEqual((grid.currents[0]?.load?.rms ?? 0) * (1 + 1e-12));
  });

  it('the grid current’s fundamental is the phasor solution of the grid source + LCL at f₁', () => {
    // Mesh analysis of the LCL ladder (circuit theory, as gridFigures.test.ts): bridge V_b,
    // Z1 = jωL1, Zc = R_d + 1/(jωC), Z2 = r + jω(l2 + l), grid source E at the fundamental:
    // I_grid = (V_b·Zc − E·(Z1 + Zc))/Σ, Σ = Z1·Zc + Z1·Z2 + Zc·Z2; E = 0 at every other n/q.
    const source = polar((Math.SQRT2 * 400) / Math.sqrt(3), gridPhase);
    const g = grid.grid as NonNullable<DesignReport['grid']>;
    for (const n of [3, 1, 4, 499, 500, 501, 997]) {
      const w = TAU * 20 * n;
      const z1: C = [0, w * l1];
      const zc: C = [rd, -1 / (w * c)];
      const z2: C = [gridR, w * (l2 + gridL)];
      const sigma = add(add(mul(z1, zc), mul(z1, z2)), mul(zc, z2));
      const b = grid.bridge.spectrum[n] as SpanLabelledHarmonic;
      const e: C = n === 3 ? source : [0, 0];
      const expected = div(sub(mul(polar(b.amplitude, b.phase), zc), mul(e, add(z1, zc))), sigma);
      const got = g.gridCurrentSpectrum[n] as SpanLabelledHarmonic;
      assertInDelta(got.amplitude, abs(expected), 1e-9 * Math.max(abs(expected), 1e-3), `I ${n}/3`);
      if (n === 3) {
        close(g.gridCurrentFundamental, abs(expected), 1e-9, 'fundamental');
        assertInDelta(g.gridCurrentPhase, Math.atan2(expected[1], expected[0]), 1e-9, 'phase');
        close(grid.currents[0]?.load?.fundamental ?? NaN, abs(expected), 1e-9, 'report current');
      }
    }
  });

  it('checks the grid limits on the harmonic groups of every n/q component', () => {
    const g = grid.grid as NonNullable<DesignReport['grid']>;
    const groups = g.harmonicGrouping?.groups ?? [];
    // Group h holds span orders 3h − 1, 3h, 3h + 1 (thirds: none midway).
    const spectrum = g.gridCurrentSpectrum;
    for (const h of [2, 5, 7, 49]) {
      const expected = Math.sqrt(
        [3 * h - 1, 3 * h, 3 * h + 1].reduce((s, n) => s + (spectrum[n]?.amplitude ?? 0) ** 2, 0),
      );
      close(groups[h - 1]?.amplitude ?? NaN, expected, 1e-12, `group ${h}`);
      expect(groups[h - 1]?.grouped.map((x) => x.order)).toEqual([
        (3 * h - 1) / 3,
        (3 * h + 1) / 3,
      ]);
      const row = g.limits.ieee519.table.find((r) => r.order === h);
      close(row?.ratio ?? NaN, expected / g.gridCurrentFundamental, 1e-12, `519 row ${h}`);
    }
  });

  it('splits a midway component between two groups: bipolar PWM at 35/2 into a grid', () => {
    // A single-phase bipolar bridge at 60 Hz with a 1050 Hz carrier (mf 35/2, two periods) has
    // its carrier sidebands at half orders, midway between harmonics: each gives half its square
    // to either neighbour (IEC 61000-4-7's harmonic group, from memory).
    const report = analyseDesign(
      {
        vdc: 400,
        fundamentalFrequency: 60,
        carrierFrequency: 1050,
        modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
        filter: { l: 3e-3, c: 5e-6, rDamping: 3 },
        grid: { lineVoltage: 230, phase: -0.2, r: 0.1, l: 0.5e-3, l2: 1e-3 },
      },
      { maxOrder: 60, points: 256 },
    );
    expect(report.carrierSpan).toMatchObject({ p: 35, q: 2 });
    const g = report.grid as NonNullable<DesignReport['grid']>;
    const spectrum = g.gridCurrentSpectrum;
    const amplitude = (n: number): number => spectrum[n]?.amplitude ?? 0;
    const reference = g.gridCurrentFundamental;
    let largest = 0;
    for (let h = 2; h <= 50; h++) {
      const expected = Math.sqrt(
        amplitude(2 * h) ** 2 + (amplitude(2 * h - 1) ** 2 + amplitude(2 * h + 1) ** 2) / 2,
      );
      const group = g.harmonicGrouping?.groups[h - 1];
      close(group?.amplitude ?? NaN, expected, 1e-12, `group ${h}`);
      expect(group?.grouped.map((x) => [x.order, x.share])).toEqual([
        [h - 0.5, 0.5],
        [h + 0.5, 0.5],
      ]);
      const row = g.limits.ieee1547.table.find((r) => r.order === h);
      close(row?.ratio ?? NaN, expected / reference, 1e-12, `1547 row ${h}`);
      largest = Math.max(largest, amplitude(2 * h - 1), amplitude(2 * h + 1));
    }
    // The half-order sidebands near the carrier (17.5 ± k) carry real current into the grid.
    expect(largest / reference).toBeGreaterThan(1e-3);
  });

  it('bounds the filtered span by its cost and refuses a costly one naming carrierFrequency', () => {
    // 500/3 with a filter: min(5000, 20000/3, 2e7/1500) = 5000, past ⌈5000/3⌉ + 10 = 1677.
    expect(designSpanMaxOrder(gridDesign, designCarrierSpan(gridDesign) as RationalRatio)).toBe(
      5000,
    );
    // 10 kHz at 59.9 Hz: nearest 3005/18 (q ≤ 64); solving to 1680 orders over 18 periods is
    // 30240 span components > 20000: refused before any work.
    const drifted = { ...gridDesign, fundamentalFrequency: 59.9 };
    expect(designCarrierSpan(drifted)).toMatchObject({ q: 18 });
    expect(rangeErrorField(() => analyseDesign(drifted))).toBe('carrierFrequency');
    // A grid without a filter is bounded as an unfiltered span.
    const { filter: _filter, ...bare } = drifted;
    expect(designSpanMaxOrder(bare, designCarrierSpan(bare) as RationalRatio)).toBeGreaterThan(50);
  });
});

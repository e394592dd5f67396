import { describe, expect, it } from 'vitest';
import { compareCapture, CAPTURE_RATIO_FLOOR } from '../compareCapture.js';
import { fftSpectrum } from '../fftSpectrum.js';
import { harmonics } from '../../spectrum/harmonics.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

// A ±100 V square wave, 50 Hz, 2000 samples a period over 5 periods, and its exact spectrum.
const volts = 100;
const perPeriod = 2000;
const samples = Array.from({ length: 5 * perPeriod }, (_, i) =>
  i % perPeriod < perPeriod / 2 ? volts : -volts,
);
const square = { edges: [0, Math.PI], levels: [volts, -volts] };

describe('compareCapture', () => {
  it('reads ratio 1 on the odd orders of an exact square wave and no ratio on the even ones', () => {
    const measured = fftSpectrum(samples, 100_000, { maxOrder: 25 });
    const predicted = harmonics(square, 25);
    const result = compareCapture(measured.harmonics, predicted, {
      measuredFrequency: measured.fundamentalFrequency,
      predictedFrequency: 50,
      maxOrder: 25,
    });
    expect(result.warnings).toEqual([]);
    assertInDelta(result.noiseFloor, CAPTURE_RATIO_FLOOR * ((4 * volts) / Math.PI), 1e-9, 'floor');
    for (const row of result.orders) {
      if (row.order % 2 === 0) {
        // The exact spectrum of a square wave has no even orders (half-wave symmetry, a fact of
        // the trade), so the prediction is below the floor and no ratio is shown.
        expect(row.ratio).toBeNull();
      } else {
        // Ratio of the sampled DFT 4V/(M·sin(πn/M)) to the series 4V/(nπ): (πn/M)/sin(πn/M).
        const x = (Math.PI * row.order) / perPeriod;
        assertInDelta(row.ratio ?? NaN, x / Math.sin(x), 1e-9, `order ${row.order}`);
      }
    }
  });

  it('warns when the fundamentals differ by more than 1 %, not when by less', () => {
    const measured = fftSpectrum(samples, 100_000, { maxOrder: 5 });
    const predicted = harmonics(square, 5);
    const near = compareCapture(measured.harmonics, predicted, {
      measuredFrequency: 50,
      predictedFrequency: 50.45,
      maxOrder: 5,
    });
    expect(near.warnings).toEqual([]);
    const far = compareCapture(measured.harmonics, predicted, {
      measuredFrequency: 50,
      predictedFrequency: 60,
      maxOrder: 5,
    });
    assertInDelta(far.frequencyMismatch, -1 / 6, 1e-12, 'mismatch');
    expect(far.warnings[0]).toMatch(/50 Hz\) differs from the study's \(60 Hz\) by 16.67 %/);
  });

  it('says which orders the capture cannot reach below its Nyquist frequency', () => {
    // 5 kHz sampling: Nyquist 2.5 kHz, so orders up to 49 of 50 Hz only.
    const slow = Array.from({ length: 500 }, (_, i) => (i % 100 < 50 ? volts : -volts));
    const measured = fftSpectrum(slow, 5000, { maxOrder: 80 });
    expect(measured.harmonics.at(-1)?.order).toBe(49);
    const result = compareCapture(measured.harmonics, harmonics(square, 80), {
      measuredFrequency: measured.fundamentalFrequency,
      predictedFrequency: 50,
      maxOrder: 80,
    });
    expect(result.warnings).toHaveLength(1);
    expect(result.warnings[0]).toMatch(/reaches order 49 only.*orders 50 to 80 are not compared/);
  });

  it('compares a prediction over a 3-period span at its whole orders and sums the components between them', () => {
    // v = 100 sin θ + 30 sin(4θ/3) + 20 sin 3θ, 50 Hz, sampled at 30 kHz over exactly 3 periods
    // (one span). Read with the rectangular window over the 3 periods, the 4/3 component is bin 4
    // of the 1800-point DFT and the whole orders are bins 3 and 9: orthogonal (the DFT of whole
    // cycles, a fact of the trade), so orders 1 and 3 read 100 and 20 exactly.
    const rate = 30_000;
    const span = Array.from({ length: 1800 }, (_, i) => {
      const theta = (2 * Math.PI * 50 * i) / rate;
      return 100 * Math.sin(theta) + 30 * Math.sin((4 * theta) / 3) + 20 * Math.sin(3 * theta);
    });
    const measured = fftSpectrum(span, rate, {
      maxOrder: 4,
      fundamentalFrequency: 50,
      window: 'rectangular',
    });
    // The prediction indexed by span order n (order n/3): the same three components.
    const predicted = Array.from({ length: 13 }, (_, n) => ({
      order: n / 3,
      amplitude: n === 3 ? 100 : n === 4 ? 30 : n === 9 ? 20 : 0,
      phase: 0,
    }));
    const result = compareCapture(measured.harmonics, predicted, {
      measuredFrequency: 50,
      predictedFrequency: 50,
      maxOrder: 4,
      fundamentalPeriods: 3,
    });
    const byOrder = new Map(result.orders.map((row) => [row.order, row]));
    assertInDelta(byOrder.get(1)?.predicted ?? NaN, 100, 0, 'predicted order 1 is span order 3');
    assertInDelta(byOrder.get(1)?.ratio ?? NaN, 1, 1e-9, 'order 1');
    assertInDelta(byOrder.get(3)?.ratio ?? NaN, 1, 1e-9, 'order 3');
    expect(byOrder.get(2)?.ratio).toBeNull();
    // The component between whole orders: 30/100 of the fundamental, named in a warning.
    assertInDelta(result.uncomparedDistortion, 0.3, 1e-15, 'uncompared');
    expect(result.warnings).toHaveLength(1);
    expect(result.warnings[0]).toMatch(
      /repeats every 3 fundamental periods.*30 % of the fundamental/,
    );
    // With q = 1 nothing lies between whole orders.
    const whole = compareCapture(measured.harmonics, harmonics(square, 4), {
      measuredFrequency: 50,
      predictedFrequency: 50,
      maxOrder: 4,
    });
    expect(whole.uncomparedDistortion).toBe(0);
  });

  it('names the field of a bad option', () => {
    expect(() =>
      compareCapture([], [], { measuredFrequency: 0, predictedFrequency: 50, maxOrder: 5 }),
    ).toThrow(/measuredFrequency must be a finite number > 0/);
    expect(() =>
      compareCapture([], [], {
        measuredFrequency: 50,
        predictedFrequency: 50,
        maxOrder: 5,
        ratioFloor: 2,
      }),
    ).toThrow(/ratioFloor/);
    expect(() =>
      compareCapture([], [], {
        measuredFrequency: 50,
        predictedFrequency: 50,
        maxOrder: 5,
        fundamentalPeriods: 1.5,
      }),
    ).toThrow(/fundamentalPeriods/);
  });
});

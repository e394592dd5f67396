import { describe, expect, it } from 'vitest';
import { harmonics, sineTriangle, sweepModulationIndex, thd, waveformThd } from '../../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

describe('sweepModulationIndex', () => {
  const vdc = 250;
  const mf = 21;
  const waveformAt = (ma: number) => sineTriangle({ scheme: 'bipolar', ma, mf, vdc });

  it('returns one value per point of every series and reports progress', () => {
    const progress: number[] = [];
    const sweep = sweepModulationIndex(waveformAt, {
      from: 0.05,
      to: 1.3,
      points: 100,
      maxOrder: 50 * mf,
      orders: [mf, 2 * mf + 1],
      onProgress: (fraction) => progress.push(fraction),
    });
    expect(sweep.ma).toHaveLength(100);
    expect(sweep.thd).toHaveLength(100);
    expect(sweep.harmonics.map((h) => h.amplitude.length)).toEqual([100, 100]);
    assertInDelta(sweep.ma[99] ?? NaN, 1.3, 1e-12);
    expect(progress[99]).toBe(1);
    // Each point equals a direct analysis of the same waveform: the exact whole-waveform THD,
    // which the sum to order 50·mf approaches from below (Parseval; its tail is small but not nil).
    const waveform = waveformAt(sweep.ma[40] ?? NaN);
    assertInDelta(sweep.thd[40] ?? NaN, waveformThd(waveform), 1e-12);
    const truncated = thd(harmonics(waveform, 50 * mf));
    expect(sweep.thd[40] ?? NaN).toBeGreaterThan(truncated);
    expect((sweep.thd[40] ?? NaN) - truncated).toBeLessThan(0.02 * truncated);
    assertInDelta(
      sweep.harmonics[0]?.amplitude[40] ?? NaN,
      harmonics(waveform, mf)[mf]?.amplitude ?? NaN,
      1e-12,
    );
  });

  it('follows fundamental = ma·vdc up to ma = 1 and saturates past it (common practice)', () => {
    const sweep = sweepModulationIndex(waveformAt, { from: 0.1, to: 3, points: 30, maxOrder: 5 });
    sweep.ma.forEach((ma, k) => {
      const fundamental = sweep.fundamental[k] ?? NaN;
      if (ma <= 1) assertInDelta(fundamental, ma * vdc, 1e-9 * vdc);
      else {
        expect(fundamental).toBeLessThan(ma * vdc);
        expect(fundamental).toBeLessThanOrEqual((4 * vdc) / Math.PI + 1e-9);
      }
    });
  });

  it('rejects bad ranges naming the field', () => {
    expect(() => sweepModulationIndex(waveformAt, { from: 1, to: 0.5, maxOrder: 10 })).toThrow(
      /to must be/,
    );
    expect(() => sweepModulationIndex(waveformAt, { points: 1, maxOrder: 10 })).toThrow(
      /points must be an integer ≥ 2/,
    );
    expect(() => sweepModulationIndex(waveformAt, { maxOrder: 10, orders: [11] })).toThrow(
      /orders\[0\]/,
    );
  });
});

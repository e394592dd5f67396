import { describe, expect, it } from 'vitest';
import { carrierGroupOf, harmonics, labelHarmonics, sineTriangle } from '../../index.js';

describe('carrierGroupOf', () => {
  // order = m·mf + n, the indexing of the double Fourier series (Holmes and Lipo 2003, ch. 3).
  it.each([
    [1, 21, 0, 1, '1'],
    [21, 21, 1, 0, 'mf'],
    [19, 21, 1, -2, 'mf−2'],
    [43, 21, 2, 1, '2mf+1'],
    [41, 21, 2, -1, '2mf−1'],
    [63, 21, 3, 0, '3mf'],
  ])('order %i at mf %i is group %i sideband %i (%s)', (order, mf, m, n, label) => {
    expect(carrierGroupOf(order, mf)).toEqual({ order, carrierGroup: m, sideband: n, label });
  });

  it('labels a whole spectrum and the strongest sidebands sit where the theory puts them', () => {
    const mf = 33;
    const spectrum = labelHarmonics(
      harmonics(sineTriangle({ scheme: 'bipolar', ma: 0.8, mf, vdc: 1 }), 3 * mf),
      mf,
    );
    // Bipolar PWM: carrier group 1 is strongest at n = 0, group 2 at n = ±1 (m + n odd).
    const strongestIn = (group: number) =>
      spectrum.filter((h) => h.carrierGroup === group).sort((a, b) => b.amplitude - a.amplitude)[0];
    expect(strongestIn(1)?.sideband).toBe(0);
    expect(Math.abs(strongestIn(2)?.sideband ?? NaN)).toBe(1);
  });
});

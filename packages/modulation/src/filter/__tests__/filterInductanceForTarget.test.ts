import { describe, expect, it } from 'vitest';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { lcFilter } from '../lcFilter.js';
import { filterInductanceForTarget } from '../filterInductanceForTarget.js';

describe('filterInductanceForTarget', () => {
  it('puts the LC resonance at the target: 1/(2π√(LC)) = f (standard circuit analysis)', () => {
    const c = 20e-6;
    const l = filterInductanceForTarget({ kind: 'resonance', frequency: 1000, c });
    // By hand: 1/((2π·1000)²·20e-6) = 1.2665 mH.
    assertInDelta(l, 1 / (4 * Math.PI ** 2 * 1e6 * 20e-6), 1e-15);
    // The library's own filter figures read the same resonance back.
    assertInDelta(lcFilter({ l, c }).resonanceFrequency, 1000, 1e-9);
  });

  it('sizes for a ripple bound vdc·T/(2L) (two-level, worst case at zero output; common practice)', () => {
    // 400 V at 10 kHz for 2 A peak-to-peak: L = 400/(2·10e3·2) = 10 mH.
    const l = filterInductanceForTarget({
      kind: 'ripple',
      peakToPeak: 2,
      vdc: 400,
      carrierFrequency: 10_000,
    });
    assertInDelta(l, 0.01, 1e-15);
    // Half-period volt-seconds at duty 0.5: Δi = (vdc/L)·(T/2) = 400/0.01 · 50 µs = 2 A.
    assertInDelta((400 / l) * (0.5 / 10_000), 2, 1e-12);
  });

  it('refuses a target that is not positive, naming its field', () => {
    expect(() => filterInductanceForTarget({ kind: 'resonance', frequency: 0, c: 1e-6 })).toThrow(
      /target.frequency must be/,
    );
    expect(() =>
      filterInductanceForTarget({ kind: 'ripple', peakToPeak: 1, vdc: 400, carrierFrequency: -1 }),
    ).toThrow(/target.carrierFrequency/);
  });
});

import { describe, expect, it } from 'vitest';
import { harmonics, sineTriangle } from '@pulsewright/modulation';

// Generalised harmonics of bipolar sinusoidal PWM, normalised to the bridge output level (vdc),
// large mf: N. Mohan, T. M. Undeland, W. P. Robbins, *Power Electronics: Converters,
// Applications, and Design*, Wiley, 3rd ed. 2003, ch. 8 (entries recalled from memory, as
// printed to three decimals; docs/references.md). Tolerance 2e-3: the printed rounding plus memory.
const table = [
  { ma: 0.6, mf: 1.006, mfPlusMinus2: 0.131, twoMfPlusMinus1: 0.37 },
  { ma: 1.0, mf: 0.601, mfPlusMinus2: 0.318, twoMfPlusMinus1: 0.181 },
];

describe('the generalised harmonics table (Mohan et al., 2003, ch. 8, from memory)', () => {
  const mf = 201;
  const vdc = 1;
  for (const row of table) {
    it(`ma = ${row.ma}`, () => {
      const spectrum = harmonics(
        sineTriangle({ scheme: 'bipolar', ma: row.ma, mf, vdc }),
        2 * mf + 1,
      );
      const at = (order: number): number => spectrum[order]?.amplitude ?? NaN;
      expect(Math.abs(at(mf) - row.mf)).toBeLessThan(2e-3);
      expect(Math.abs(at(mf - 2) - row.mfPlusMinus2)).toBeLessThan(2e-3);
      expect(Math.abs(at(mf + 2) - row.mfPlusMinus2)).toBeLessThan(2e-3);
      expect(Math.abs(at(2 * mf - 1) - row.twoMfPlusMinus1)).toBeLessThan(2e-3);
      expect(Math.abs(at(2 * mf + 1) - row.twoMfPlusMinus1)).toBeLessThan(2e-3);
      expect(Math.abs(at(1) - row.ma)).toBeLessThan(1e-9);
    });
  }
});

import { describe, expect, it } from 'vitest';
import { checkGridCurrentLimits } from '../checkGridCurrentLimits.js';
import type { Harmonic } from '../../spectrum/Harmonic.js';
import { ParameterRangeError } from '../../validation/errors.js';

// Limits: IEEE Std 519-2022 Table 2 and IEEE Std 1547-2018 Tables 26–27, recalled from memory
// (the tables themselves are marked so; confirm with the standards). The checks below read the
// table at its band and row boundaries.

/** A current of 10 A peak fundamental with one harmonic at `ratio` of it. */
function spectrumWith(order: number, ratio: number): Harmonic[] {
  return Array.from({ length: 51 }, (_, k) => ({
    order: k,
    amplitude: k === 1 ? 10 : k === order ? 10 * ratio : 0,
    phase: 0,
  }));
}

function limitOf(
  order: number,
  options: { standard: 'ieee-519' | 'ieee-1547'; shortCircuitRatio?: number; generation?: boolean },
): number {
  const check = checkGridCurrentLimits(spectrumWith(order, 0), {
    referenceCurrent: 10,
    shortCircuitRatio: options.shortCircuitRatio ?? 10,
    totalWholeWaveform: 0,
    ...options,
  });
  return check.table.find((row) => row.order === order)!.limit;
}

describe('checkGridCurrentLimits', () => {
  it('picks the IEEE 519 row by I_SC/I_L at the row boundaries (a boundary value in the upper row)', () => {
    const fifth = (shortCircuitRatio: number) =>
      limitOf(5, { standard: 'ieee-519', shortCircuitRatio, generation: false });
    expect(fifth(19.999)).toBeCloseTo(0.04, 12);
    expect(fifth(20)).toBeCloseTo(0.07, 12);
    expect(fifth(49.999)).toBeCloseTo(0.07, 12);
    expect(fifth(50)).toBeCloseTo(0.1, 12);
    expect(fifth(100)).toBeCloseTo(0.12, 12);
    expect(fifth(999.9)).toBeCloseTo(0.12, 12);
    expect(fifth(1000)).toBeCloseTo(0.15, 12);
  });

  it('holds generation equipment to the first IEEE 519 row whatever its ratio (Table 2 footnote)', () => {
    const check = checkGridCurrentLimits(spectrumWith(5, 0), {
      standard: 'ieee-519',
      referenceCurrent: 10,
      shortCircuitRatio: 5000,
      totalWholeWaveform: 0,
    });
    expect(check.row).toEqual({ label: 'I_SC/I_L < 20', byGenerationRule: true });
    expect(check.totalLimit).toBeCloseTo(0.05, 12);
  });

  it('reads the IEEE 519 odd bands at their edges and the even orders at a quarter', () => {
    const first = { standard: 'ieee-519' as const };
    expect(limitOf(3, first)).toBeCloseTo(0.04, 12);
    expect(limitOf(9, first)).toBeCloseTo(0.04, 12);
    expect(limitOf(11, first)).toBeCloseTo(0.02, 12);
    expect(limitOf(17, first)).toBeCloseTo(0.015, 12);
    expect(limitOf(23, first)).toBeCloseTo(0.006, 12);
    expect(limitOf(35, first)).toBeCloseTo(0.003, 12);
    expect(limitOf(49, first)).toBeCloseTo(0.003, 12);
    expect(limitOf(2, first)).toBeCloseTo(0.01, 12);
    expect(limitOf(10, first)).toBeCloseTo(0.01, 12);
    expect(limitOf(12, first)).toBeCloseTo(0.005, 12);
    expect(limitOf(50, first)).toBeCloseTo(0.00075, 12);
  });

  it('reads IEEE 1547-2018 Table 27 for orders 2, 4, 6 and the odd band above', () => {
    const dist = { standard: 'ieee-1547' as const };
    expect(limitOf(2, dist)).toBeCloseTo(0.01, 12);
    expect(limitOf(4, dist)).toBeCloseTo(0.02, 12);
    expect(limitOf(6, dist)).toBeCloseTo(0.03, 12);
    expect(limitOf(8, dist)).toBeCloseTo(0.04, 12);
    expect(limitOf(12, dist)).toBeCloseTo(0.02, 12);
    expect(limitOf(35, dist)).toBeCloseTo(0.003, 12);
    expect(limitOf(50, dist)).toBeCloseTo(0.003, 12);
  });

  it('passes an order on its limit and fails one just above it, with the TDD as the root sum square', () => {
    const options = {
      standard: 'ieee-1547' as const,
      referenceCurrent: 10,
      shortCircuitRatio: 30,
      totalWholeWaveform: 0.02,
    };
    const onLimit = checkGridCurrentLimits(spectrumWith(11, 0.02), options);
    expect(onLimit.pass).toBe(true);
    const above = checkGridCurrentLimits(spectrumWith(11, 0.0201), options);
    expect(above.pass).toBe(false);
    expect(above.violations).toEqual([{ order: 11, ratio: 0.0201, limit: 0.02 }]);
    expect(above.total).toBeCloseTo(0.0201, 12);
    expect(above.worstIndividual.order).toBe(11);
  });

  it('fails on the whole-waveform total and says when the orders above 50 carry it', () => {
    const check = checkGridCurrentLimits(spectrumWith(5, 0.01), {
      standard: 'ieee-519',
      referenceCurrent: 10,
      shortCircuitRatio: 10,
      totalWholeWaveform: 0.08,
    });
    expect(check.pass).toBe(false);
    // √(0.08² − 0.01²), the part above order 50.
    expect(check.totalAboveTable).toBeCloseTo(Math.sqrt(0.08 ** 2 - 0.01 ** 2), 12);
    expect(check.note).toMatch(/above 50/);
    expect(check.standard).toMatchObject({ edition: '2022', recalledFromMemory: true });
    expect(check.caution).toMatch(/recalled from memory/);
  });

  it('names the field of a bad option or a short spectrum', () => {
    const options = {
      standard: 'ieee-519' as const,
      referenceCurrent: 10,
      shortCircuitRatio: 10,
      totalWholeWaveform: 0,
    };
    expect(() => checkGridCurrentLimits(spectrumWith(5, 0).slice(0, 40), options)).toThrow(
      ParameterRangeError,
    );
    expect(() =>
      checkGridCurrentLimits(spectrumWith(5, 0), { ...options, referenceCurrent: 0 }),
    ).toThrow(/referenceCurrent/);
    expect(() =>
      checkGridCurrentLimits(spectrumWith(5, 0), {
        ...options,
        standard: 'iec' as unknown as 'ieee-519',
      }),
    ).toThrow(/standard/);
  });
});

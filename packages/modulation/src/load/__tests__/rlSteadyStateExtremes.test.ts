import { describe, expect, it } from 'vitest';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { rlCurrentSeries, rlSteadyState } from '../index.js';
import { waveformFromTransitions } from '../../waveform/waveformFromTransitions.js';
import type { Waveform } from '../../waveform/Waveform.js';
import type { RlLoadOptions } from '../RlLoad.js';

/**
 * Valid but extreme inputs must give a ParameterRangeError naming the input, never NaN or ∞
 * (defect F4 in docs/robustness.md). The limits are facts of IEEE 754 binary64 (IEEE 754-2019,
 * §3.6): the largest finite double is about 1.8e308, the smallest subnormal 5e-324.
 */
function square(volts: number): Waveform {
  return waveformFromTransitions([
    { angle: 0, level: volts },
    { angle: Math.PI, level: -volts },
  ]);
}

describe('rlSteadyState at the edges of double precision', () => {
  it('names r when volts/r overflows (r = 5e-324 Ω, the smallest subnormal double)', () => {
    // The fuzzer's case: tiny bus voltage, r 5e-324, l 2.8e-50, frequency 3.4e-174, EMF 5000 V.
    const load: RlLoadOptions = {
      r: 5e-324,
      l: 2.8e-50,
      frequency: 3.4e-174,
      emf: { amplitude: 5000, phase: 0 },
    };
    expect(rangeErrorField(() => rlSteadyState(square(1.2e-168), load))).toBe('r');
    expect(() => rlSteadyState(square(1.2e-168), load)).toThrow(/^r must be .*ohm/);
  });

  it('rlCurrentSeries names r too instead of returning ±∞/NaN samples', () => {
    // Resistive (l = 0): the EMF current 5000 V / 5e-324 Ω overflows to ∞.
    const load: RlLoadOptions = {
      r: 5e-324,
      l: 0,
      frequency: 50,
      emf: { amplitude: 5000, phase: 0 },
    };
    expect(rangeErrorField(() => rlCurrentSeries(square(1.2e-168), { ...load, points: 8 }))).toBe(
      'r',
    );
  });

  it('names l when the time constant 2π·f·L/R overflows', () => {
    // 2π · 1e10 · 1e300 / 1 > 1.8e308: e^(−2π/τ) rounds to 1 and the periodic solution divides by 0.
    expect(
      rangeErrorField(() => rlSteadyState(square(100), { r: 1, l: 1e300, frequency: 1e10 })),
    ).toBe('l');
  });

  it('still returns finite figures just inside the range (r 1e-6 Ω, l 100 H, f 1e5 Hz, 1e5 V)', () => {
    const result = rlSteadyState(square(1e5), {
      r: 1e-6,
      l: 100,
      frequency: 1e5,
      emf: { amplitude: 1e5, phase: 1 },
    });
    for (const value of Object.values(result)) expect(Number.isFinite(value)).toBe(true);
  });
});

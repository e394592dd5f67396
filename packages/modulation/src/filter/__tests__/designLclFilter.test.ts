import { describe, expect, it } from 'vitest';
import { designLclFilter } from '../designLclFilter.js';
import { lclResonanceFrequency } from '../lclResonanceFrequency.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const TAU = 2 * Math.PI;

describe('lclResonanceFrequency', () => {
  it('is (1/2π)·√((L1 + L2)/(L1·L2·C)) (circuit theory: C against L1 ∥ L2)', () => {
    // L1 = 2 mH, L2 = 0.5 mH, C = 10 µF: L1 ∥ L2 = 0.4 mH, f = 1/(2π·√(0.4 mH·10 µF)) = 2516.46 Hz.
    const parallel = (2e-3 * 0.5e-3) / (2e-3 + 0.5e-3);
    assertInDelta(
      lclResonanceFrequency(2e-3, 0.5e-3, 10e-6),
      1 / (TAU * Math.sqrt(parallel * 10e-6)),
      1e-9,
    );
    assertInDelta(lclResonanceFrequency(2e-3, 0.5e-3, 10e-6), 2516.46, 0.01);
  });

  it('names the field of a non-positive value', () => {
    expect(() => lclResonanceFrequency(2e-3, 0, 10e-6)).toThrow(/l2/);
  });
});

describe('designLclFilter (Liserre, Blaabjerg, Hansen 2005; targets from memory)', () => {
  // An invented 10 kW, 400 V, 50 Hz inverter switching at 10 kHz from 700 V.
  const options = {
    power: 10_000,
    lineVoltage: 400,
    gridFrequency: 50,
    switchingFrequency: 10_000,
    vdc: 700,
  };
  const design = designLclFilter(options);

  it('sets C at 5 % of the base capacitance 1/(ω_g·E²/P)', () => {
    // Z_b = 400²/10 000 = 16 Ω; C_b = 1/(2π·50·16) = 198.94 µF.
    assertInDelta(design.baseImpedance, 16, 1e-12);
    assertInDelta(design.baseCapacitance, 198.944e-6, 1e-9);
    assertInDelta(design.c, 0.05 * design.baseCapacitance, 1e-15);
  });

  it('meets its ripple target: vdc/(4·L1·f_sw) is 10 % of the rated peak current √2·P/(√3·E)', () => {
    const ratedPeak = (Math.SQRT2 * 10_000) / (Math.sqrt(3) * 400);
    assertInDelta(design.ratedCurrent, ratedPeak, 1e-12);
    assertInDelta(700 / (4 * design.l1 * 10_000), 0.1 * ratedPeak, 1e-12);
  });

  it('attenuates the ripple from L1 to the grid to 20 % at f_sw (undamped current divider, stiff grid)', () => {
    // Current divider between C and L2: i_g/i_1 = (1/jωC)/(1/jωC + jωL2) = 1/(1 − ω²L2C).
    const w = TAU * 10_000;
    const ratio = Math.abs(1 / (1 - w * w * design.l2 * design.c));
    assertInDelta(ratio, 0.2, 1e-12);
  });

  it('puts the resonance between 10·f_g and f_sw/2 and R_d at a third of 1/(ω_res·C)', () => {
    const f = lclResonanceFrequency(design.l1, design.l2, design.c);
    assertInDelta(design.resonanceFrequency, f, 1e-9);
    expect(design.withinResonanceRange).toBe(true);
    expect(f).toBeGreaterThanOrEqual(500);
    expect(f).toBeLessThanOrEqual(5000);
    assertInDelta(design.rDamping * TAU * f * design.c, 1 / 3, 1e-12);
  });

  it('says when L1 + L2 exceeds 0.1 per unit, and when the resonance leaves its range', () => {
    // (L1 + L2)·ω_g/Z_b from the design's own values.
    const perUnit = ((design.l1 + design.l2) * TAU * 50) / 16;
    assertInDelta(design.totalInductancePerUnit, perUnit, 1e-12);
    expect(design.notes.some((n) => n.includes('per unit'))).toBe(perUnit > 0.1);
    // A 0.1 % capacitor with a 40 % ripple: C = 0.199 µF, L1 = 2.14 mH, L2 = 7.64 mH, so the
    // resonance is about 8.7 kHz, above f_sw/2 (hand-worked from the steps above).
    const small = designLclFilter({ ...options, capacitorRatio: 0.001, rippleRatio: 0.4 });
    assertInDelta(small.resonanceFrequency, 8726, 10);
    expect(small.withinResonanceRange).toBe(false);
    expect(small.notes.some((n) => n.includes('outside'))).toBe(true);
  });

  it('names the field of an option out of range', () => {
    expect(() => designLclFilter({ ...options, switchingFrequency: 400 })).toThrow(
      /switchingFrequency/,
    );
    expect(() => designLclFilter({ ...options, attenuation: 1 })).toThrow(/attenuation/);
    expect(() => designLclFilter({ ...options, power: 5e-324 })).toThrow(/power/);
  });
});

describe('designLclFilter at the corners of its bounds', () => {
  it('gives finite, positive figures at every corner (the bounds were chosen for it)', () => {
    for (const power of [1, 1e9])
      for (const lineVoltage of [1, 1e6])
        for (const gridFrequency of [1, 1e4])
          for (const switchingFrequency of [10.000001 * gridFrequency, 1e8])
            for (const vdc of [1, 1e6])
              for (const [rippleRatio, capacitorRatio, attenuation] of [
                [1e-3, 1e-4, 1e-3],
                [1, 1, 0.999],
              ] as const) {
                const d = designLclFilter({
                  power,
                  lineVoltage,
                  gridFrequency,
                  switchingFrequency,
                  vdc,
                  rippleRatio,
                  capacitorRatio,
                  attenuation,
                });
                for (const value of [d.l1, d.c, d.l2, d.rDamping, d.resonanceFrequency])
                  expect(Number.isFinite(value) && value > 0).toBe(true);
              }
  });
});

import { describe, expect, it } from 'vitest';
import {
  legLossesFromSamples,
  rippleInductance,
  semiconductorLosses,
  semiconductorLossesByIntegration,
  switchingFrequencyTradeoff,
  type IgbtDevice,
  type MosfetDevice,
} from '../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

// Invented datasheet-like values (not from any real part).
const igbt: IgbtDevice = {
  kind: 'igbt',
  vce0: 0.9,
  rce: 0.012,
  vf0: 1.05,
  rf: 0.009,
  eon: 2.1e-3,
  eoff: 2.6e-3,
  err: 1.3e-3,
  referenceVoltage: 600,
  referenceCurrent: 100,
};
const mosfet: MosfetDevice = {
  kind: 'mosfet',
  rdsOn: 0.018,
  eon: 0.4e-3,
  eoff: 0.3e-3,
  err: 0.05e-3,
  referenceVoltage: 800,
  referenceCurrent: 50,
};
const point = {
  vdc: 650,
  ma: 0.9,
  peakCurrent: 28,
  currentAngle: 0.45,
  switchingFrequency: 20_000,
};

describe('semiconductorLosses closed form', () => {
  it('agrees with the carrier-period integration of the actual duty cycles', () => {
    // Independent method: per-carrier-period sums of the actual duties and currents
    // (N = 400 periods) against the closed forms of Bierhoff and Fuchs, PESC 2004 (from
    // memory); the midpoint sum differs from the integral by O(1/N²) ≈ 1e−5.
    const cases = [
      { device: igbt, ma: 0.9, currentAngle: 0.45, zeroSequence: 'none' as const },
      { device: igbt, ma: 0.3, currentAngle: -1.2, zeroSequence: 'none' as const },
      { device: igbt, ma: 1.1, currentAngle: 0.7, zeroSequence: 'third-harmonic' as const },
      { device: igbt, ma: 1.0, currentAngle: 2.5, zeroSequence: 'third-harmonic' as const },
      { device: mosfet, ma: 0.8, currentAngle: 0.2, zeroSequence: 'none' as const },
    ];
    for (const { device, ...c } of cases) {
      const closed = semiconductorLosses(device, { ...point, ...c });
      const summed = semiconductorLossesByIntegration(device, {
        ...point,
        ...c,
        fundamentalFrequency: 50,
      });
      const label = `${device.kind} ma ${c.ma} φ ${c.currentAngle} ${c.zeroSequence}`;
      assertInDelta(
        summed.transistor.conduction,
        closed.transistor.conduction,
        1e-4 * closed.transistor.conduction,
        `${label} T cond`,
      );
      assertInDelta(
        summed.diode.conduction,
        closed.diode.conduction,
        1e-4 * Math.max(closed.diode.conduction, 1e-3),
        `${label} D cond`,
      );
      assertInDelta(
        summed.transistor.switching,
        closed.transistor.switching,
        1e-4 * closed.transistor.switching,
        `${label} T sw`,
      );
      assertInDelta(
        summed.diode.switching,
        closed.diode.switching,
        1e-4 * closed.diode.switching,
        `${label} D sw`,
      );
    }
  });

  it('splits a resistive load (cos φ = 1) as the hand integrals say', () => {
    // φ = 0, ma = 1: the IGBT conducts d = (1 + sin θ)/2 of each period while i = Î·sin θ > 0:
    // (1/2π)∫₀^π (1 + sin θ)/2·(V0·Î sin θ + r·Î² sin²θ) dθ = V0·Î(1/(2π) + 1/8) +
    // r·Î²(1/8 + 1/(3π)) using ∫ sin = 2, ∫ sin² = π/2, ∫ sin³ = 4/3 (hand integration).
    const i = 28;
    const losses = semiconductorLosses(igbt, { ...point, ma: 1, currentAngle: 0 });
    assertInDelta(
      losses.transistor.conduction,
      (0.9 * i * (2 + Math.PI / 2)) / (4 * Math.PI) +
        (0.012 * i * i * (Math.PI / 2 + 4 / 3)) / (4 * Math.PI),
      1e-12,
    );
    assertInDelta(
      losses.diode.conduction,
      (1.05 * i * (2 - Math.PI / 2)) / (4 * Math.PI) +
        (0.009 * i * i * (Math.PI / 2 - 4 / 3)) / (4 * Math.PI),
      1e-12,
    );
    // Output power of sinusoids: (V1·I1/2)·cos φ with V1 = ma·vdc/2 per leg (circuit analysis).
    assertInDelta(losses.outputPower, (3 * (650 / 2) * i) / 2, 1e-9);
    assertInDelta(
      losses.efficiency!,
      losses.outputPower / (losses.outputPower + losses.total),
      1e-15,
    );
  });

  it('conserves the current: one device of each leg always carries it', () => {
    // With equal thresholds and slopes for transistor and diode, a leg's conduction loss is
    // V0·mean|i| + r·I_rms² = V0·2Î/π + r·Î²/2 whatever ma and φ (the current always flows
    // through exactly one device; mean |sin| = 2/π, mean sin² = 1/2).
    const symmetric: IgbtDevice = { ...igbt, vf0: igbt.vce0, rf: igbt.rce };
    for (const [ma, currentAngle] of [
      [0.2, 0.1],
      [0.95, -0.8],
      [0.6, 2.9],
    ] as const) {
      const l = semiconductorLosses(symmetric, { ...point, ma, currentAngle });
      assertInDelta(
        2 * (l.transistor.conduction + l.diode.conduction),
        (0.9 * 2 * 28) / Math.PI + (0.012 * 28 * 28) / 2,
        1e-12,
      );
    }
    // MOSFET with synchronous rectification: rdsOn·I_rms² per leg (same reason).
    const m = semiconductorLosses(mosfet, point);
    assertInDelta(2 * m.transistor.conduction, (0.018 * 28 * 28) / 2, 1e-12);
  });

  it('averages the linearly scaled switching energy over the half-cycle', () => {
    // Each period one turn-on and one turn-off at |i|: fsw·E·(vdc/Vref)·mean over the cycle of
    // the conducting half's |i|/Iref = fsw·E·(vdc/Vref)·(Î/Iref)/π (mean of sin over (0, π)
    // times ½: 1/π; linear scaling is common practice).
    const l = semiconductorLosses(igbt, point);
    assertInDelta(
      l.transistor.switching,
      (20_000 * 4.7e-3 * (650 / 600) * (28 / 100)) / Math.PI,
      1e-12,
    );
    assertInDelta(l.diode.switching, (20_000 * 1.3e-3 * (650 / 600) * (28 / 100)) / Math.PI, 1e-12);
  });

  it('names the field and range of bad input', () => {
    expect(() => semiconductorLosses(igbt, { ...point, ma: 1.05 })).toThrow(/ma must be ≤ 1/);
    expect(() => semiconductorLosses(igbt, { ...point, zeroSequence: 'min-max' })).toThrow(
      /zeroSequence/,
    );
    expect(() => semiconductorLosses({ ...igbt, rce: -1 }, point)).toThrow(
      /device.rce must be a finite number ≥ 0/,
    );
    expect(() => semiconductorLosses(igbt, { ...point, peakCurrent: Number.NaN })).toThrow(
      /peakCurrent/,
    );
    expect(() => semiconductorLosses(null as unknown as IgbtDevice, point)).toThrow(TypeError);
  });
});

describe('legLossesFromSamples', () => {
  it('gives the hand result for a constant (dc) current', () => {
    // Constant duty d and current I > 0: the upper IGBT conducts d of the time, the lower
    // diode 1 − d; each period one turn-on/off in the IGBT and one recovery in the diode
    // (piecewise-linear device model, linear energy scaling: common practice).
    const d = 0.62;
    const current = 35;
    const leg = legLossesFromSamples(new Array(16).fill(d), new Array(16).fill(current), {
      device: igbt,
      vdc: 700,
      switchingFrequency: 12_000,
    });
    assertInDelta(
      leg.upperTransistor.conduction,
      d * (0.9 * current + 0.012 * current * current),
      1e-12,
    );
    assertInDelta(
      leg.lowerDiode.conduction,
      (1 - d) * (1.05 * current + 0.009 * current * current),
      1e-12,
    );
    assertInDelta(
      leg.upperTransistor.switching,
      12_000 * 4.7e-3 * (700 / 600) * (current / 100),
      1e-12,
    );
    assertInDelta(leg.lowerDiode.switching, 12_000 * 1.3e-3 * (700 / 600) * (current / 100), 1e-12);
    expect(leg.lowerTransistor.total).toBe(0);
    expect(leg.upperDiode.total).toBe(0);
    // Negative current: the roles swap.
    const reverse = legLossesFromSamples([d], [-current], {
      device: igbt,
      vdc: 700,
      switchingFrequency: 12_000,
    });
    assertInDelta(
      reverse.lowerTransistor.conduction,
      (1 - d) * (0.9 * current + 0.012 * current * current),
      1e-12,
    );
    assertInDelta(
      reverse.upperDiode.conduction,
      d * (1.05 * current + 0.009 * current * current),
      1e-12,
    );
    // A clamped leg (d = 1) conducts but never switches.
    const clamped = legLossesFromSamples([1], [current], {
      device: igbt,
      vdc: 700,
      switchingFrequency: 12_000,
    });
    expect(clamped.upperTransistor.switching).toBe(0);
    expect(() =>
      legLossesFromSamples([1.2], [1], { device: igbt, vdc: 700, switchingFrequency: 1 }),
    ).toThrow(/duties\[0\] must be a fraction in \[0, 1\]/);
    expect(() =>
      legLossesFromSamples([0.5, 0.5], [1], { device: igbt, vdc: 700, switchingFrequency: 1 }),
    ).toThrow(/currents.length/);
  });

  it('switches less in overmodulation, where clamped periods do not switch', () => {
    const over = semiconductorLossesByIntegration(igbt, { ...point, ma: 1.3 });
    const linear = semiconductorLosses(igbt, { ...point, ma: 1 });
    expect(over.transistor.switching).toBeLessThan(linear.transistor.switching);
  });
});

describe('switchingFrequencyTradeoff', () => {
  it('pairs rising losses with the ripple-bound inductance', () => {
    const frequencies = [4000, 8000, 16_000, 32_000];
    const series = switchingFrequencyTradeoff(frequencies, {
      ...point,
      device: igbt,
      topology: 'h-bridge',
      filter: { target: 'ripple', ripple: 4 },
    });
    expect(series.frequencies).toEqual(frequencies);
    frequencies.forEach((f, k) => {
      // L = vdc/(2·fsw·ΔI) for a bipolar bridge (ripple bound vdc·T/(2L), docs/references.md).
      assertInDelta(series.inductance[k]!, 650 / (2 * f * 4), 1e-15);
      if (k > 0) expect(series.totalLoss[k]!).toBeGreaterThan(series.totalLoss[k - 1]!);
    });
    // Switching loss is proportional to fsw, conduction independent of it.
    assertInDelta(series.switchingLoss[3]! / series.switchingLoss[0]!, 8, 1e-12);
    assertInDelta(series.conductionLoss[3]!, series.conductionLoss[0]!, 1e-12);
    expect(series.efficiency[3]!).toBeLessThan(series.efficiency[0]!);
    expect(
      rippleInductance({ vdc: 400, switchingFrequency: 10_000, ripple: 2, bridge: 'unipolar' }),
    ).toBeCloseTo(400 / (8 * 10_000 * 2), 15);
  });

  it('sizes the inductance for a THD target with the LC filter, falling about as 1/f²', () => {
    // Far above resonance an LC filter attenuates by ≈ (f_r/f)² = 1/(ω²LC), so for a fixed
    // THD the inductance scales about as 1/f² (second-order filter, standard circuit analysis).
    const series = switchingFrequencyTradeoff([5000, 10_000], {
      ...point,
      device: igbt,
      topology: 'h-bridge',
      scheme: 'unipolar',
      fundamentalFrequency: 50,
      filter: { target: 'thd', maxThd: 0.02, c: 10e-6 },
    });
    const ratio = series.inductance[1]! / series.inductance[0]!;
    expect(ratio).toBeGreaterThan(0.2);
    expect(ratio).toBeLessThan(0.3);
    expect(() =>
      switchingFrequencyTradeoff([5030], {
        ...point,
        device: igbt,
        topology: 'h-bridge',
        filter: { target: 'thd', maxThd: 0.02, c: 10e-6 },
      }),
    ).toThrow(/frequencies\[0\] must be an integer multiple/);
    expect(() =>
      switchingFrequencyTradeoff([5000], {
        ...point,
        device: igbt,
        filter: { target: 'thd', maxThd: 0.02, c: 10e-6 },
      }),
    ).toThrow(/filter.target/);
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { harmonicLoadCurrent, rlCurrentAt, rlCurrentSeries, rlSteadyState } from '../index.js';
import { harmonics } from '../../spectrum/harmonics.js';
import { waveformFromTransitions } from '../../waveform/waveformFromTransitions.js';
import { waveformMeanSquare } from '../../waveform/waveformMeanSquare.js';
import type { Waveform } from '../../waveform/Waveform.js';
import type { Harmonic } from '../../spectrum/Harmonic.js';
import type { RlLoadOptions } from '../RlLoad.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { spectrumValueAt } from '../../testing/spectrumValueAt.js';

const TAU = 2 * Math.PI;

/** Mean square of a current from its harmonics: I_0² + Σ I_n²/2 (Parseval). */
function harmonicMeanSquare(spectrum: readonly Harmonic[]): number {
  return spectrum.reduce(
    (sum, h) => sum + (h.order === 0 ? h.amplitude ** 2 : h.amplitude ** 2 / 2),
    0,
  );
}

/**
 * Upper bound on the mean square the harmonic sum leaves out above order N. From the step
 * formula c_n = Σ Δᵢ e^{−jnθᵢ}/(2πjn), |V_n| ≤ J/(πn) with J = Σ|Δᵢ| (sum of jump sizes), and
 * |R + jnωL| ≥ nωL, so I_n ≤ J/(πωL·n²) and Σ_{n>N} I_n²/2 ≤ J²/(2π²ω²L²)·Σ_{n>N} n⁻⁴
 * ≤ J²/(2π²ω²L²)·1/(3N³) (integral bound of the tail).
 */
function tailBound(waveform: Waveform, { l, frequency }: RlLoadOptions, maxOrder: number): number {
  const { levels } = waveform;
  let jumps = 0;
  for (let i = 0; i < levels.length; i++) {
    jumps += Math.abs(
      (levels[i] as number) - (levels[(i + levels.length - 1) % levels.length] as number),
    );
  }
  const reactance = TAU * frequency * l;
  return (jumps * jumps) / (2 * Math.PI ** 2 * reactance ** 2) / (3 * maxOrder ** 3);
}

describe('rlSteadyState of a square wave (closed form)', () => {
  // ±V square wave, +V on (0, π), into R–L. Standard circuit analysis (first-order response,
  // any circuits text): with T = 1/f and y = RT/(4L), the current starts each positive half at
  // its minimum i(0) = −(V/R)·tanh(y) and ends it at +(V/R)·tanh(y); integrating the
  // exponential gives I_rms² = (V/R)²·(1 − tanh(y)/y) (derived by hand for this test).
  const volts = 340;
  const square = { edges: [0, Math.PI], levels: [volts, -volts] };
  const load = { r: 4.7, l: 0.012, frequency: 60 };
  const y = load.r / (4 * load.frequency * load.l);

  it('starts at −(V/R)·tanh(RT/4L) and swings symmetrically', () => {
    const result = rlSteadyState(square, load);
    const expected = (volts / load.r) * Math.tanh(y);
    assertInDelta(result.initialCurrent, -expected, 1e-12 * expected, 'i(0)');
    assertInDelta(result.minCurrent, -expected, 1e-12 * expected, 'min');
    assertInDelta(result.peakCurrent, expected, 1e-12 * expected, 'peak');
    assertInDelta(result.peakToPeakCurrent, 2 * expected, 2e-12 * expected, 'p2p');
    assertInDelta(result.meanCurrent, 0, 1e-12 * expected, 'mean');
  });

  it('has I_rms² = (V/R)²(1 − tanh(y)/y) and power R·I_rms² equal to the source power', () => {
    const result = rlSteadyState(square, load);
    const rms = (volts / load.r) * Math.sqrt(1 - Math.tanh(y) / y);
    assertInDelta(result.rmsCurrent, rms, 1e-12 * rms, 'rms');
    assertInDelta(result.power, load.r * rms * rms, 1e-11 * load.r * rms * rms, 'power');
    // The inductance stores no net energy over a period (energy balance).
    assertInDelta(result.sourcePower, result.power, 1e-11 * result.power, 'source power');
    expect(result.emfPower).toBe(0);
  });

  it('follows the exponential between edges', () => {
    // On the positive half: i(θ) = V/R + (i(0) − V/R)·e^{−θ/(ωL/R)} (standard circuit analysis).
    const i0 = -(volts / load.r) * Math.tanh(y);
    const tauRadians = (TAU * load.frequency * load.l) / load.r;
    const angles = [0.1, 0.7, 1.9, 3.0];
    const current = rlCurrentAt(square, angles, load);
    angles.forEach((theta, k) => {
      const expected = volts / load.r + (i0 - volts / load.r) * Math.exp(-theta / tauRadians);
      assertInDelta(current[k] as number, expected, 1e-11 * (volts / load.r), `θ = ${theta}`);
    });
    // Half-wave symmetry of the square wave carries over to the current: i(θ + π) = −i(θ).
    const shifted = rlCurrentAt(
      square,
      angles.map((a) => a + Math.PI),
      load,
    );
    angles.forEach((_, k) =>
      assertInDelta(shifted[k] as number, -(current[k] as number), 1e-11 * volts),
    );
  });
});

describe('rlSteadyState against the harmonic sum (standard circuit analysis)', () => {
  // A three-level waveform with unequal pulses and a DC offset (invented for the test).
  const waveform = waveformFromTransitions([
    { angle: 0.31, level: 200 },
    { angle: 1.2, level: 0 },
    { angle: 1.45, level: 200 },
    { angle: 2.6, level: 0 },
    { angle: 3.6, level: -200 },
    { angle: 4.1, level: 0 },
    { angle: 4.7, level: -200 },
    { angle: 5.9, level: 30 },
  ]);
  const load = { r: 3.3, l: 0.02, frequency: 50 };
  const maxOrder = 3000;

  it('mean square agrees to 1e-9 relative, within the stated tail bound', () => {
    const exact = rlSteadyState(waveform, load).rmsCurrent ** 2;
    const summed = harmonicMeanSquare(harmonicLoadCurrent(harmonics(waveform, maxOrder), load));
    const bound = tailBound(waveform, load, maxOrder);
    // The truncated sum can only fall short of the exact value, by at most the tail bound.
    expect(exact - summed).toBeGreaterThan(-1e-12 * exact);
    expect(exact - summed).toBeLessThanOrEqual(bound + 1e-12 * exact);
    expect(bound / exact).toBeLessThan(1e-9);
    assertInDelta(summed, exact, 1e-9 * exact, 'mean square');
  });

  it('mean current is V_0/R', () => {
    const [dc] = harmonics(waveform, 0);
    assertInDelta(
      rlSteadyState(waveform, load).meanCurrent,
      (dc?.amplitude ?? NaN) / load.r,
      1e-12 * 100,
    );
  });

  it('pointwise current agrees with the reconstructed harmonic sum within Σ_{n>N} I_n', () => {
    // Pointwise tail: Σ_{n>N} I_n ≤ J/(πωL)·Σ_{n>N} n⁻² ≤ J/(πωL·N) (same bounds as above).
    const order = 2000;
    const spectrum = harmonicLoadCurrent(harmonics(waveform, order), load);
    const bound = (1600 + 60) / (Math.PI * TAU * load.frequency * load.l * order);
    const angles = [0.05, 1.3, 2.2, 3.33, 5.0, 6.2];
    const exact = rlCurrentAt(waveform, angles, load);
    angles.forEach((theta, k) => {
      const summed = spectrumValueAt(spectrum, theta);
      assertInDelta(exact[k] as number, summed, bound, `θ = ${theta}`);
    });
  });

  it('holds for random waveforms and loads (property, Parseval)', () => {
    const arbitraryWaveform = fc
      .array(
        fc.record({
          angle: fc.double({ min: 0, max: 6.28, noNaN: true }),
          level: fc.integer({ min: -400, max: 400 }),
        }),
        {
          minLength: 1,
          maxLength: 12,
        },
      )
      .map((transitions) => waveformFromTransitions(transitions));
    const arbitraryLoad = fc.record({
      r: fc.double({ min: 0.1, max: 50, noNaN: true }),
      timeConstantRadians: fc.double({ min: 0.3, max: 30, noNaN: true }),
    });
    fc.assert(
      fc.property(arbitraryWaveform, arbitraryLoad, (w, { r, timeConstantRadians }) => {
        const frequency = 50;
        const options = { r, l: (timeConstantRadians * r) / (TAU * frequency), frequency };
        const order = 600;
        const exact = rlSteadyState(w, options);
        const summed = harmonicMeanSquare(harmonicLoadCurrent(harmonics(w, order), options));
        const ms = exact.rmsCurrent ** 2;
        const scale = 1e-11 * (ms + (400 / r) ** 2);
        expect(ms - summed).toBeGreaterThan(-scale);
        expect(ms - summed).toBeLessThanOrEqual(tailBound(w, options, order) + scale);
        // Energy balance: no EMF, so all source power ends in R.
        assertInDelta(exact.sourcePower, exact.power, 1e-9 * (exact.power + (400 * 400) / r));
      }),
      { numRuns: 60, seed: 20250101 },
    );
  });
});

describe('rlSteadyState, resistive load', () => {
  it('gives i = v/R and power V²/R for l = 0', () => {
    // Ohm's law; mean power of a ±V square wave into R is V²/R.
    const square = { edges: [0, Math.PI], levels: [48, -48] };
    const result = rlSteadyState(square, { r: 6, l: 0, frequency: 400 });
    assertInDelta(result.power, (48 * 48) / 6, 1e-12 * 384, 'power');
    assertInDelta(result.rmsCurrent, 8, 1e-12 * 8);
    expect(result.peakCurrent).toBe(8);
    expect(result.minCurrent).toBe(-8);
    expect(rlCurrentAt(square, [1, 4], { r: 6, l: 0, frequency: 400 })).toEqual([8, -8]);
  });

  it('matches mean(v²)/R for a multilevel waveform', () => {
    const w = { edges: [0.2, 1, 2.5, 4], levels: [10, 30, -5, 0] };
    assertInDelta(
      rlSteadyState(w, { r: 2, l: 0, frequency: 50 }).power,
      waveformMeanSquare(w) / 2,
      1e-12 * 300,
    );
  });
});

describe('rlSteadyState ripple of a high-frequency square wave', () => {
  it('stays below Vdc·T_carrier/(2L) and approaches it as R → 0', () => {
    // Ripple bound Vdc·T_c/(2L) from v_L = L di/dt ignoring R (common practice, docs/references.md).
    // Square wave at 21 times the fundamental: T_c = 1/(21·f).
    const vdc = 400;
    const pulses = 21;
    const transitions = [];
    for (let k = 0; k < pulses; k++) {
      transitions.push(
        { angle: (TAU * k) / pulses, level: vdc },
        { angle: (TAU * (k + 0.5)) / pulses, level: -vdc },
      );
    }
    const waveform = waveformFromTransitions(transitions);
    const load = { r: 0.5, l: 0.005, frequency: 50 };
    const carrierPeriod = 1 / (pulses * load.frequency);
    const bound = (vdc * carrierPeriod) / (2 * load.l);
    const ripple = rlSteadyState(waveform, load).peakToPeakCurrent;
    expect(ripple).toBeLessThan(bound);
    // With R the exact ripple is 2(V/R)·tanh(R·T_c/(4L)) (the square-wave closed form above),
    // which is bound·tanh(y)/y ≈ bound·(1 − y²/3).
    const y = (load.r * carrierPeriod) / (4 * load.l);
    assertInDelta(ripple, bound * (Math.tanh(y) / y), 1e-11 * bound, 'ripple');
    expect(ripple / bound).toBeGreaterThan(0.999);
  });
});

describe('rlSteadyState with back-EMF', () => {
  const load = { r: 1.5, l: 0.004, frequency: 50 };
  const emf = { amplitude: 120, phase: 0.4 };
  const reactance = TAU * load.frequency * load.l;
  const impedance = Math.hypot(load.r, reactance);
  const zero = { edges: [0], levels: [0] };

  it('gives the phasor current −E/Z for a zero source', () => {
    // Phasor analysis (standard circuit analysis): I = −E/(R + jωL).
    const result = rlSteadyState(zero, { ...load, emf });
    const peak = emf.amplitude / impedance;
    assertInDelta(result.peakCurrent, peak, 1e-12 * peak, 'peak');
    assertInDelta(result.minCurrent, -peak, 1e-12 * peak, 'min');
    assertInDelta(result.rmsCurrent, peak / Math.SQRT2, 1e-12 * peak, 'rms');
    const lag = Math.atan2(reactance, load.r);
    const angles = [0, 1, 2.5, 4];
    const current = rlCurrentAt(zero, angles, { ...load, emf });
    angles.forEach((theta, k) => {
      assertInDelta(current[k] as number, -peak * Math.sin(theta + emf.phase - lag), 1e-12 * peak);
    });
    // The EMF delivers the power R absorbs: emfPower = −R·I_rms².
    assertInDelta(result.emfPower, (-load.r * (peak * peak)) / 2, 1e-10 * peak * peak);
    expect(result.sourcePower).toBe(0);
  });

  it('balances source power against R losses and EMF power, and matches the harmonic sum', () => {
    const square = { edges: [0, Math.PI], levels: [200, -200] };
    const options = { ...load, emf };
    const result = rlSteadyState(square, options);
    // Energy balance over a period: mean(v·i) = R·I_rms² + mean(e·i).
    assertInDelta(
      result.sourcePower,
      result.power + result.emfPower,
      1e-10 * result.sourcePower,
      'balance',
    );
    const maxOrder = 3000;
    const summed = harmonicMeanSquare(harmonicLoadCurrent(harmonics(square, maxOrder), options));
    const exact = result.rmsCurrent ** 2;
    expect(exact - summed).toBeLessThanOrEqual(tailBound(square, load, maxOrder) + 1e-12 * exact);
    assertInDelta(summed, exact, 1e-9 * exact, 'mean square');
    // Only the fundamental carries EMF power: mean(e·i) = (E·I_1/2)·cos(φ_e − φ_i1).
    const fundamental = harmonicLoadCurrent(harmonics(square, 1), options)[1] as Harmonic;
    const emfPower =
      ((emf.amplitude * fundamental.amplitude) / 2) * Math.cos(emf.phase - fundamental.phase);
    assertInDelta(result.emfPower, emfPower, 1e-10 * Math.abs(emfPower), 'emf power');
  });

  it('finds the extremes inside segments (checked against dense evaluation)', () => {
    const square = { edges: [0, Math.PI], levels: [60, -60] };
    const options = { r: 0.8, l: 0.03, frequency: 50, emf: { amplitude: 150, phase: 1.1 } };
    const result = rlSteadyState(square, options);
    const { current } = rlCurrentSeries(square, { ...options, points: 200_000 });
    const denseMax = current.reduce((a, b) => Math.max(a, b), -Infinity);
    const denseMin = current.reduce((a, b) => Math.min(a, b), Infinity);
    // The EMF makes the extremes interior: they exceed every value at the edges.
    const atEdges = rlCurrentAt(square, [0, Math.PI], options);
    expect(result.peakCurrent).toBeGreaterThan(Math.max(...atEdges) + 1);
    // Dense sampling can only miss some of the peak: ≤ |di/dθ|max·Δθ/2 ≈ tiny at 2e5 points.
    expect(result.peakCurrent).toBeGreaterThanOrEqual(denseMax - 1e-12 * denseMax);
    assertInDelta(result.peakCurrent, denseMax, 1e-6 * denseMax, 'peak');
    assertInDelta(result.minCurrent, denseMin, 1e-6 * Math.abs(denseMin), 'min');
  });
});

describe('rlCurrentSeries', () => {
  it('returns evenly spaced angles over [0, 2π) and matches rlCurrentAt', () => {
    const square = { edges: [0, Math.PI], levels: [1, -1] };
    const options = { r: 1, l: 0.01, frequency: 50 };
    const { angles, current } = rlCurrentSeries(square, { ...options, points: 8 });
    expect(angles).toHaveLength(8);
    assertInDelta(angles[4] as number, Math.PI, 1e-15);
    expect(current).toEqual(rlCurrentAt(square, angles, options));
  });
});

describe('load input checks', () => {
  const square = { edges: [0, Math.PI], levels: [1, -1] };
  it('names the field and the range', () => {
    expect(() => rlSteadyState(square, { r: 0, l: 0.01, frequency: 50 })).toThrow(
      /r must be a finite number > 0/,
    );
    expect(() => rlSteadyState(square, { r: 1, l: -1, frequency: 50 })).toThrow(
      /l must be a finite number ≥ 0/,
    );
    expect(() => rlSteadyState(square, { r: 1, l: 0, frequency: NaN })).toThrow(
      /frequency must be/,
    );
    expect(() =>
      rlSteadyState(square, { r: 1, l: 0, frequency: 50, emf: { amplitude: -1, phase: 0 } }),
    ).toThrow(/emf.amplitude must be a finite number ≥ 0/);
    expect(() =>
      rlSteadyState(square, { r: 1, l: 0, frequency: 50, emf: { amplitude: 1, phase: Infinity } }),
    ).toThrow(/emf.phase/);
    expect(() =>
      rlSteadyState({ edges: [2, 1], levels: [1, 1] }, { r: 1, l: 0, frequency: 50 }),
    ).toThrow(/waveform.edges\[1\]/);
    expect(() => rlCurrentAt(square, [0, NaN], { r: 1, l: 0, frequency: 50 })).toThrow(
      /angles\[1\]/,
    );
    expect(() => rlCurrentSeries(square, { r: 1, l: 0, frequency: 50, points: 1 })).toThrow(
      /points must be an integer ≥ 2/,
    );
    expect(() =>
      harmonicLoadCurrent([{ order: 1.5, amplitude: 1, phase: 0 }], { r: 1, l: 0, frequency: 50 }),
    ).toThrow(/spectrum\[0\].order/);
    expect(() =>
      rlSteadyState(square, { r: '1', l: 0, frequency: 50 } as unknown as RlLoadOptions),
    ).toThrow(TypeError);
  });
});

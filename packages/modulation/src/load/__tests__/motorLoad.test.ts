import { describe, expect, it } from 'vitest';
import { analyseDesign } from '../../design/analyseDesign.js';
import type { InverterDesign } from '../../design/InverterDesign.js';
import { TAU } from '../../math.js';
import { harmonics } from '../../spectrum/harmonics.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import type { Waveform } from '../../waveform/Waveform.js';

// Issue 12, capability 7: a balanced three-phase R–L load with a back-EMF per phase (a motor
// winding). The reference is the closed-form periodic steady state of L di/dt + R i = v − e,
// harmonic by harmonic (standard circuit analysis, the phasor solution):
//   I_n = (V_n − E·[n = 1]) / (R + j·n·ω·L),
// with the bridge's phase voltage V_n taken from the exact spectrum of its switching angles.

interface Complex {
  re: number;
  im: number;
}
/** a·sin(nθ + φ) as the phasor a·e^{jφ} (the library's convention, written out again here). */
const phasor = (amplitude: number, phase: number): Complex => ({
  re: amplitude * Math.cos(phase),
  im: amplitude * Math.sin(phase),
});
const divide = (a: Complex, b: Complex): Complex => {
  const d = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
};
const abs = (a: Complex): number => Math.hypot(a.re, a.im);

const R = 1.5;
const L = 6e-3;
const F = 50;
const EMF = { amplitude: 220, phase: -0.35 };
const ORDERS = 4000;

/** Three-phase carrier PWM, third-harmonic injection, mf 15 (a multiple of 3: the phases are exact shifts). */
const design: InverterDesign = {
  vdc: 600,
  fundamentalFrequency: F,
  carrierFrequency: 15 * F,
  modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'third-harmonic' },
  load: { r: R, l: L, emf: EMF },
};

/** The phasor solution of one phase: current phasors by order (0 … ORDERS). */
function phasorCurrents(waveform: Waveform, emfPhase: number): Complex[] {
  return harmonics(waveform, ORDERS).map((h) => {
    const v =
      h.order === 0 ? { re: h.amplitude * Math.cos(h.phase), im: 0 } : phasor(h.amplitude, h.phase);
    if (h.order === 1) {
      const e = phasor(EMF.amplitude, emfPhase);
      v.re -= e.re;
      v.im -= e.im;
    }
    return h.order === 0
      ? { re: v.re / R, im: 0 }
      : divide(v, { re: R, im: TAU * F * L * h.order });
  });
}

/** Σ|jumps| of a waveform, volts: bounds its harmonics by J/(πn) (standard Fourier analysis). */
const totalJump = (w: Waveform): number =>
  w.levels.reduce(
    (sum, level, k) =>
      sum + Math.abs(level - (w.levels[(k + w.levels.length - 1) % w.levels.length] as number)),
    0,
  );

describe('motor load: three-phase R–L with back-EMF (issue 12, capability 7)', () => {
  const points = 1200;
  const report = analyseDesign(design, { points });
  const phaseVoltages = report.voltages.filter((v) => v.name.endsWith('to star point'));

  it('gives all three phase currents, each labelled by its phase', () => {
    expect(report.currents.map((c) => c.phase)).toEqual(['a', 'b', 'c']);
    expect(report.currents.map((c) => c.load?.name)).toEqual([
      'load current, phase a',
      'load current, phase b',
      'load current, phase c',
    ]);
    expect(report.motor?.phases.map((p) => p.phase)).toEqual(['a', 'b', 'c']);
    expect(phaseVoltages).toHaveLength(3);
  });

  it('matches the phasor solution per harmonic in each phase: fundamental, RMS and waveform', () => {
    phaseVoltages.forEach((voltage, k) => {
      const current = report.currents[k]?.load;
      if (!current) throw new Error(`no load current in phase ${k}`);
      // Phase k's EMF lags phase a's by k·2π/3 (a balanced, positive-sequence machine).
      const solved = phasorCurrents(voltage.waveform, EMF.phase - (k * TAU) / 3);
      const first = solved[1] as Complex;
      assertInDelta(current.fundamental, abs(first), 1e-9 * abs(first), `I1 phase ${k}`);
      assertInDelta(current.fundamentalPhase, Math.atan2(first.im, first.re), 1e-9, `∠I1 ${k}`);
      // RMS by Parseval over the orders summed; the tail beyond N adds at most
      // Σ_{n>N} (J/(πn))²/(2(nωL)²) < J²/(6π²ω²L²N³) to the mean square.
      let meanSquare = (solved[0] as Complex).re ** 2;
      for (let n = 1; n < solved.length; n++) meanSquare += abs(solved[n] as Complex) ** 2 / 2;
      const jump = totalJump(voltage.waveform);
      const tail = jump ** 2 / (6 * Math.PI ** 2 * (TAU * F * L) ** 2 * ORDERS ** 3);
      assertInDelta(current.rms ** 2, meanSquare, tail + 1e-9 * meanSquare, `rms² phase ${k}`);
      // Distortion (Mohan et al. 2003, ch. 5): THD = √(I² − I₁²)/I₁, DF = I₁/I.
      const i1 = abs(first) / Math.SQRT2;
      assertInDelta(current.distortionFactor, i1 / current.rms, 1e-12, `DF ${k}`);
      assertInDelta(current.thd ?? NaN, Math.sqrt(meanSquare - i1 * i1) / i1, 1e-6, `THD ${k}`);
      // The waveform: the truncated series differs from the exact current by at most
      // Σ_{n>N} J/(πn)/(nωL) < J/(π·ωL·N).
      const bound = jump / (Math.PI * TAU * F * L * ORDERS);
      current.series.values.forEach((value, j) => {
        const theta = current.series.angles[j] as number;
        let sum = (solved[0] as Complex).re;
        for (let n = 1; n < solved.length; n++) {
          const p = solved[n] as Complex;
          sum += p.re * Math.sin(n * theta) + p.im * Math.cos(n * theta);
        }
        if (j % 50 === 0) assertInDelta(value, sum, bound, `i(θ) phase ${k} at ${theta}`);
      });
    });
  });

  it('has b and c equal to a shifted by ∓120°', () => {
    const [a, b, c] = report.currents.map((p) => p.load?.series.values ?? []);
    const third = points / 3;
    const peak = report.currents[0]?.load?.peak ?? 1;
    for (let j = 0; j < points; j++) {
      // i_b(θ) = i_a(θ − 2π/3), i_c(θ) = i_a(θ + 2π/3): balanced phases (a fact of circuit theory).
      assertInDelta(
        b?.[j] ?? NaN,
        a?.[(j - third + points) % points] ?? NaN,
        1e-9 * peak,
        `b ${j}`,
      );
      assertInDelta(c?.[j] ?? NaN, a?.[(j + third) % points] ?? NaN, 1e-9 * peak, `c ${j}`);
    }
    const [ra, rb, rc] = report.currents.map((p) => p.load?.ripplePeakToPeak ?? NaN);
    assertInDelta(rb ?? NaN, ra ?? NaN, 1e-9 * (ra ?? 1), 'ripple b');
    assertInDelta(rc ?? NaN, ra ?? NaN, 1e-9 * (ra ?? 1), 'ripple c');
  });

  it('resolves the torque-producing fundamental against each EMF and balances the power', () => {
    const motor = report.motor;
    if (!motor) throw new Error('no motor figures');
    let converted = 0;
    let delivered = 0;
    phaseVoltages.forEach((voltage, k) => {
      const emf = phasor(EMF.amplitude, EMF.phase - (k * TAU) / 3);
      const solved = phasorCurrents(voltage.waveform, EMF.phase - (k * TAU) / 3);
      const first = solved[1] as Complex;
      // In-phase part of I₁ along E: Re(I₁·conj(E))/|E| (phasor projection).
      const along = (first.re * emf.re + first.im * emf.im) / EMF.amplitude;
      const figures = motor.phases[k];
      assertInDelta(figures?.torqueCurrent ?? NaN, along, 1e-9 * abs(first), `I_torque ${k}`);
      assertInDelta(
        Math.hypot(figures?.torqueCurrent ?? NaN, figures?.quadratureCurrent ?? NaN),
        abs(first),
        1e-9 * abs(first),
        `|I1| ${k}`,
      );
      converted += 0.5 * (first.re * emf.re + first.im * emf.im);
      // Mean power out of the bridge phase: ½·Σ_n Re(V_n·conj(I_n)) (+ V₀I₀), by orthogonality.
      harmonics(voltage.waveform, ORDERS).forEach((h, n) => {
        const i = solved[n] as Complex;
        if (n === 0) delivered += h.amplitude * Math.cos(h.phase) * i.re;
        else {
          const v = phasor(h.amplitude, h.phase);
          delivered += 0.5 * (v.re * i.re + v.im * i.im);
        }
      });
    });
    assertInDelta(motor.electromagneticPower, converted, 1e-9 * Math.abs(converted), 'P_em');
    assertInDelta(motor.torquePerPolePair, converted / (TAU * F), 1e-9 * Math.abs(converted), 'T');
    // Power balance (Tellegen; standard circuit analysis): what the bridge delivers is what R
    // dissipates plus what the EMFs take in.
    const resistive = report.loadPower ?? NaN;
    assertInDelta(resistive + motor.electromagneticPower, delivered, 1e-6 * delivered, 'balance');
    expect(motor.electromagneticPower).toBeGreaterThan(0);
  });

  it('gives no motor figures without an EMF, and one phase for a single-phase bridge', () => {
    expect(analyseDesign({ ...design, load: { r: R, l: L } }).motor).toBeNull();
    const single = analyseDesign({
      vdc: 400,
      fundamentalFrequency: F,
      carrierFrequency: 21 * F,
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.8 },
      load: { r: R, l: L, emf: EMF },
    });
    expect(single.motor?.phases.map((p) => p.phase)).toEqual(['a']);
    const voltage = single.voltages[0];
    if (!voltage) throw new Error('no bridge voltage');
    const first = phasorCurrents(voltage.waveform, EMF.phase)[1] as Complex;
    const current = single.currents[0]?.load;
    assertInDelta(current?.fundamental ?? NaN, abs(first), 1e-9 * abs(first), 'single-phase I1');
  });
});

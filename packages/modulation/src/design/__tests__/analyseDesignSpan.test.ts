import { describe, expect, it } from 'vitest';
import type { MosfetDevice } from '../../losses/lossTypes.js';
import { TAU } from '../../math.js';
import { harmonics } from '../../spectrum/harmonics.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import type { Waveform } from '../../waveform/Waveform.js';
import { waveformMeanSquare } from '../../waveform/waveformMeanSquare.js';
import { analyseDesign } from '../analyseDesign.js';
import { analyseDesignSpan } from '../analyseDesignSpan.js';
import { asynchronousDesignSpectra } from '../asynchronousDesignSpectra.js';
import { designCarrierSpan } from '../designCarrierSpan.js';
import type { RationalRatio } from '../designRationalRatio.js';
import { designSpanMaxOrder } from '../designSpanMaxOrder.js';
import { DESIGN_CAUTION } from '../analyseDesign.js';
import type { DesignReport } from '../DesignReport.js';
import type { InverterDesign } from '../InverterDesign.js';
import type { SpanLabelledHarmonic } from '../labelSpanHarmonics.js';
import { modulationVoltages } from '../modulationVoltages.js';

const vdc = 600;
const mosfet: MosfetDevice = {
  kind: 'mosfet',
  rdsOn: 0.02,
  eon: 1e-4,
  eoff: 1e-4,
  err: 1e-5,
  referenceVoltage: 800,
  referenceCurrent: 50,
};

/** |a − b| within `relative`·|b| (and an absolute floor for values near zero). */
const close = (actual: number, expected: number, relative: number, label: string): void =>
  assertInDelta(actual, expected, relative * Math.abs(expected) + 1e-9, label);

/** Sum of |jumps| of a span's waveform, volts (the wrap-round jump included). */
const totalJump = ({ levels }: Waveform): number =>
  levels.reduce(
    (sum, level, k) => sum + Math.abs(level - (levels[k === 0 ? levels.length - 1 : k - 1] ?? 0)),
    0,
  );

describe('analyseDesign at a non-integer frequency ratio (analyseDesignSpan)', () => {
  const threePhase: InverterDesign = {
    vdc,
    fundamentalFrequency: 37,
    carrierFrequency: 1000,
    modulation: { method: 'three-phase', ma: 0.8, zeroSequence: 'none' },
    load: { r: 4, l: 0.012 },
    device: mosfet,
  };

  it('with q = 1 the span analysis gives the integer report (every figure to rounding)', () => {
    // The same design read by the one-period path and by the span path with p/q = mf/1: the two
    // are separate code (subharmonicSpectrum against waveformThd, the superposed EMF against
    // rlSteadyState's), so agreement checks the span's generalisation at its limit.
    const designs: InverterDesign[] = [
      { ...threePhase, fundamentalFrequency: 50, carrierFrequency: 1050 },
      {
        ...threePhase,
        fundamentalFrequency: 50,
        carrierFrequency: 1050,
        modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'dpwm1' },
        load: { r: 3, l: 0.01, emf: { amplitude: 150, phase: -0.4 } },
      },
      {
        vdc,
        fundamentalFrequency: 50,
        carrierFrequency: 750,
        modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.7 },
        load: { r: 5, l: 0.02 },
        device: mosfet,
      },
    ];
    for (const design of designs) {
      const mf = (design.carrierFrequency as number) / design.fundamentalFrequency;
      const whole = analyseDesign(design, { maxOrder: 200, points: 256 });
      const span = analyseDesignSpan(
        design,
        { p: mf, q: 1, error: 0 },
        { maxOrder: 200, points: 256, caution: DESIGN_CAUTION },
      );
      const label = `${design.modulation.method} mf ${mf}`;
      for (const key of ['fundamental', 'rms', 'thd', 'wthd', 'spectrumThd'] as const)
        close(span.bridge[key], whole.bridge[key], 1e-9, `${label} bridge ${key}`);
      span.bridge.spectrum.forEach((h, n) => {
        const w = whole.bridge.spectrum[n];
        expect(h.order).toBe(w?.order);
        expect(h.label).toBe(w?.label);
        assertInDelta(h.amplitude, w?.amplitude ?? NaN, 1e-9 * vdc, `${label} order ${n}`);
      });
      span.currents.forEach((c, k) => {
        const w = whole.currents[k];
        for (const key of ['rms', 'fundamental', 'fundamentalPhase', 'rippleRms'] as const)
          close(c.inverter[key], w?.inverter[key] ?? NaN, 1e-9, `${label} current ${key}`);
        // The integer report's peak is exact (bisection with an EMF); the span's is read at the
        // edges and 4096+ grid samples: exact without an EMF, within 0.1 % with one.
        close(c.inverter.peak, w?.inverter.peak ?? NaN, 1e-3, `${label} peak`);
        close(
          c.inverter.ripplePeakToPeak,
          w?.inverter.ripplePeakToPeak ?? NaN,
          1e-9,
          `${label} ripple`,
        );
      });
      close(span.loadPower ?? NaN, whole.loadPower ?? NaN, 1e-9, `${label} load power`);
      close(span.dcLink?.rms ?? NaN, whole.dcLink?.rms ?? NaN, 1e-9, `${label} DC-link rms`);
      close(span.losses?.total ?? NaN, whole.losses?.total ?? NaN, 1e-9, `${label} losses`);
      expect(span.switching).toEqual(whole.switching);
      if (whole.commonMode) {
        close(span.commonMode?.rms ?? NaN, whole.commonMode.rms, 1e-12, `${label} common mode`);
        expect(span.commonMode?.stepsPerPeriod).toBe(whole.commonMode.stepsPerPeriod);
      }
      expect(span.limitCheck.table.map((r) => r.pass)).toEqual(
        whole.limitCheck.table.map((r) => r.pass),
      );
      expect(span.carrierSpan).toMatchObject({ p: mf, q: 1, carrierError: 0 });
      expect(whole.carrierSpan).toBeUndefined();
    }
  });

  it('states p/q, the carrier analysed and its error', () => {
    // 1000/37 is exact (q = 37); 37.3 Hz is no ratio with q ≤ 64: its nearest is stated with the
    // carrier error in hertz (continued fractions, a fact of number theory).
    const exact = analyseDesign(threePhase, { maxOrder: 60, points: 256 });
    expect(exact.carrierSpan).toEqual({
      p: 1000,
      q: 37,
      carrierFrequency: expect.closeTo(1000, 9) as number,
      carrierError: expect.closeTo(0, 9) as number,
      baseFrequency: 1,
    });
    close(exact.frequencyRatio ?? NaN, 1000 / 37, 1e-15, 'p/q');
    const near = analyseDesign(
      { ...threePhase, fundamentalFrequency: 37.3 },
      { maxOrder: 50, points: 256 },
    );
    const { p, q, carrierError, carrierFrequency } = near.carrierSpan ?? {
      p: 0,
      q: 0,
      carrierError: NaN,
      carrierFrequency: NaN,
    };
    expect(q).toBeGreaterThan(1);
    expect(q).toBeLessThanOrEqual(64);
    close(carrierFrequency, (p / q) * 37.3, 1e-12, 'analysed carrier');
    close(carrierError, (p / q) * 37.3 - 1000, 1e-9, 'carrier error');
    // Nearest with q ≤ 64: no farther from the ratio than any other fraction with q ≤ 64, for
    // example round(64·x)/64 (so within 1/128 at worst).
    const x = 1000 / 37.3;
    expect(Math.abs(carrierError / 37.3)).toBeLessThanOrEqual(
      Math.abs(Math.round(64 * x) / 64 - x) + 1e-12,
    );
  });

  it('its spectrum is asynchronousDesignSpectra’s, with the components labelled by kind', () => {
    const maxOrder = 60;
    const report = analyseDesign(threePhase, { maxOrder, points: 256 });
    const spectra = asynchronousDesignSpectra(threePhase, { maxOrder });
    const reference = spectra.voltages[0]?.spectrum;
    expect(report.bridge.name).toBe(spectra.voltages[0]?.name);
    close(report.bridge.thd, reference?.thd ?? NaN, 1e-12, 'THD');
    close(report.bridge.wthd, reference?.wthd ?? NaN, 1e-12, 'WTHD');
    const spectrum = report.bridge.spectrum as SpanLabelledHarmonic[];
    expect(spectrum).toHaveLength(37 * maxOrder + 1);
    spectrum.forEach((h, n) => {
      const c = reference?.components[n];
      expect(h.order).toBe(c?.order);
      assertInDelta(h.amplitude, c?.amplitude ?? NaN, 1e-12 * vdc, `component ${n}`);
      expect(h.kind).toBe(n % 37 === 0 ? 'harmonic' : n < 37 ? 'sub-harmonic' : 'inter-harmonic');
      // |m·p/q + k| = order with k whole: each component sits on a sideband of a carrier group
      // (folded back when below zero frequency).
      assertInDelta(
        h.order,
        Math.abs(h.carrierGroup * (1000 / 37) + h.sideband),
        1e-9,
        `sideband ${n}`,
      );
    });
    // The carrier's own component: group 1, sideband 0, labelled mf (Holmes and Lipo 2003, ch. 3).
    const carrier = spectrum[1000];
    expect([carrier?.carrierGroup, carrier?.sideband, carrier?.label]).toEqual([1, 0, 'mf']);
  });

  it('Parseval over the span: voltage and current mean squares are the sums of their components', () => {
    // Single-phase bipolar at mf = 7.5 (15/2): the span of two periods. Component n of the span
    // (harmonics, exact) drives the load at n·f₁/2, I_n = V_n/|R + j·n·ω₁/2·L| (circuit theory).
    // Tails above N = 20000 span orders: |V_n| ≤ J/(π·n) with J the sum of |jumps|, so the
    // voltage's tail is at most J²/(2π²N) and the current's at most J²/(6π²N³(ω₁L/2)²)
    // (Σ_{n>N} 1/n² < 1/N, Σ 1/n⁴ < 1/(3N³)).
    const design: InverterDesign = {
      vdc,
      fundamentalFrequency: 50,
      carrierFrequency: 375,
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
      load: { r: 5, l: 0.01 },
    };
    const report = analyseDesign(design, { maxOrder: 99, points: 256 });
    expect(report.carrierSpan).toMatchObject({ p: 15, q: 2 });
    const waveform = (report.voltages[0] as { waveform: Waveform }).waveform;
    const N = 20_000;
    const spectrum = harmonics(waveform, N);
    const spanOmega = (TAU * 50) / 2;
    let voltageSum = 0;
    let currentSum = 0;
    for (const { order: n, amplitude } of spectrum) {
      voltageSum += n === 0 ? amplitude * amplitude : (amplitude * amplitude) / 2;
      const z = Math.hypot(5, n * spanOmega * 0.01);
      currentSum += n === 0 ? (amplitude / 5) ** 2 : (amplitude / z) ** 2 / 2;
    }
    const jump = totalJump(waveform);
    const voltageTail = jump ** 2 / (2 * Math.PI ** 2 * N);
    const currentTail = jump ** 2 / (6 * Math.PI ** 2 * N ** 3 * (spanOmega * 0.01) ** 2);
    const voltageMeanSquare = report.bridge.rms ** 2;
    expect(voltageMeanSquare).toBeCloseTo(waveformMeanSquare(waveform), 9);
    expect(voltageMeanSquare - voltageSum).toBeGreaterThanOrEqual(-1e-9 * voltageMeanSquare);
    expect(voltageMeanSquare - voltageSum).toBeLessThanOrEqual(voltageTail);
    const current = report.currents[0]?.load;
    const currentMeanSquare = (current?.rms ?? NaN) ** 2;
    assertInDelta(
      currentMeanSquare,
      currentSum,
      currentTail + 1e-9 * currentSum,
      'current Parseval',
    );
    // The report's THD counts the sub-harmonics: THD² = (⟨v²⟩ − V₁²/2)/(V₁²/2), the mean 0.
    const v1 = report.bridge.fundamental;
    close(
      report.bridge.thd,
      Math.sqrt((voltageMeanSquare - (v1 * v1) / 2) / ((v1 * v1) / 2)),
      1e-9,
      'THD',
    );
  });

  it('the load current’s fundamental is V₁/|R + jω₁L| at the fundamental, lagging by its angle', () => {
    // Circuit theory: the fundamental phasor I₁ = V₁/(R + jω₁L), with V₁ the bridge's (phase a
    // to star point) fundamental; with a back-EMF, (V₁ − E)/(R + jω₁L).
    const report = analyseDesign(threePhase, { maxOrder: 50, points: 256 });
    const omegaL = TAU * 37 * 0.012;
    const current = report.currents[0]?.load;
    close(
      current?.fundamental ?? NaN,
      report.bridge.fundamental / Math.hypot(4, omegaL),
      1e-9,
      'I₁',
    );
    close(
      current?.fundamentalPhase ?? NaN,
      report.bridge.fundamentalPhase - Math.atan2(omegaL, 4),
      1e-9,
      'phase',
    );
    const emf = { amplitude: 200, phase: -0.3 };
    const motor = analyseDesign(
      { ...threePhase, load: { r: 4, l: 0.012, emf } },
      { maxOrder: 50, points: 256 },
    );
    const v = motor.bridge;
    const re = v.fundamental * Math.cos(v.fundamentalPhase) - emf.amplitude * Math.cos(emf.phase);
    const im = v.fundamental * Math.sin(v.fundamentalPhase) - emf.amplitude * Math.sin(emf.phase);
    close(
      motor.currents[0]?.load?.fundamental ?? NaN,
      Math.hypot(re, im) / Math.hypot(4, omegaL),
      1e-9,
      'I₁ with EMF',
    );
    // The EMF changes only the fundamental: the ripple is the same current's.
    close(
      motor.currents[0]?.load?.rippleRms ?? NaN,
      current?.rippleRms ?? NaN,
      1e-9,
      'ripple unchanged by the EMF',
    );
    expect(motor.motor?.phases).toHaveLength(3);
  });

  it('sub-harmonics: present at a low non-integer mf, absent from a synchronous pattern', () => {
    // Holmes and Lipo 2003, ch. 3: the first carrier group's sidebands sit at mf ± k; at mf = 2.5
    // (5/2) the sideband mf − 2 lands at half the fundamental. Naturally sampled two-level PWM
    // with output ±vdc: A_mk = (4·vdc/(mπ))·|J_k(m·ma·π/2)·sin((m + k)·π/2)| (the double Fourier
    // series, from memory), so 4·vdc/π·J₂(0.4π) at ma 0.8. The only other component landing on
    // f₁/2 that is not zero by the sine is 3mf − 8 (folded), (4·vdc/3π)·J₈(1.2π) ≈ 0.8 V: 1 %.
    const low: InverterDesign = {
      vdc,
      fundamentalFrequency: 50,
      carrierFrequency: 125,
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
    };
    const report = analyseDesign(low, { maxOrder: 50, points: 256 });
    const half = (report.bridge.spectrum as SpanLabelledHarmonic[])[1];
    expect([half?.order, half?.kind, half?.label]).toEqual([0.5, 'sub-harmonic', 'mf−2']);
    // J₂(x) = Σ (−1)^k (x/2)^(2k+2)/(k!(k+2)!), summed to convergence.
    let bessel = 0;
    const x = 0.4 * Math.PI;
    for (let k = 0, term = (x / 2) ** 2 / 2; k < 20; k++) {
      bessel += term;
      term *= -((x / 2) ** 2) / ((k + 1) * (k + 3));
    }
    close(half?.amplitude ?? NaN, ((4 * vdc) / Math.PI) * bessel, 1e-2, 'sub-harmonic at f₁/2');
    // A synchronous pattern (mf = 4) read over the same two-period span: every odd span order
    // (the would-be sub- and inter-harmonics) is zero to rounding.
    const voltages = modulationVoltages(
      { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8, vdc, mf: 4 },
      { fundamentalPeriods: 2 },
    );
    const spanSpectrum = harmonics((voltages.phases[0] as { waveform: Waveform }).waveform, 100);
    for (const h of spanSpectrum)
      if (h.order % 2 === 1) expect(h.amplitude).toBeLessThan(1e-9 * vdc);
  });

  it('per-second figures over the span: device frequency is the carrier, DC power the load’s', () => {
    const report: DesignReport = analyseDesign(threePhase, { maxOrder: 50, points: 256 });
    // Continuous carrier PWM turns each device on once a carrier period (a fact of the trade):
    // the average over the span is the carrier frequency, and leg a's edges 2·mf a period.
    close(report.switching?.averageDeviceFrequency ?? NaN, 1000, 1e-12, 'device frequency');
    close(report.switching?.legEdgesPerPeriod ?? NaN, (2 * 1000) / 37, 1e-12, 'edges a period');
    // Three legs each stepping twice a carrier period: six common-mode steps (Hava and Ün 2009).
    close(report.commonMode?.stepsPerCarrierPeriod ?? NaN, 6, 1e-12, 'steps a carrier period');
    // An ideal bridge: vdc·mean(i_dc) is the power the R loads take (energy balance); the grid
    // mean against the exact R·I² within 0.1 %.
    close(vdc * (report.dcLink?.mean ?? NaN), report.loadPower ?? NaN, 1e-3, 'DC power');
    expect(report.losses?.total).toBeGreaterThan(0);
  });

  it('bounds the span’s orders by its cost before any work (designSpanMaxOrder)', () => {
    // 1000/37: min(5000, 100000/37 = 2702, 2e7/(1000·37) = 540) orders.
    const span = designCarrierSpan(threePhase);
    expect(span).toMatchObject({ p: 1000, q: 37 });
    expect(designSpanMaxOrder(threePhase, span as RationalRatio)).toBe(540);
    expect(designCarrierSpan({ ...threePhase, carrierFrequency: 37 * 27 })).toBeNull();
  });

  it('refuses a costly span, with or without a filter, and a multilevel carrier, naming the field', () => {
    // 3000/37 with a filter: its network solved to ⌈30000/37⌉ + 10 = 821 orders, above the bound
    // min(5000, 20000/37, 2e7/(3000·37)) = 180 (analyseDesignSpanFilter.test.ts has the spans it takes).
    expect(
      rangeErrorField(() =>
        analyseDesign({ ...threePhase, carrierFrequency: 3000, filter: { l: 1e-3, c: 10e-6 } }),
      ),
    ).toBe('carrierFrequency');
    // 999.7 Hz over 7.3 Hz: nearest 7532/55, p·q = 414260 > 2e7/50 (the span's 50 orders cost too much).
    expect(
      rangeErrorField(() =>
        analyseDesign({ ...threePhase, fundamentalFrequency: 7.3, carrierFrequency: 999.7 }),
      ),
    ).toBe('carrierFrequency');
    expect(rangeErrorField(() => analyseDesign(threePhase, { maxOrder: 600 }))).toBe('maxOrder');
    expect(
      rangeErrorField(() =>
        analyseDesign({
          vdc,
          fundamentalFrequency: 50,
          carrierFrequency: 1025,
          modulation: {
            method: 'multilevel-carrier',
            topology: 'npc',
            levels: 3,
            phaseCount: 3,
            carriers: 'pd',
            ma: 0.8,
          },
        }),
      ),
    ).toBe('carrierFrequency');
  });
});

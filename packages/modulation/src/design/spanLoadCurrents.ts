import { currentDistortion } from '../load/currentDistortion.js';
import { rlCurrentAt } from '../load/rlCurrentAt.js';
import type { RlLoadOptions } from '../load/RlLoad.js';
import { rlSteadyState } from '../load/rlSteadyState.js';
import { TAU } from '../math.js';
import {
  complexAbs,
  complexDivide,
  complexSubtract,
  phasorOf,
  type Complex,
} from '../numeric/complex.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
import { harmonics } from '../spectrum/harmonics.js';
import { withFieldPrefix } from '../validation/withFieldPrefix.js';
import type { Waveform } from '../waveform/Waveform.js';
import type { CurrentFigures, PhaseCurrents } from './DesignReport.js';

/** What {@link spanLoadCurrents} returns for one phase. */
export interface SpanLoadCurrents {
  currents: PhaseCurrents;
  /** Mean power into r over the span, watts. */
  power: number;
  /** The current at the span angles 2πj/S, amperes (the DC-link and loss figures' grid). */
  inverterSamples: Float64Array;
}

/**
 * The exact periodic steady-state current of an unfiltered phase whose voltage repeats only
 * after q fundamental periods (a carrier at mf = p/q), over that span mapped onto [0, 2π):
 * L di/dt + R i = v − e with v the span's waveform and e the back-EMF at the fundamental, which
 * is order q of the span. By superposition (the circuit is linear) i = i_v − i_e: i_v is
 * `rlSteadyState`/`rlCurrentAt` of the span at the span frequency f₁/q (exact exponentials per
 * segment), i_e the EMF's sinusoidal steady state E/(R + jω₁L). The fundamental phasor is
 * (V₁ − E)/(R + jω₁L) with V₁ the span's order-q phasor (circuit theory), so the EMF moves only
 * the fundamental and the mean square is exact: ⟨i²⟩ = ⟨i_v²⟩ − |I_v1|²/2 + |I₁|²/2.
 * Peak and ripple peak-to-peak are read at every edge and on the grid of S angles (exact without
 * an EMF, whose current is monotone between edges). Ripple is i − i₁; THD is over every
 * component but the fundamental, sub-harmonics included.
 * Internal: part of analyseDesign for a non-integer frequency ratio.
 * @param load - r ohm, l henry, frequency the fundamental f₁ in hertz, emf at the fundamental
 */
export function spanLoadCurrents(
  waveform: Waveform,
  load: RlLoadOptions,
  context: {
    /** q, the fundamental periods the waveform spans. */
    fundamentalPeriods: number;
    phase: PhaseCurrents['phase'];
    /** Added to each current's name (`, phase a` on a three-phase bridge). */
    suffix: string;
    /** Samples of the chart series over the span. */
    points: number;
    /** S, the grid's size over the span. */
    gridSize: number;
  },
): SpanLoadCurrents {
  const { fundamentalPeriods: q, phase, suffix, points, gridSize } = context;
  const spanLoad: RlLoadOptions = { r: load.r, l: load.l, frequency: load.frequency / q };
  const steady = withFieldPrefix('load.', () => rlSteadyState(waveform, spanLoad));
  const voltage = harmonics(waveform, q)[q] as Harmonic;
  const impedance = { re: load.r, im: TAU * load.frequency * load.l };
  const free = complexDivide(phasorOf(voltage.amplitude, voltage.phase), impedance);
  const emf = load.emf ? phasorOf(load.emf.amplitude, load.emf.phase) : { re: 0, im: 0 };
  const first = complexDivide(emf, impedance);
  const fundamentalPhasor = complexSubtract(free, first);
  const fundamental = complexAbs(fundamentalPhasor);
  const meanSquare = Math.max(
    0,
    steady.rmsCurrent ** 2 - complexAbs(free) ** 2 / 2 + (fundamental * fundamental) / 2,
  );
  // A phasor's sinusoid at the fundamental, which is order q of the span angle φ.
  const sinusoid = (c: Complex, phi: number): number =>
    c.re * Math.sin(q * phi) + c.im * Math.cos(q * phi);
  const currentAt = (angles: readonly number[]): number[] =>
    rlCurrentAt(waveform, angles, spanLoad).map((i, k) => i - sinusoid(first, angles[k] as number));
  const angles = [
    ...waveform.edges,
    ...Array.from({ length: gridSize }, (_, k) => (TAU * k) / gridSize),
  ];
  const sampled = currentAt(angles);
  let peak = 0;
  let low = Infinity;
  let high = -Infinity;
  sampled.forEach((current, k) => {
    const ripple = current - sinusoid(fundamentalPhasor, angles[k] as number);
    peak = Math.max(peak, Math.abs(current));
    if (ripple < low) low = ripple;
    if (ripple > high) high = ripple;
  });
  const rms = Math.sqrt(meanSquare);
  const seriesAngles = Array.from({ length: points }, (_, k) => (TAU * k) / points);
  const figures: CurrentFigures = {
    name: `load current${suffix}`,
    rms,
    peak,
    fundamental,
    fundamentalPhase: Math.atan2(fundamentalPhasor.im, fundamentalPhasor.re),
    rippleRms: Math.sqrt(Math.max(0, meanSquare - (fundamental * fundamental) / 2)),
    ...currentDistortion(rms, fundamental),
    ripplePeakToPeak: high - low,
    series: { angles: seriesAngles, values: currentAt(seriesAngles) },
  };
  return {
    currents: {
      phase,
      inverter: { ...figures, name: `inverter (switch) current${suffix}` },
      capacitor: null,
      load: figures,
    },
    power: load.r * meanSquare,
    inverterSamples: Float64Array.from(sampled.slice(waveform.edges.length)),
  };
}

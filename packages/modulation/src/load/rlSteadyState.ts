import { TAU } from '../math.js';
import { assertWaveform } from '../waveform/assertWaveform.js';
import type { Waveform } from '../waveform/Waveform.js';
import { assertRlLoad } from './assertRlLoad.js';
import { nonFiniteLoadError } from './nonFiniteLoadError.js';
import type { RlLoadOptions } from './RlLoad.js';
import {
  currentInSegment,
  rlPiecewiseSolution,
  type RlPiecewiseSolution,
  type RlSegment,
} from './rlPiecewiseSolution.js';

/** Periodic steady-state figures of an R–L(–EMF) load current; a plain serialisable object. */
export interface RlSteadyState {
  /** RMS load current over one period, amperes. */
  rmsCurrent: number;
  /** Mean (DC) load current, amperes. */
  meanCurrent: number;
  /** Largest instantaneous current over the period, amperes. */
  peakCurrent: number;
  /** Smallest (most negative) instantaneous current over the period, amperes. */
  minCurrent: number;
  /** peakCurrent − minCurrent, amperes. */
  peakToPeakCurrent: number;
  /** Current at θ = 0 (the periodic initial condition i(0) = i(2π)), amperes. */
  initialCurrent: number;
  /** Mean power absorbed by r, R·I_rms², watts. */
  power: number;
  /** Mean power delivered by the source waveform, mean of v·i, watts. */
  sourcePower: number;
  /**
   * Mean power absorbed by the back-EMF, mean of e·i, watts (0 without EMF). A motor draws
   * mechanical power when it is positive. sourcePower = power + emfPower (the inductance
   * stores no net energy over a period).
   */
  emfPower: number;
}

/** Sub-interval (radians) over which di/dθ is bracketed when a back-EMF makes i non-monotone. */
const EXTREMUM_SCAN_STEP = Math.PI / 32;

/**
 * Exact periodic steady state of a series R–L load with optional sinusoidal back-EMF,
 * L di/dt + R i = v(t) − e(t), for a piecewise-constant v (standard circuit analysis:
 * first-order exponentials per segment, periodic initial condition i(0) = i(T) solved in closed
 * form; the EMF's contribution is its own sinusoidal steady state −E/|R + jωL|, added by
 * superposition). RMS, mean and powers come from closed-form integrals of the exponentials,
 * not from samples.
 *
 * Without EMF the current is monotone on each segment, so its extremes are at edges and exact.
 * With an EMF the extremes inside a segment are found by bisection on sign changes of di/dθ,
 * bracketed on sub-intervals of π/32 rad (a pair of extrema closer than that, a bump of
 * negligible height, can be missed).
 *
 * @param waveform - one period of the source voltage, volts
 * @param options - `r` ohm > 0, `l` henry ≥ 0, `frequency` hertz > 0, `emf` optional
 *   `{ amplitude (peak volts ≥ 0), phase (radians) }` with e(θ) = amplitude·sin(θ + phase)
 * @throws ParameterRangeError / ParameterTypeError naming the field (`r`, `l`, `frequency`,
 *   `emf.amplitude`, `emf.phase`, `waveform.*`); also a ParameterRangeError when valid but
 *   extreme inputs make a figure overflow or lose all precision in double arithmetic (for
 *   example r = 5e-324 Ω, where volts/r is infinite, or ωL/R beyond 1.8e308): it names the
 *   input that made the result non-finite instead of returning NaN or ∞.
 */
export function rlSteadyState(waveform: Waveform, options: RlLoadOptions): RlSteadyState {
  assertWaveform(waveform);
  assertRlLoad(options);
  const solution = rlPiecewiseSolution(waveform, options);
  const { segments, emfCurrentAmplitude: p, emfCurrentPhase: beta } = solution;
  const emfAmplitude = options.emf?.amplitude ?? 0;
  const emfPhase = options.emf?.phase ?? 0;
  let integralCurrent = 0;
  let integralSquare = 0;
  let integralSourcePower = 0;
  let integralEmfPower = 0;
  for (const segment of segments) {
    const { start, width, level } = segment;
    const linear = integralOfDrivenCurrent(solution, segment);
    const emfPart = p * integralOfSine(start + beta, width);
    integralCurrent += linear;
    integralSquare += integralOfDrivenSquare(solution, segment);
    integralSquare += 2 * p * integralOfDrivenTimesSine(solution, segment, beta);
    integralSourcePower += level * (linear + emfPart);
    integralEmfPower += emfAmplitude * integralOfDrivenTimesSine(solution, segment, emfPhase);
  }
  // Full-period means of the EMF terms: mean sin² = 1/2, mean sin(θ+φ)·sin(θ+β) = cos(φ−β)/2.
  const meanSquare = Math.max(0, integralSquare / TAU + (p * p) / 2);
  const emfPower = integralEmfPower / TAU + (emfAmplitude * p * Math.cos(emfPhase - beta)) / 2;
  const { peak, min } = currentExtremes(solution);
  const rmsCurrent = Math.sqrt(meanSquare);
  const first = segments[0] as RlSegment;
  return assertFiniteSteadyState(waveform, options, {
    rmsCurrent,
    meanCurrent: integralCurrent / TAU,
    peakCurrent: peak,
    minCurrent: min,
    peakToPeakCurrent: peak - min,
    initialCurrent: currentInSegment(solution, first, 0),
    power: options.r * meanSquare,
    sourcePower: integralSourcePower / TAU,
    emfPower,
  });
}

/** Returns `result` when every figure is finite; otherwise throws naming the input to blame. */
function assertFiniteSteadyState(
  waveform: Waveform,
  options: RlLoadOptions,
  result: RlSteadyState,
): RlSteadyState {
  const bad = (Object.keys(result) as (keyof RlSteadyState)[]).find(
    (key) => !Number.isFinite(result[key]),
  );
  if (bad === undefined) return result;
  throw nonFiniteLoadError(waveform, options, bad);
}

/** ∫ i_v dθ over the segment: c·w + d·τ·(1 − e^{−w/τ}). */
function integralOfDrivenCurrent({ tau }: RlPiecewiseSolution, s: RlSegment): number {
  const rise = tau === 0 ? 0 : -Math.expm1(-s.width / tau);
  return s.asymptote * s.width + s.offset * tau * rise;
}

/** ∫ i_v² dθ over the segment: c²w + 2cdτ(1 − a) + d²(τ/2)(1 − a²), a = e^{−w/τ}. */
function integralOfDrivenSquare({ tau }: RlPiecewiseSolution, s: RlSegment): number {
  const { asymptote: c, offset: d, width } = s;
  if (tau === 0) return c * c * width;
  const rise = -Math.expm1(-width / tau);
  const riseTwice = -Math.expm1((-2 * width) / tau);
  return c * c * width + 2 * c * d * tau * rise + d * d * (tau / 2) * riseTwice;
}

/** ∫ i_v(θ)·sin(θ + shift) dθ over the segment, closed form. */
function integralOfDrivenTimesSine(
  { tau }: RlPiecewiseSolution,
  s: RlSegment,
  shift: number,
): number {
  const alpha = s.start + shift;
  const constantPart = s.asymptote * integralOfSine(alpha, s.width);
  if (tau === 0 || s.offset === 0) return constantPart;
  // ∫₀ʷ e^{−u/τ} sin(α + u) du = Im[e^{jα}(e^{λw} − 1)/λ], λ = j − 1/τ, 1/λ = τ(−1 − jτ)/(1 + τ²).
  const decay = Math.exp(-s.width / tau);
  const re = decay * Math.cos(alpha + s.width) - Math.cos(alpha);
  const im = decay * Math.sin(alpha + s.width) - Math.sin(alpha);
  const scale = tau / (1 + tau * tau);
  const imaginary = scale * (-im - re * tau);
  return constantPart + s.offset * imaginary;
}

/** ∫₀ʷ sin(α + u) du. */
function integralOfSine(alpha: number, width: number): number {
  return Math.cos(alpha) - Math.cos(alpha + width);
}

/** di/dθ within a segment (amperes per radian), for locating extremes. */
function slope(solution: RlPiecewiseSolution, s: RlSegment, theta: number): number {
  const { tau, emfCurrentAmplitude, emfCurrentPhase } = solution;
  const transient = tau === 0 ? 0 : (-s.offset / tau) * Math.exp(-(theta - s.start) / tau);
  return transient + emfCurrentAmplitude * Math.cos(theta + emfCurrentPhase);
}

function currentExtremes(solution: RlPiecewiseSolution): { peak: number; min: number } {
  let peak = -Infinity;
  let min = Infinity;
  const visit = (value: number): void => {
    if (value > peak) peak = value;
    if (value < min) min = value;
  };
  const withEmf = solution.emfCurrentAmplitude !== 0;
  for (const s of solution.segments) {
    const end = s.start + s.width;
    // Both one-sided values: with l = 0 the current jumps at an edge.
    visit(currentInSegment(solution, s, s.start));
    visit(currentInSegment(solution, s, end));
    if (!withEmf) continue;
    const pieces = Math.ceil(s.width / EXTREMUM_SCAN_STEP);
    for (let k = 0; k < pieces; k++) {
      const a = s.start + (s.width * k) / pieces;
      const b = k + 1 === pieces ? end : s.start + (s.width * (k + 1)) / pieces;
      const root = bisectSlope(solution, s, a, b);
      if (root !== undefined) visit(currentInSegment(solution, s, root));
    }
  }
  return { peak, min };
}

/** A zero of di/dθ in [a, b] when the slope changes sign there, to ~1e−15 rad. */
function bisectSlope(
  solution: RlPiecewiseSolution,
  s: RlSegment,
  a: number,
  b: number,
): number | undefined {
  let fa = slope(solution, s, a);
  const fb = slope(solution, s, b);
  if (fa === 0) return a;
  if (fa * fb > 0) return undefined;
  let low = a;
  let high = b;
  for (let i = 0; i < 60 && high - low > 1e-15; i++) {
    const middle = 0.5 * (low + high);
    const fm = slope(solution, s, middle);
    if (fm * fa > 0) {
      low = middle;
      fa = fm;
    } else high = middle;
  }
  return 0.5 * (low + high);
}

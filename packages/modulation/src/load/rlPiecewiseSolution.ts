import { TAU } from '../math.js';
import type { Waveform } from '../waveform/Waveform.js';
import type { RlLoadOptions } from './RlLoad.js';

/** One constant-voltage interval of the period, with the current's exponential on it. */
export interface RlSegment {
  /** Start angle, radians in [0, 2π). */
  start: number;
  /** Width, radians (> 0). */
  width: number;
  /** Source voltage held on the segment, volts. */
  level: number;
  /** Asymptote of the waveform-driven current, level/R, amperes. */
  asymptote: number;
  /** Waveform-driven current at the segment's start minus the asymptote, amperes. */
  offset: number;
}

/**
 * The exact periodic solution of L di/dt + R i = v − e, split by superposition into
 * i = i_v + i_e: i_v(θ) = asymptote + offset·exp(−(θ − start)/tau) on each segment, and
 * i_e(θ) = emfCurrentAmplitude · sin(θ + emfCurrentPhase), the sinusoidal steady state of −e.
 * Internal: the load functions share it.
 */
export interface RlPiecewiseSolution {
  /** Time constant ωL/R in radians of the fundamental (0 for a resistive load). */
  tau: number;
  /** Segments covering [0, 2π) in order, the first starting at 0. */
  segments: RlSegment[];
  /** Signed peak amperes of i_e (−E/|Z|; 0 without EMF). */
  emfCurrentAmplitude: number;
  /** Phase of i_e, radians (φ − atan(ωL/R)). */
  emfCurrentPhase: number;
}

/**
 * Solves the periodic steady state exactly (standard circuit analysis: first-order step
 * responses chained over the segments, with i(0) = i(2π) solved in closed form).
 * The options must already be validated.
 */
export function rlPiecewiseSolution(
  waveform: Waveform,
  options: RlLoadOptions,
): RlPiecewiseSolution {
  const { r, l, frequency, emf } = options;
  const reactance = TAU * frequency * l;
  const tau = reactance / r;
  const intervals = intervalsFromZero(waveform);
  // x_{k+1} = a_k x_k + c_k (1 − a_k) with a_k = e^{−w_k/τ}; after one period x = A x_0 + B.
  let accumulated = 0;
  for (const { width, level } of intervals) {
    const decay = tau === 0 ? 0 : Math.exp(-width / tau);
    const rise = tau === 0 ? 1 : -Math.expm1(-width / tau);
    accumulated = decay * accumulated + (level / r) * rise;
  }
  const periodRise = tau === 0 ? 1 : -Math.expm1(-TAU / tau);
  let current = accumulated / periodRise;
  const segments: RlSegment[] = [];
  for (const { start, width, level } of intervals) {
    const asymptote = level / r;
    const offset = tau === 0 ? 0 : current - asymptote;
    segments.push({ start, width, level, asymptote, offset });
    current = tau === 0 ? asymptote : asymptote + offset * Math.exp(-width / tau);
  }
  const emfAmplitude = emf?.amplitude ?? 0;
  return {
    tau,
    segments,
    emfCurrentAmplitude: -emfAmplitude / Math.hypot(r, reactance),
    emfCurrentPhase: (emf?.phase ?? 0) - Math.atan2(reactance, r),
  };
}

/** The waveform's levels as intervals starting at θ = 0 and ending at 2π. */
function intervalsFromZero({
  edges,
  levels,
}: Waveform): { start: number; width: number; level: number }[] {
  const count = edges.length;
  const intervals: { start: number; width: number; level: number }[] = [];
  const first = edges[0] as number;
  if (first > 0) intervals.push({ start: 0, width: first, level: levels[count - 1] as number });
  for (let i = 0; i < count; i++) {
    const start = edges[i] as number;
    const end = i + 1 < count ? (edges[i + 1] as number) : TAU;
    intervals.push({ start, width: end - start, level: levels[i] as number });
  }
  return intervals;
}

/** The total current (amperes) at `theta` (radians in [0, 2π)) within segment `segment`. */
export function currentInSegment(
  solution: RlPiecewiseSolution,
  segment: RlSegment,
  theta: number,
): number {
  const { tau, emfCurrentAmplitude, emfCurrentPhase } = solution;
  const transient = tau === 0 ? 0 : segment.offset * Math.exp(-(theta - segment.start) / tau);
  return segment.asymptote + transient + emfCurrentAmplitude * Math.sin(theta + emfCurrentPhase);
}

/** The index of the segment holding `theta` (radians in [0, 2π)); binary search. */
export function segmentIndexAt(solution: RlPiecewiseSolution, theta: number): number {
  const { segments } = solution;
  let low = 0;
  let high = segments.length - 1;
  while (low < high) {
    const middle = (low + high + 1) >> 1;
    if ((segments[middle] as RlSegment).start <= theta) low = middle;
    else high = middle - 1;
  }
  return low;
}

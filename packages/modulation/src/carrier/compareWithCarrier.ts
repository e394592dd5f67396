import { EDGE_EPSILON, TAU } from '../math.js';
import { findBracketedRoot } from '../numeric/findBracketedRoot.js';
import type { Waveform } from '../waveform/Waveform.js';
import { waveformFromTransitions, type Transition } from '../waveform/waveformFromTransitions.js';
import type { CarrierSampling } from './CarrierSampling.js';
import type { ReferenceSignal } from './ReferenceSignal.js';
import { fundamentalAngleOfCarrier, type CarrierAlignment } from './triangleCarrier.js';

/** Options of {@link compareWithCarrier}. */
export interface CarrierComparisonOptions extends CarrierAlignment {
  /** @default 'natural' */
  sampling?: CarrierSampling;
  /** Output level (volts) while the reference is above the carrier. */
  high: number;
  /** Output level (volts) while the reference is below the carrier. */
  low: number;
}

/**
 * One inverter leg switched by comparing a reference with the unit triangle carrier: the
 * output is `high` while the reference is above the carrier, `low` otherwise (the comparator of
 * carrier-based PWM, Holmes and Lipo, 2003, ch. 3). Exact: natural-sampling edges are found by
 * Brent's method to machine precision; regular-sampling edges in closed form, since the
 * carrier is linear over each half period. `mf` must be an integer so that one fundamental
 * period holds a whole number of carrier cycles. Inputs are assumed validated by the caller.
 *
 * Regular sampling at the rails: a held sample of +1 or more gives a half period high
 * throughout, −1 or less low throughout (it meets the carrier's peak or valley only at an
 * instant, which has no width). A sample that falls on one of the reference's breakpoints
 * takes the value just after it, of the piece that starts there.
 */
export function compareWithCarrier(
  reference: ReferenceSignal,
  { mf, carrierPhase = 0, sampling = 'natural', high, low }: CarrierComparisonOptions,
): Waveform {
  const alignment = { mf, carrierPhase };
  const transitions: Transition[] = [];
  // With odd mf the carrier half a fundamental period later is the negated carrier, so an
  // antisymmetric reference gives v(θ + π) = high + low − v(θ): compute half, mirror the rest.
  // Symmetric regular sampling is the exception: it samples at peaks only, which map to valleys.
  const mirrored =
    mf % 2 === 1 && reference.halfWaveAntisymmetric === true && sampling !== 'regular-symmetric';
  // 2·mf carrier half periods cover exactly one fundamental period; start at any boundary.
  for (let j = 0; j < (mirrored ? mf : 2 * mf); j++) {
    const start = fundamentalAngleOfCarrier(j * Math.PI, alignment);
    const end = fundamentalAngleOfCarrier((j + 1) * Math.PI, alignment);
    // Even j starts at a valley (carrier rising from −1), odd j at a peak (falling from +1).
    const rising = j % 2 === 0;
    const carrierAt = (theta: number): number => {
      const fraction = (theta - start) / (end - start);
      return rising ? -1 + 2 * fraction : 1 - 2 * fraction;
    };
    const level = (above: boolean): number => (above ? high : low);
    if (sampling === 'natural') {
      pushNaturalHalfPeriod(transitions, reference, start, end, carrierAt, level);
    } else {
      // Symmetric: both halves of a carrier period use the sample at its opening peak.
      const sampleAngle =
        sampling === 'regular-asymmetric' || !rising
          ? start
          : fundamentalAngleOfCarrier((j - 1) * Math.PI, alignment);
      pushRegularHalfPeriod(
        transitions,
        heldSample(reference, sampleAngle),
        start,
        end,
        rising,
        level,
      );
    }
  }
  if (mirrored) {
    const half = transitions.length;
    for (let k = 0; k < half; k++) {
      const { angle, level } = transitions[k] as Transition;
      transitions.push({ angle: angle + Math.PI, level: high + low - level });
    }
  }
  return waveformFromTransitions(transitions);
}

/**
 * The reference sampled at `angle` for regular sampling. A sample that falls on a breakpoint
 * (within {@link EDGE_EPSILON}, the library's resolution of an instant) takes the value of the
 * piece that starts there, read just inside it as the natural-sampling search reads each piece.
 * Where the reference jumps (the change of clamp of a discontinuous zero sequence) the two
 * sides differ by the jump, and a carrier peak or valley lands exactly on it whenever mf is a
 * multiple of 6: left to rounding of the two angles, the side would differ from one such
 * sample to the next, between phases and between half periods, and break the three-phase and
 * half-wave symmetry of the output. One rule for every such sample keeps both exact.
 */
function heldSample(reference: ReferenceSignal, angle: number): number {
  for (const breakpoint of reference.breakpoints ?? []) {
    // The breakpoint's copy nearest the sample (breakpoints are given in [0, 2π)).
    const offset = angle - breakpoint;
    const nearest = breakpoint + TAU * Math.round(offset / TAU);
    if (Math.abs(angle - nearest) < EDGE_EPSILON) return reference.value(insideFrom(nearest, 1));
  }
  return reference.value(angle);
}

/**
 * One carrier half period against a held sample. The carrier runs linearly from −1 to +1
 * (rising) or +1 to −1 (falling) and touches the sample at most once. A sample on or beyond a
 * carrier extreme never crosses the open half period: at +1 or above the reference is above the
 * carrier everywhere inside it (high throughout), at −1 or below it is below (low throughout).
 * The single instant where a sample of exactly ±1 meets the carrier's peak or valley has no
 * width, so it decides nothing: testing it against the carrier at the start, as a plain
 * `sample > carrier` would, turned a sample of exactly +1 after a peak into a low half period
 * (a clamped leg lost half its pulses).
 */
function pushRegularHalfPeriod(
  transitions: Transition[],
  sample: number,
  start: number,
  end: number,
  rising: boolean,
  level: (above: boolean) => number,
): void {
  if (sample >= 1 || sample <= -1) {
    transitions.push({ angle: start, level: level(sample >= 1) });
    return;
  }
  // Strictly inside (−1, 1): above the carrier from a valley, below it from a peak, until the
  // carrier meets the sample at the fraction (sample − c₀)/(c₁ − c₀) of the half period.
  const fraction = rising ? (sample + 1) / 2 : (1 - sample) / 2;
  transitions.push({ angle: start, level: level(rising) });
  transitions.push({ angle: start + fraction * (end - start), level: level(!rising) });
}

function pushNaturalHalfPeriod(
  transitions: Transition[],
  reference: ReferenceSignal,
  start: number,
  end: number,
  carrierAt: (theta: number) => number,
  level: (above: boolean) => number,
): void {
  const difference = (theta: number): number => reference.value(theta) - carrierAt(theta);
  if (isSinglePiece(reference, start, end)) {
    pushSinglePiece(transitions, difference, start, end, level);
    return;
  }
  const points = searchGrid(reference, start, end);
  // Every grid point is a candidate edge: at a breakpoint the reference may jump, so the sign
  // is read just inside each piece (4 ulp in) and the piece's own crossing found by Brent.
  // Brent's root stays inside its bracket [a, b], within the piece, so the candidates are
  // gathered in ascending order: each grid point, then its piece's crossing if any.
  const candidates: number[] = [];
  for (let k = 0; k < points.length; k++) {
    candidates.push(points[k] as number);
    if (k + 1 === points.length) break;
    const a = insideFrom(points[k] as number, 1);
    const b = insideFrom(points[k + 1] as number, -1);
    if (!(b > a)) continue;
    const fa = difference(a);
    const fb = difference(b);
    if (fa !== 0 && fb !== 0 && fa > 0 !== fb > 0) {
      candidates.push(findBracketedRoot(difference, a, b, fa, fb));
    }
  }
  // The level of each piece between candidates is read at its midpoint, so a crossing found
  // exactly at a grid point or a tangency cannot flip the sense; equal neighbours merge later.
  for (let k = 0; k + 1 < candidates.length; k++) {
    const a = candidates[k] as number;
    const b = candidates[k + 1] as number;
    if (b - a <= 0) continue;
    transitions.push({ angle: a, level: level(difference((a + b) / 2) > 0) });
  }
}

/** True when [start, end] needs no split: slope below half the carrier's, no breakpoint. */
function isSinglePiece(reference: ReferenceSignal, start: number, end: number): boolean {
  if (2 * reference.slopeBound * (end - start) > 2) return false;
  const breakpoints = reference.breakpoints;
  return breakpoints === undefined || breakpoints.length === 0;
}

/**
 * The common case of one monotonic piece (no breakpoint, slope below the carrier's): at most one
 * crossing, so the level before and after it follow from the signs at the ends.
 */
function pushSinglePiece(
  transitions: Transition[],
  difference: (theta: number) => number,
  start: number,
  end: number,
  level: (above: boolean) => number,
): void {
  const a = insideFrom(start, 1);
  const b = insideFrom(end, -1);
  const fa = difference(a);
  const fb = difference(b);
  if (fa > 0 === fb > 0 || fa === 0 || fb === 0) {
    transitions.push({ angle: start, level: level(difference((start + end) / 2) > 0) });
    return;
  }
  transitions.push({ angle: start, level: level(fa > 0) });
  transitions.push({ angle: findBracketedRoot(difference, a, b, fa, fb), level: level(fb > 0) });
}

/** `angle` moved 4 units in the last place towards `direction` (+1 or −1). */
function insideFrom(angle: number, direction: 1 | -1): number {
  return angle + direction * 4 * Number.EPSILON * Math.max(1, Math.abs(angle));
}

/**
 * Points that split [start, end] into pieces over which reference − carrier is monotonic: the
 * carrier's slope is 2/(half-period width), so pieces narrower than that divided by the
 * reference's slope bound hold at most one crossing. Breakpoints of the reference are added.
 */
function searchGrid(reference: ReferenceSignal, start: number, end: number): number[] {
  const width = end - start;
  const pieces = Math.max(1, Math.ceil(reference.slopeBound * width));
  const points: number[] = [];
  // Ascending as built (k·width/pieces never decreases with k): sorted only when a breakpoint joins.
  for (let k = 0; k <= pieces; k++) points.push(start + (k * width) / pieces);
  const breakpoints = reference.breakpoints ?? [];
  for (let i = 0; i < breakpoints.length; i++) {
    // Breakpoints are given in [0, 2π); the half period may lie in the next fundamental period.
    // Its copies a period before, itself and a period after, in that order.
    for (let copy = -1; copy <= 1; copy++) {
      const breakpoint = breakpoints[i] as number;
      const shifted = copy === 0 ? breakpoint : copy < 0 ? breakpoint - TAU : breakpoint + TAU;
      if (shifted > start && shifted < end) points.push(shifted);
    }
  }
  return points.length > pieces + 1 ? points.sort((a, b) => a - b) : points;
}

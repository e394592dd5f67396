import type { ReferenceSignal } from '../carrier/ReferenceSignal.js';
import type { ZeroSequence } from './ZeroSequence.js';
import { THIRTY_DEGREES } from './thirtyDegreeSector.js';
import { zeroSequenceOffset } from './zeroSequenceOffset.js';

/** Phase a, b or c: index 0, 1, 2, delayed by 0, 2π/3, 4π/3. */
export type PhaseIndex = 0 | 1 | 2;

/**
 * The reference of one phase of a three-phase carrier modulator, normalised to the carrier:
 * `ma·sin(θ − k·2π/3) + z(θ)` with z the chosen zero-sequence offset.
 *
 * Every zero sequence here changes its form only at multiples of 30°, which are given as
 * breakpoints so the crossing search splits at the clamping instants.
 */
export function threePhaseReference(
  phase: PhaseIndex,
  { ma, zeroSequence = 'none' }: { ma: number; zeroSequence?: ZeroSequence },
): ReferenceSignal {
  const sinesAt = (theta: number): [number, number, number] => [
    ma * Math.sin(theta),
    ma * Math.sin(theta - (2 * Math.PI) / 3),
    ma * Math.sin(theta - (4 * Math.PI) / 3),
  ];
  return {
    value: (theta) => {
      const sines = sinesAt(theta);
      return sines[phase] + zeroSequenceOffset(zeroSequence, sines, theta, ma);
    },
    // |d/dθ| of a sine is ≤ ma; each offset above adds at most one more sine's slope (or ma/2
    // for the third harmonic).
    slopeBound: zeroSequence === 'none' ? ma : 2 * ma,
    breakpoints:
      zeroSequence === 'none' ? [] : Array.from({ length: 12 }, (_, k) => k * THIRTY_DEGREES),
    // Negating the three sines negates every offset except the 120° clamps, which swap rails.
    halfWaveAntisymmetric: zeroSequence !== 'dpwm-max' && zeroSequence !== 'dpwm-min',
  };
}

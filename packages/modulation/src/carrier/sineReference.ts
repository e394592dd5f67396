import type { ReferenceSignal } from './ReferenceSignal.js';

/**
 * The sinusoidal reference `amplitude·sin(θ − shift)` normalised to the carrier, with its slope
 * bound |amplitude|.
 * @param amplitude - the modulation index (negative for the inverted reference of a second leg)
 * @param shift - phase delay in radians, 2π/3 and 4π/3 for phases b and c
 * @default shift 0
 */
export function sineReference(amplitude: number, shift = 0): ReferenceSignal {
  return {
    value: (theta) => amplitude * Math.sin(theta - shift),
    slopeBound: Math.abs(amplitude),
    halfWaveAntisymmetric: true,
  };
}

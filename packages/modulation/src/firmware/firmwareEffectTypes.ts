import type { Waveform } from '../waveform/Waveform.js';

/**
 * How one firmware effect changes the first output (H-bridge vAB, or three-phase vab):
 * a reference waveform against the realised one, with their exact fundamentals and THD.
 * Amplitudes peak volts, phases radians (v = A·sin(θ + phase)), THD as ratios over orders
 * 1..maxOrder.
 */
export interface FirmwareEffect {
  reference: Waveform;
  realised: Waveform;
  referenceFundamental: number;
  realisedFundamental: number;
  /** realisedFundamental − referenceFundamental, V (negative: voltage lost). */
  fundamentalChange: number;
  /** Phase of the realised fundamental minus that of the reference, rad, in (−π, π]. */
  fundamentalPhaseChange: number;
  referenceThd: number;
  realisedThd: number;
  /** realisedThd − referenceThd (ratio). */
  thdChange: number;
  maxOrder: number;
}

import type { Harmonic } from './Harmonic.js';
import { weightedDistortion } from './distortion.js';

/**
 * Total harmonic distortion, √(Σ_{n≥2} V_n²)/V_1, as a ratio (0.4834, not 48.34), over the
 * orders the spectrum holds (so truncation lowers it). DC (order 0) is excluded.
 * @throws ParameterRangeError when the fundamental is missing or zero
 */
export function thd(spectrum: readonly Harmonic[]): number {
  return weightedDistortion(spectrum, 0);
}

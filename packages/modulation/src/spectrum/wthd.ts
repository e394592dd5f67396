import type { Harmonic } from './Harmonic.js';
import { weightedDistortion } from './distortion.js';

/**
 * Weighted total harmonic distortion, √(Σ_{n≥2} (V_n/n)²)/V_1, as a ratio (Holmes and Lipo,
 * *Pulse Width Modulation for Power Converters*, 2003, ch. 3). Each harmonic is weighted by
 * 1/n, so WTHD tracks the current distortion an inductive load would see.
 * @throws ParameterRangeError when the fundamental is missing or zero
 */
export function wthd(spectrum: readonly Harmonic[]): number {
  return weightedDistortion(spectrum, 1);
}

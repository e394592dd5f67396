import { ParameterRangeError } from '../validation/errors.js';
import type { Harmonic } from './Harmonic.js';

/**
 * Σ over orders ≥ 2 of (amplitude/order^weightPower)², divided by the fundamental's amplitude
 * squared, square-rooted. Shared by {@link thd} (power 0) and {@link wthd} (power 1).
 */
export function weightedDistortion(spectrum: readonly Harmonic[], weightPower: number): number {
  const fundamental = spectrum.find((h) => h.order === 1);
  if (fundamental === undefined || !(fundamental.amplitude > 0)) {
    throw new ParameterRangeError(
      'spectrum',
      'a spectrum whose fundamental (order 1) has an amplitude > 0',
      fundamental?.amplitude ?? 'no order 1',
    );
  }
  let sum = 0;
  for (const { order, amplitude } of spectrum) {
    if (order < 2) continue;
    const weighted = amplitude / order ** weightPower;
    sum += weighted * weighted;
  }
  return Math.sqrt(sum) / fundamental.amplitude;
}

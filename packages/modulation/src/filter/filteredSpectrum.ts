import { TAU } from '../math.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
import { meanHarmonic } from '../spectrum/meanHarmonic.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterTypeError } from '../validation/errors.js';
import { assertLcFilter } from './assertLcFilter.js';
import type { LcFilterOptions } from './LcFilterOptions.js';
import { lcFilterTransfer } from './lcFilterTransfer.js';

/** Options of {@link filteredSpectrum}. */
export interface FilteredSpectrumOptions {
  /** The output filter. */
  filter: LcFilterOptions;
  /** Frequency of order 1, hertz, > 0. */
  fundamentalFrequency: number;
}

/**
 * The spectrum after an LC output filter: each harmonic A·sin(nθ + φ) becomes
 * A·|H(jnω₀)|·sin(nθ + φ + arg H(jnω₀)) (linear time-invariant response to a sinusoid,
 * standard circuit analysis). Order 0 is scaled by H(0), which is 1 for every placement.
 *
 * @param spectrum - harmonics in the `harmonics` convention (peak volts, radians)
 * @param options - `filter` and `fundamentalFrequency` (hertz)
 * @returns one entry per input entry, same orders; phases wrapped into (−π, π]
 */
export function filteredSpectrum(
  spectrum: readonly Harmonic[],
  options: FilteredSpectrumOptions,
): Harmonic[] {
  // Tested as unknown: Array.isArray would narrow a readonly array to any[] (TypeScript 17002).
  const given: unknown = spectrum;
  if (!Array.isArray(given))
    throw new ParameterTypeError('spectrum', 'an array of harmonics', spectrum);
  const { filter, fundamentalFrequency } = options ?? ({} as FilteredSpectrumOptions);
  assertLcFilter(filter, 'filter.');
  assertNumberInRange('fundamentalFrequency', fundamentalFrequency, { min: 0, minExclusive: true });
  return spectrum.map((h, i) => {
    assertNumberInRange(`spectrum[${i}].order`, h?.order, { min: 0, integer: true });
    assertNumberInRange(`spectrum[${i}].amplitude`, h.amplitude);
    assertNumberInRange(`spectrum[${i}].phase`, h.phase);
    const response = lcFilterTransfer(filter, TAU * fundamentalFrequency * h.order);
    if (h.order === 0) return meanHarmonic(h.amplitude * Math.cos(h.phase) * response.re);
    let phase = h.phase + Math.atan2(response.im, response.re);
    if (phase > Math.PI) phase -= TAU;
    else if (phase <= -Math.PI) phase += TAU;
    return { order: h.order, amplitude: h.amplitude * Math.hypot(response.re, response.im), phase };
  });
}

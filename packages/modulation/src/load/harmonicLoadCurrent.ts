import { TAU } from '../math.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
import { meanHarmonic } from '../spectrum/meanHarmonic.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterTypeError } from '../validation/errors.js';
import { assertRlLoad } from './assertRlLoad.js';
import type { RlLoadOptions } from './RlLoad.js';

/**
 * The load current's harmonics from the voltage's, one order at a time (the harmonic-sum
 * method of standard circuit analysis): I_n = V_n / (R + j·n·ω·L), so the amplitude is
 * V_n/|R + jnωL| and the phase lags by atan(nωL/R). Order 0 is V_0/R. A back-EMF
 * e = E·sin(θ + φ) is subtracted from the fundamental as a phasor before dividing.
 *
 * Same convention as `harmonics`: i(θ) = I_0 + Σ amplitude_n·sin(nθ + phase_n); amplitudes in
 * peak amperes (order 0: the mean current's magnitude, its sign in the phase), phases in radians (−π, π].
 *
 * The result is truncated at the spectrum's highest order; with an inductance the terms fall
 * as 1/n², so the mean square converges fast (the tests bound the tail).
 *
 * @param spectrum - voltage harmonics (peak volts), e.g. from `harmonics(waveform, maxOrder)`
 * @param options - `r` ohm > 0, `l` henry ≥ 0, `frequency` hertz > 0, optional `emf`
 * @returns one entry per input entry, same orders
 */
export function harmonicLoadCurrent(
  spectrum: readonly Harmonic[],
  options: RlLoadOptions,
): Harmonic[] {
  // Tested as unknown: Array.isArray would narrow a readonly array to any[] (TypeScript 17002).
  const given: unknown = spectrum;
  if (!Array.isArray(given))
    throw new ParameterTypeError('spectrum', 'an array of harmonics', spectrum);
  assertRlLoad(options);
  const { r, l, frequency, emf } = options;
  return spectrum
    .map((h, i) => {
      assertNumberInRange(`spectrum[${i}].order`, h?.order, { min: 0, integer: true });
      assertNumberInRange(`spectrum[${i}].amplitude`, h.amplitude);
      assertNumberInRange(`spectrum[${i}].phase`, h.phase);
      // The mean is amplitude·cos(phase), phase 0 or π; cos gives its sign exactly.
      if (h.order === 0) return meanHarmonic((h.amplitude * Math.cos(h.phase)) / r);
      // Phasor of a·sin(nθ + φ) as a·e^{jφ}; subtract the EMF's at the fundamental.
      let re = h.amplitude * Math.cos(h.phase);
      let im = h.amplitude * Math.sin(h.phase);
      if (h.order === 1 && emf !== undefined) {
        re -= emf.amplitude * Math.cos(emf.phase);
        im -= emf.amplitude * Math.sin(emf.phase);
      }
      const reactance = TAU * frequency * l * h.order;
      return {
        order: h.order,
        amplitude: Math.hypot(re, im) / Math.hypot(r, reactance),
        phase: Math.atan2(im, re) - Math.atan2(reactance, r),
      };
    })
    .map(wrapPhase);
}

function wrapPhase(h: Harmonic): Harmonic {
  let { phase } = h;
  if (phase <= -Math.PI) phase += TAU;
  else if (phase > Math.PI) phase -= TAU;
  return { ...h, phase };
}

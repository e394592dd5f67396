import type { Harmonic } from './Harmonic.js';
import type { HarmonicPhasors } from './harmonicPhasors.js';
import { meanHarmonic } from './meanHarmonic.js';

/**
 * A spectrum's phasors as {@link Harmonic}s, index = order: amplitude |X_n| and phase arg X_n
 * (radians, (−π, π]); order 0 is the mean (`meanHarmonic`). Internal: `harmonics` and the
 * design report's spectra.
 * @param phasors - orders 0..N (see `HarmonicPhasors`)
 * @param count - how many orders to convert, from 0 @default all of them
 */
export function harmonicsOfPhasors(
  phasors: HarmonicPhasors,
  count: number = phasors.re.length,
): Harmonic[] {
  const { re, im } = phasors;
  const result = new Array<Harmonic>(count);
  result[0] = meanHarmonic(re[0] as number);
  for (let n = 1; n < count; n++) {
    const a = im[n] as number;
    const b = re[n] as number;
    result[n] = { order: n, amplitude: Math.sqrt(a * a + b * b), phase: Math.atan2(a, b) };
  }
  return result;
}

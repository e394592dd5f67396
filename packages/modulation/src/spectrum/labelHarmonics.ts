import { assertNumberInRange } from '../validation/assertions.js';
import { carrierGroupLabel } from './carrierGroupLabel.js';
import type { CarrierGroupLabel } from './carrierGroupOf.js';
import type { Harmonic } from './Harmonic.js';

/** A harmonic with its carrier group and sideband, for charts and tables. */
export type LabelledHarmonic = Harmonic & Omit<CarrierGroupLabel, 'order'>;

/**
 * Labels every harmonic of a spectrum by carrier group m and sideband n (order = m·mf + n;
 * Holmes and Lipo, 2003, ch. 3), so charts can group the bars round each carrier multiple.
 * A design report labels a dozen spectra of up to 5000 orders, so each entry is built as one
 * object literal (no spread) and `mf` is checked once.
 * @param mf - the frequency ratio, > 0; for unipolar PWM the effective ratio is still mf (the
 *   odd carrier groups are simply absent)
 */
export function labelHarmonics(spectrum: readonly Harmonic[], mf: number): LabelledHarmonic[] {
  assertNumberInRange('mf', mf, { min: 0, minExclusive: true });
  const labelled = new Array<LabelledHarmonic>(spectrum.length);
  for (let k = 0; k < spectrum.length; k++) {
    const { order, amplitude, phase } = spectrum[k] as Harmonic;
    const carrierGroup = Math.round(order / mf);
    const sideband = order - carrierGroup * mf;
    labelled[k] = {
      order,
      amplitude,
      phase,
      carrierGroup,
      sideband,
      label: carrierGroupLabel(order, carrierGroup, sideband),
    };
  }
  return labelled;
}

import { carrierGroupOf, type CarrierGroupLabel } from './carrierGroupOf.js';
import type { Harmonic } from './Harmonic.js';

/** A harmonic with its carrier group and sideband, for charts and tables. */
export type LabelledHarmonic = Harmonic & Omit<CarrierGroupLabel, 'order'>;

/**
 * Labels every harmonic of a spectrum by carrier group m and sideband n (order = m·mf + n;
 * Holmes and Lipo, 2003, ch. 3), so charts can group the bars round each carrier multiple.
 * @param mf - the frequency ratio, > 0; for unipolar PWM the effective ratio is still mf (the
 *   odd carrier groups are simply absent)
 */
export function labelHarmonics(spectrum: readonly Harmonic[], mf: number): LabelledHarmonic[] {
  return spectrum.map((harmonic) => {
    const { carrierGroup, sideband, label } = carrierGroupOf(harmonic.order, mf);
    return { ...harmonic, carrierGroup, sideband, label };
  });
}

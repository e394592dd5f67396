import { assertNumberInRange } from '../validation/assertions.js';
import { carrierGroupLabel } from './carrierGroupLabel.js';

/** Where a harmonic order sits in a carrier-based spectrum: order = carrierGroup·mf + sideband. */
export interface CarrierGroupLabel {
  order: number;
  /** m: 0 for the baseband, 1 for the group round the carrier, 2 round twice the carrier, … */
  carrierGroup: number;
  /** n: the offset from m·mf in multiples of the fundamental (negative below). */
  sideband: number;
  /** A label for charts: `1` (baseband), `mf`, `mf−2`, `2mf+1`, … */
  label: string;
}

/**
 * Labels a harmonic order by its carrier group m and sideband n, order = m·mf + n with m the
 * nearest whole number of carrier multiples (the m·ω_c + n·ω₀ indexing of the double Fourier
 * series, Holmes and Lipo, 2003, ch. 3). Orders below mf/2 are baseband (m = 0).
 * @param order - a harmonic order, integer ≥ 0
 * @param mf - the frequency ratio, > 0 (need not be an integer)
 */
export function carrierGroupOf(order: number, mf: number): CarrierGroupLabel {
  assertNumberInRange('order', order, { min: 0, integer: true });
  assertNumberInRange('mf', mf, { min: 0, minExclusive: true });
  const carrierGroup = Math.round(order / mf);
  const sideband = order - carrierGroup * mf;
  return { order, carrierGroup, sideband, label: carrierGroupLabel(order, carrierGroup, sideband) };
}

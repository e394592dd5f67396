import type { Harmonic } from '../spectrum/Harmonic.js';

/**
 * The amplitude of each order 0..maxOrder a spectrum holds, index = order (undefined where it
 * holds none; the last entry of an order wins). A limit table reads orders to 50 of a report's
 * spectrum of up to 5000, so only those are kept. Internal: the limit checks.
 */
export function amplitudesByOrder(
  spectrum: readonly Harmonic[],
  maxOrder: number,
): (number | undefined)[] {
  const byOrder = new Array<number | undefined>(maxOrder + 1);
  for (const { order, amplitude } of spectrum)
    if (Number.isInteger(order) && order >= 0 && order <= maxOrder) byOrder[order] = amplitude;
  return byOrder;
}

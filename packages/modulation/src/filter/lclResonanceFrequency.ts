import { TAU } from '../math.js';
import { assertNumberInRange } from '../validation/assertions.js';

/**
 * Resonance of an undamped LCL filter, f = (1/2π)·√((L1 + L2)/(L1·L2·C)), hertz: the frequency
 * where the capacitor's admittance cancels that of L1 and L2 in parallel, seen from the
 * capacitor's node with both ends shorted (standard circuit analysis). L2 includes any grid
 * inductance in series with the grid-side inductor.
 *
 * @param l1 - inverter-side inductance, henries, > 0
 * @param l2 - grid-side inductance (with the grid's), henries, > 0
 * @param c - capacitance, farads, > 0
 * @throws ParameterRangeError naming `l1`, `l2` or `c`
 */
export function lclResonanceFrequency(l1: number, l2: number, c: number): number {
  assertNumberInRange('l1', l1, { min: 0, minExclusive: true });
  assertNumberInRange('l2', l2, { min: 0, minExclusive: true });
  assertNumberInRange('c', c, { min: 0, minExclusive: true });
  return Math.sqrt((l1 + l2) / (l1 * l2 * c)) / TAU;
}

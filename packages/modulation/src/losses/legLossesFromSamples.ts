import { assertFiniteArray, assertNumberInRange } from '../validation/assertions.js';
import { legLossesOfValidSamples } from './legLossesOfValidSamples.js';
import type { DeviceLoss, SemiconductorDevice } from './lossTypes.js';

/** Options of {@link legLossesFromSamples}. */
export interface LegLossSampleOptions {
  device: SemiconductorDevice;
  /** DC bus voltage, V. */
  vdc: number;
  /** Carrier frequency, Hz (one sample per carrier period). */
  switchingFrequency: number;
}

/** Average losses of the four devices of one leg, W. */
export interface LegLosses {
  upperTransistor: DeviceLoss;
  lowerTransistor: DeviceLoss;
  upperDiode: DeviceLoss;
  lowerDiode: DeviceLoss;
  /** Sum of the four, W. */
  total: number;
}

/**
 * Losses of one inverter leg from its per-carrier-period duty cycles and currents, averaged
 * over the samples (each sample is one carrier period with the current taken as constant).
 *
 * Per carrier period with high-side duty d and current i (> 0 out of the leg):
 * - IGBT: i > 0 → upper IGBT conducts d·(vce0·i + rce·i²), lower diode (1 − d)·(vf0·i + rf·i²);
 *   i < 0 → lower IGBT (1 − d)·(…|i|…), upper diode d·(…|i|…).
 * - MOSFET (synchronous rectification): upper channel d·rdsOn·i², lower (1 − d)·rdsOn·i².
 * - When 0 < d < 1 the leg switches once each way: the transistor that carries the current
 *   takes (eon + eoff)·(vdc/Vref)·(|i|/Iref), the opposite diode err·(same) (hard switching,
 *   linear energy scaling: common practice). d = 0 or 1 (clamped) does not switch.
 *
 * @param duties - high-side duty per carrier period, fractions in [0, 1]
 * @param currents - leg current per carrier period, A (same length)
 */
export function legLossesFromSamples(
  duties: readonly number[] | Float64Array,
  currents: readonly number[] | Float64Array,
  options: LegLossSampleOptions,
): LegLosses {
  assertFiniteArray('duties', duties, 1);
  assertFiniteArray('currents', currents, duties.length, duties.length);
  const { vdc, switchingFrequency: fsw } = options;
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  assertNumberInRange('switchingFrequency', fsw, { min: 0, minExclusive: true });
  return legLossesOfValidSamples(duties, currents, options);
}

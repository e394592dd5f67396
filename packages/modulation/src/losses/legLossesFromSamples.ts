import { assertFiniteArray, assertNumberInRange } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import type { DeviceLoss, SemiconductorDevice } from './lossTypes.js';
import { switchingEnergyScale } from './switchingEnergyScale.js';

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
  const { device, vdc, switchingFrequency: fsw } = options;
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  assertNumberInRange('switchingFrequency', fsw, { min: 0, minExclusive: true });
  // Conduction and switching sums of the upper and lower transistor and diode, in local
  // variables (this loop runs once per cell of every report with a device).
  let utConduction = 0;
  let ltConduction = 0;
  let udConduction = 0;
  let ldConduction = 0;
  let utSwitching = 0;
  let ltSwitching = 0;
  let udSwitching = 0;
  let ldSwitching = 0;
  for (let j = 0; j < duties.length; j++) {
    const d = duties[j] as number;
    if (d < 0 || d > 1) throw new ParameterRangeError(`duties[${j}]`, 'a fraction in [0, 1]', d);
    const i = currents[j] as number;
    const a = Math.abs(i);
    const positive = i > 0;
    if (device.kind === 'mosfet') {
      utConduction += d * device.rdsOn * i * i;
      ltConduction += (1 - d) * device.rdsOn * i * i;
    } else {
      const transistor = device.vce0 * a + device.rce * a * a;
      const diode = device.vf0 * a + device.rf * a * a;
      if (positive) {
        utConduction += d * transistor;
        ldConduction += (1 - d) * diode;
      } else {
        ltConduction += (1 - d) * transistor;
        udConduction += d * diode;
      }
    }
    if (d > 0 && d < 1 && a > 0) {
      const scale = switchingEnergyScale(device, vdc, a);
      const transistor = fsw * (device.eon + device.eoff) * scale;
      const diode = fsw * device.err * scale;
      if (positive) {
        utSwitching += transistor;
        ldSwitching += diode;
      } else {
        ltSwitching += transistor;
        udSwitching += diode;
      }
    }
  }
  const sums: Record<'ut' | 'lt' | 'ud' | 'ld', [number, number]> = {
    ut: [utConduction, utSwitching],
    lt: [ltConduction, ltSwitching],
    ud: [udConduction, udSwitching],
    ld: [ldConduction, ldSwitching],
  };
  const n = duties.length;
  const loss = ([conduction, switching]: [number, number]): DeviceLoss => ({
    conduction: conduction / n,
    switching: switching / n,
    total: (conduction + switching) / n,
  });
  const result = {
    upperTransistor: loss(sums.ut),
    lowerTransistor: loss(sums.lt),
    upperDiode: loss(sums.ud),
    lowerDiode: loss(sums.ld),
  };
  return {
    ...result,
    total:
      result.upperTransistor.total +
      result.lowerTransistor.total +
      result.upperDiode.total +
      result.lowerDiode.total,
  };
}

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
  const { vdc, switchingFrequency: fsw } = options;
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  assertNumberInRange('switchingFrequency', fsw, { min: 0, minExclusive: true });
  const totals = legSums(duties, currents, options);
  const sums: Record<'ut' | 'lt' | 'ud' | 'ld', [number, number]> = {
    ut: [totals[UT_CONDUCTION] as number, totals[UT_SWITCHING] as number],
    lt: [totals[LT_CONDUCTION] as number, totals[LT_SWITCHING] as number],
    ud: [totals[UD_CONDUCTION] as number, totals[UD_SWITCHING] as number],
    ld: [totals[LD_CONDUCTION] as number, totals[LD_SWITCHING] as number],
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

/** Indices of {@link legSums}' totals. */
const UT_CONDUCTION = 0;
const LT_CONDUCTION = 1;
const UD_CONDUCTION = 2;
const LD_CONDUCTION = 3;
const UT_SWITCHING = 4;
const LT_SWITCHING = 5;
const UD_SWITCHING = 6;
const LD_SWITCHING = 7;

/**
 * The conduction and switching sums over the samples of the upper and lower transistor and
 * diode (see {@link legLossesFromSamples}), W summed over the samples, at the indices above.
 *
 * The totals are summed in place in an array built before the loop, and the loop is the last
 * thing here: V8 may compile this loop on the fly (on-stack replacement) during its first long
 * call, and code after a loop that had not yet run (the result built from the sums) then
 * deoptimised that compiled loop again at every later call (measured: 181 times in 40 reports,
 * in 1 of 8 processes). The same additions in the same order as local sums.
 */
function legSums(
  duties: readonly number[] | Float64Array,
  currents: readonly number[] | Float64Array,
  options: LegLossSampleOptions,
): Float64Array {
  const { device, vdc, switchingFrequency: fsw } = options;
  const totals = new Float64Array(8);
  for (let j = 0; j < duties.length; j++) {
    const d = duties[j] as number;
    if (d < 0 || d > 1) throw new ParameterRangeError(`duties[${j}]`, 'a fraction in [0, 1]', d);
    const i = currents[j] as number;
    const a = Math.abs(i);
    const positive = i > 0;
    if (device.kind === 'mosfet') {
      totals[UT_CONDUCTION] = (totals[UT_CONDUCTION] as number) + d * device.rdsOn * i * i;
      totals[LT_CONDUCTION] = (totals[LT_CONDUCTION] as number) + (1 - d) * device.rdsOn * i * i;
    } else {
      const transistor = device.vce0 * a + device.rce * a * a;
      const diode = device.vf0 * a + device.rf * a * a;
      if (positive) {
        totals[UT_CONDUCTION] = (totals[UT_CONDUCTION] as number) + d * transistor;
        totals[LD_CONDUCTION] = (totals[LD_CONDUCTION] as number) + (1 - d) * diode;
      } else {
        totals[LT_CONDUCTION] = (totals[LT_CONDUCTION] as number) + (1 - d) * transistor;
        totals[UD_CONDUCTION] = (totals[UD_CONDUCTION] as number) + d * diode;
      }
    }
    if (d > 0 && d < 1 && a > 0) {
      const scale = switchingEnergyScale(device, vdc, a);
      const transistor = fsw * (device.eon + device.eoff) * scale;
      const diode = fsw * device.err * scale;
      if (positive) {
        totals[UT_SWITCHING] = (totals[UT_SWITCHING] as number) + transistor;
        totals[LD_SWITCHING] = (totals[LD_SWITCHING] as number) + diode;
      } else {
        totals[LT_SWITCHING] = (totals[LT_SWITCHING] as number) + transistor;
        totals[UD_SWITCHING] = (totals[UD_SWITCHING] as number) + diode;
      }
    }
  }
  return totals;
}

import { ParameterRangeError } from '../validation/errors.js';
import type { LegLosses, LegLossSampleOptions } from './legLossesFromSamples.js';
import type { DeviceLoss } from './lossTypes.js';
import { switchingEnergyScale } from './switchingEnergyScale.js';

/**
 * `legLossesFromSamples` after its checks: the duties and currents are finite arrays of one
 * length and vdc and the switching frequency are > 0 (each duty's range is still checked as it
 * is read). Internal: the design report, whose cells and sampled currents are built finite from
 * a checked design, spares the two passes over 8192 cells a leg that `assertFiniteArray` makes.
 */
export function legLossesOfValidSamples(
  duties: readonly number[] | Float64Array,
  currents: readonly number[] | Float64Array,
  options: LegLossSampleOptions,
): LegLosses {
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

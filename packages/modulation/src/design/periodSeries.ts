import { TAU } from '../math.js';
import type { PeriodSeries } from './DesignReport.js';

/**
 * A chart's series from one period sampled at S angles 2πj/S: every k-th sample,
 * k = max(1, ⌊S/points⌋), with its angle (radians). The figures are read from all S samples;
 * the chart gets about `points` of them. Internal: the filtered currents and the DC link.
 * @param subtract - when given, the series of values − subtract (samples of the same grid), read
 *   at the picked samples only (a filtered phase's capacitor current, inverter minus load)
 */
export function periodSeries(
  values: Float64Array,
  points: number,
  subtract: Float64Array | null = null,
): PeriodSeries {
  const size = values.length;
  const stride = Math.max(1, Math.floor(size / points));
  const count = Math.ceil(size / stride);
  const angles = new Array<number>(count);
  const picked = new Array<number>(count);
  for (let k = 0, j = 0; k < count; k++, j += stride) {
    angles[k] = (TAU * j) / size;
    picked[k] =
      subtract === null ? (values[j] as number) : (values[j] as number) - (subtract[j] as number);
  }
  return { angles, values: picked };
}

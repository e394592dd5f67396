import { TAU } from '../math.js';
import { assertNumberInRange } from '../validation/assertions.js';
import type { Waveform } from '../waveform/Waveform.js';
import type { RlLoadOptions } from './RlLoad.js';
import { MAX_CURRENT_ANGLES, rlCurrentAt } from './rlCurrentAt.js';

/** Options of {@link rlCurrentSeries}: the load plus the number of points. */
export interface RlCurrentSeriesOptions extends RlLoadOptions {
  /** Evenly spaced angles over one period, [0, 2π), an integer in [2, 1 000 000]. @default 1000 */
  points?: number;
}

/** One period of the load current for a chart: plain arrays of equal length. */
export interface RlCurrentSeries {
  /** Radians, evenly spaced over [0, 2π) (the endpoint 2π is excluded). */
  angles: number[];
  /** Amperes at each angle. */
  current: number[];
}

/**
 * The exact steady-state load current of {@link rlSteadyState} at evenly spaced angles, for
 * plotting (the values are exact at those angles; only the chart's joining lines interpolate).
 *
 * @param waveform - one period of the source voltage, volts
 * @param options - the load (`r`, `l`, `frequency`, `emf`) and `points`
 */
export function rlCurrentSeries(
  waveform: Waveform,
  options: RlCurrentSeriesOptions,
): RlCurrentSeries {
  const { points = 1000, ...load } = options ?? ({} as RlCurrentSeriesOptions);
  assertNumberInRange('points', points, { min: 2, max: MAX_CURRENT_ANGLES, integer: true });
  const angles = Array.from({ length: points }, (_, k) => (TAU * k) / points);
  return { angles, current: rlCurrentAt(waveform, angles, load) };
}

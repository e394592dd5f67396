import { TAU } from '../math.js';
import type { TimerTable } from './timerTableTypes.js';

/**
 * Internal: the lag behind sin θ of each channel's current, radians, for a load current lagging
 * its reference by `currentAngle`: legs b, c of a three-phase table a further 2π/3 and 4π/3; the
 * unipolar H-bridge's leg B carries the opposite current (a further π); a bipolar table has one
 * channel (leg A).
 */
export function channelCurrentPhases(table: TimerTable, currentAngle: number): number[] {
  const { modulation } = table.parameters;
  if (modulation.method === 'three-phase')
    return [0, 1, 2].map((k) => currentAngle + (TAU * k) / 3);
  return modulation.scheme === 'bipolar' ? [currentAngle] : [currentAngle, currentAngle + Math.PI];
}

import { ParameterRangeError } from '../validation/errors.js';
import type { Waveform } from '../waveform/Waveform.js';

/** Options of {@link pwlPoints}. */
export interface PwlOptions {
  /** The fundamental period, seconds (the waveform's 2π). */
  period: number;
  /** Whole periods to write, ≥ 1. */
  periods: number;
  /** Seconds a rising edge takes, > 0. */
  riseTime: number;
  /** Seconds a falling edge takes, > 0. */
  fallTime: number;
}

/**
 * The (time, value) points of a piecewise-linear source for a piecewise-constant waveform
 * repeated over `periods` fundamental periods from t = 0: each edge at angle θ becomes a ramp
 * that starts at t = θ/2π·period and reaches the new level `riseTime` (upward) or `fallTime`
 * (downward) later; the source holds its level between ramps and to the end of the last period.
 * Times strictly increase, as a PWL source needs.
 * @throws ParameterRangeError naming `riseTime` or `fallTime`, whichever ramp would reach the next edge
 */
export function pwlPoints(waveform: Waveform, options: PwlOptions): [number, number][] {
  const { period, periods, riseTime, fallTime } = options;
  const { edges, levels } = waveform;
  const count = edges.length;
  const end = period * periods;
  // The level at t = 0: the last one, which wraps round to the first edge (unless that edge is at 0).
  const initial = count === 0 ? 0 : (levels[count - 1] as number);
  const points: [number, number][] = [[0, initial]];
  if (count <= 1) {
    const level = count === 0 ? 0 : (levels[0] as number);
    if (level !== initial) points.push([riseTime, level]);
    points.push([end, level]);
    return points;
  }
  let previous = initial;
  let lastEnd = -Infinity;
  // The ramp that ends at lastEnd: it is the one that is too long when the next edge comes first.
  let lastRamp: { field: 'riseTime' | 'fallTime'; value: number } | null = null;
  for (let p = 0; p < periods; p++) {
    for (let i = 0; i < count; i++) {
      const level = levels[i] as number;
      if (level === previous) continue;
      const start = ((edges[i] as number) / (2 * Math.PI) + p) * period;
      const ramp = level > previous ? riseTime : fallTime;
      if (lastRamp !== null && start <= lastEnd) {
        throw new ParameterRangeError(
          lastRamp.field,
          `shorter than the shortest time between two edges of a signal, seconds (a ramp ending at ${lastEnd.toPrecision(6)} s would pass the next edge, at ${start.toPrecision(6)} s)`,
          lastRamp.value,
        );
      }
      if (start > 0) points.push([start, previous]);
      else points[0] = [0, previous];
      points.push([start + ramp, level]);
      lastEnd = start + ramp;
      lastRamp = { field: level > previous ? 'riseTime' : 'fallTime', value: ramp };
      previous = level;
    }
  }
  if (lastEnd < end) points.push([end, previous]);
  return points;
}

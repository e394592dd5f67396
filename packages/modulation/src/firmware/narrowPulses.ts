import { complementCyclic, mergeCyclic, type Interval } from './pulseTrain.js';
import type { NarrowPulseAction } from './timerTableTypes.js';

/**
 * Internal: applies a minimum pulse width to a gate signal given as cyclic on-intervals
 * (ticks). First the on-pulses narrower than `width`, then the off-pulses (in the signal that
 * results) are dropped (merged into their neighbours) or clamped (widened to `width` about
 * their centre, taking the time from the neighbours). Returns the new on-intervals and how
 * many pulses were changed.
 */
export function applyMinimumPulse(
  on: readonly Interval[],
  period: number,
  width: number,
  action: NarrowPulseAction,
): { on: Interval[]; adjusted: number } {
  const highs = adjust(on, period, width, action);
  const lows = adjust(complementCyclic(highs.intervals, period), period, width, action);
  return { on: complementCyclic(lows.intervals, period), adjusted: highs.adjusted + lows.adjusted };
}

function adjust(
  intervals: readonly Interval[],
  period: number,
  width: number,
  action: NarrowPulseAction,
): { intervals: Interval[]; adjusted: number } {
  let adjusted = 0;
  const kept: Interval[] = [];
  for (const [start, end] of intervals) {
    const length = end - start;
    if (length >= width || length >= period) {
      kept.push([start, end]);
      continue;
    }
    adjusted++;
    if (action === 'clamp') {
      const centre = (start + end) / 2;
      kept.push([centre - width / 2, centre + width / 2]);
    }
  }
  return { intervals: mergeCyclic(kept, period), adjusted };
}

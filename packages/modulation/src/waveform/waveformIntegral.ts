import { TAU } from '../math.js';
import type { Waveform } from './Waveform.js';
import { waveformMean } from './waveformMean.js';
import { waveformValueAt } from './waveformValueAt.js';

/**
 * Exact integral of a waveform from `from` to `to` (radians, `to ≥ from`, any span, periods
 * repeat), in volt-radians. Divide by the fundamental angular frequency for volt-seconds, or by
 * the span for the mean. Used for volt-second balance checks over a switching period.
 */
export function waveformIntegral(waveform: Waveform, from: number, to: number): number {
  if (!(to >= from)) throw new RangeError(`to must be ≥ from; got from ${from}, to ${to}`);
  const periods = Math.floor((to - from) / TAU);
  let total = periods * waveformMean(waveform) * TAU;
  let start = from + periods * TAU;
  // Walk the remaining (< one period) span edge by edge.
  const { edges } = waveform;
  while (start < to) {
    const next = Math.min(to, nextEdgeAfter(edges, start));
    total += waveformValueAt(waveform, start) * (next - start);
    start = next;
  }
  return total;
}

/** The first edge strictly after `angle` (not wrapped), as an unwrapped angle. */
function nextEdgeAfter(edges: readonly number[], angle: number): number {
  const base = TAU * Math.floor(angle / TAU);
  const local = angle - base;
  for (const edge of edges) if (edge > local) return base + edge;
  return base + TAU + (edges[0] as number);
}

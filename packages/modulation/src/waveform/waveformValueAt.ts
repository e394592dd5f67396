import { wrapAngle } from '../math.js';
import type { Waveform } from './Waveform.js';

/**
 * The level (volts) a waveform holds at `angle` (radians, wrapped into [0, 2π)). At an edge
 * the level that starts there is returned. Binary search: O(log edges).
 */
export function waveformValueAt(waveform: Waveform, angle: number): number {
  const { edges, levels } = waveform;
  const theta = wrapAngle(angle);
  if (theta < (edges[0] as number)) return levels[levels.length - 1] as number;
  let low = 0;
  let high = edges.length - 1;
  while (low < high) {
    const middle = (low + high + 1) >> 1;
    if ((edges[middle] as number) <= theta) low = middle;
    else high = middle - 1;
  }
  return levels[low] as number;
}

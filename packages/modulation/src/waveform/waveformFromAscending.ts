import { EDGE_EPSILON, TAU } from '../math.js';
import type { Waveform } from './Waveform.js';

/**
 * The canonical {@link Waveform} of level changes already in ascending angle order in [0, 2π)
 * (ties in the order given): of changes closer than `EDGE_EPSILON` the later one wins (a
 * zero-width pulse is dropped), also across 2π, and a change that keeps the level is removed; a
 * constant signal becomes `{ edges: [0], levels: [value] }`. Internal: the second half of
 * `waveformFromTransitions`, and what `combineWaveforms` calls with its merged edges.
 * @param angles - radians, ascending, at least one
 * @param levels - the level from each angle on, one per angle
 */
export function waveformFromAscending(
  angles: readonly number[],
  levels: readonly number[],
): Waveform {
  const merged: number[] = [];
  const held: number[] = [];
  for (let k = 0; k < angles.length; k++) {
    const angle = angles[k] as number;
    const level = levels[k] as number;
    // Merge near-coincident transitions: the last of a cluster holds the level after it.
    if (merged.length > 0 && angle - (merged[merged.length - 1] as number) < EDGE_EPSILON) {
      held[held.length - 1] = level;
    } else {
      merged.push(angle);
      held.push(level);
    }
  }
  // A cluster straddling 2π: the transition just after 0 is the later one (it sits at 2π plus a
  // little), so its level stands and the one just before 2π is dropped.
  if (
    merged.length > 1 &&
    (merged[0] as number) + TAU - (merged[merged.length - 1] as number) < EDGE_EPSILON
  ) {
    merged.pop();
    held.pop();
  }
  return dropRepeatedLevels(merged, held);
}

function dropRepeatedLevels(angles: readonly number[], levels: readonly number[]): Waveform {
  const edges: number[] = [];
  const kept: number[] = [];
  const count = angles.length;
  for (let i = 0; i < count; i++) {
    if (count > 1 && levels[i] === levels[(i + count - 1) % count]) continue;
    edges.push(angles[i] as number);
    kept.push(levels[i] as number);
  }
  if (edges.length === 0) return { edges: [0], levels: [levels[0] as number] };
  return { edges, levels: kept };
}

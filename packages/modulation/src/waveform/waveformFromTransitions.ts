import { EDGE_EPSILON, TAU, wrapAngle } from '../math.js';
import type { Waveform } from './Waveform.js';

/** A level that starts at `angle` (radians, any value: it is wrapped into [0, 2π)). */
export interface Transition {
  angle: number;
  level: number;
}

/**
 * Builds a canonical {@link Waveform} from level changes given in any order and at any angle.
 *
 * Angles are wrapped into [0, 2π) and sorted; of transitions closer than `EDGE_EPSILON` the
 * later one in angle order wins (a zero-width pulse is dropped); a transition that does not
 * change the level is removed. A constant signal becomes `{ edges: [0], levels: [value] }`.
 *
 * @param transitions - at least one; does not change the array
 */
export function waveformFromTransitions(transitions: readonly Transition[]): Waveform {
  if (transitions.length === 0) throw new RangeError('transitions must hold at least one entry');
  const sorted = transitions
    .map((t) => ({ angle: wrapAngle(t.angle), level: t.level }))
    .sort((a, b) => a.angle - b.angle);
  // Merge near-coincident transitions: the last of a cluster holds the level after it.
  const merged: Transition[] = [];
  for (const t of sorted) {
    const previous = merged[merged.length - 1];
    if (previous !== undefined && t.angle - previous.angle < EDGE_EPSILON) previous.level = t.level;
    else merged.push({ ...t });
  }
  // A cluster straddling 2π: the transition just after 0 is the later one (it sits at 2π plus a
  // little), so its level stands and the one just before 2π is dropped.
  const first = merged[0] as Transition;
  const last = merged[merged.length - 1] as Transition;
  if (merged.length > 1 && first.angle + TAU - last.angle < EDGE_EPSILON) merged.pop();
  return dropRepeatedLevels(merged);
}

function dropRepeatedLevels(transitions: Transition[]): Waveform {
  const edges: number[] = [];
  const levels: number[] = [];
  const n = transitions.length;
  for (let i = 0; i < n; i++) {
    const t = transitions[i] as Transition;
    const before = transitions[(i + n - 1) % n] as Transition;
    if (n > 1 && t.level === before.level) continue;
    edges.push(t.angle);
    levels.push(t.level);
  }
  if (edges.length === 0) {
    const only = transitions[0] as Transition;
    return { edges: [0], levels: [only.level] };
  }
  return { edges, levels };
}

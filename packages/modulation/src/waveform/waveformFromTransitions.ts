import { wrapAngle } from '../math.js';
import type { Waveform } from './Waveform.js';
import { waveformFromAscending } from './waveformFromAscending.js';

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
  const count = transitions.length;
  if (count === 0) throw new RangeError('transitions must hold at least one entry');
  const wrappedAngles = transitions.map((t) => wrapAngle(t.angle));
  const order = ascendingOrder(wrappedAngles);
  return waveformFromAscending(
    order.map((index) => wrappedAngles[index] as number),
    order.map((index) => (transitions[index] as Transition).level),
  );
}

/**
 * The indices of `wrapped` (angles in [0, 2π)) in ascending order, ties in input order. The
 * modulators emit transitions in ascending unwrapped order, which wrapping turns into one
 * rotation of an ascending list: that case is found in one pass, anything else is sorted.
 */
function ascendingOrder(wrapped: readonly number[]): number[] {
  const count = wrapped.length;
  let descents = 0;
  let start = 0;
  for (let i = 1; i < count; i++) {
    if ((wrapped[i] as number) < (wrapped[i - 1] as number)) {
      descents++;
      start = i;
    }
  }
  const rotation =
    descents === 0 || (descents === 1 && (wrapped[count - 1] as number) <= (wrapped[0] as number));
  if (rotation) return Array.from({ length: count }, (_, k) => (start + k) % count);
  return Array.from({ length: count }, (_, k) => k).sort(
    (a, b) => (wrapped[a] as number) - (wrapped[b] as number) || a - b,
  );
}

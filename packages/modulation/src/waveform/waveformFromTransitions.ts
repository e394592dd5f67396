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
  const wrappedAngles: number[] = [];
  for (let k = 0; k < count; k++) {
    wrappedAngles.push(wrapAngle((transitions[k] as Transition).angle));
  }
  const angles: number[] = [];
  const levels: number[] = [];
  const take = (index: number): void => {
    angles.push(wrappedAngles[index] as number);
    levels.push((transitions[index] as Transition).level);
  };
  const start = rotationStart(wrappedAngles);
  if (start === null) {
    // Any other order: sorted, ties in input order.
    const order = Array.from({ length: count }, (_, k) => k).sort(
      (a, b) => (wrappedAngles[a] as number) - (wrappedAngles[b] as number) || a - b,
    );
    for (let k = 0; k < count; k++) take(order[k] as number);
  } else {
    for (let k = start; k < count; k++) take(k);
    for (let k = 0; k < start; k++) take(k);
  }
  return waveformFromAscending(angles, levels);
}

/**
 * Where `wrapped` (angles in [0, 2π)) starts ascending when it is one rotation of an ascending
 * list, null otherwise. The modulators emit transitions in ascending unwrapped order, which
 * wrapping turns into such a rotation: that case is found in one pass, anything else is sorted.
 */
function rotationStart(wrapped: readonly number[]): number | null {
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
  return rotation ? start : null;
}

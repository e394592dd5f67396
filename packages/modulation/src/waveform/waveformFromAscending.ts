import { EDGE_EPSILON, TAU } from '../math.js';
import type { Waveform } from './Waveform.js';

/**
 * The canonical {@link Waveform} of level changes already in ascending angle order in [0, 2π)
 * (ties in the order given): of changes closer than `EDGE_EPSILON` the later one wins (a
 * zero-width pulse is dropped), also across 2π, and a change that keeps the level is removed; a
 * constant signal becomes `{ edges: [0], levels: [value] }`. Internal: the second half of
 * `waveformFromTransitions`, and what `combineWaveforms` and `starVoltages` call with their
 * merged edges.
 *
 * One pass: a cluster of near-coincident changes is held until the next one starts, then kept
 * unless its level repeats the cluster before it. Comparing with the cluster before (kept or
 * not) is the same as comparing with the last kept level, since a dropped cluster repeats it.
 * Only the ends wait for the whole list: the last cluster may fold into the first across 2π,
 * and the first is compared with the last.
 * @param angles - radians, ascending, at least `count`
 * @param levels - the level from each angle on, one per angle
 * @param count - how many of them to read, ≥ 1 @default angles.length
 */
export function waveformFromAscending(
  angles: ArrayLike<number>,
  levels: ArrayLike<number>,
  count = angles.length,
): Waveform {
  const edges: number[] = [];
  const kept: number[] = [];
  // The cluster being gathered (its first angle, its last level), how many have begun, the
  // first one's level and the level of the one before the cluster being gathered.
  let clusterAngle = angles[0] as number;
  let clusterLevel = levels[0] as number;
  let clusters = 1;
  let firstLevel = NaN;
  let previousLevel = NaN;
  for (let k = 1; k < count; k++) {
    const angle = angles[k] as number;
    const level = levels[k] as number;
    if (angle - clusterAngle < EDGE_EPSILON) {
      clusterLevel = level;
      continue;
    }
    // The cluster is complete. The first is compared with the last at the end.
    if (clusters === 1) firstLevel = clusterLevel;
    else if (clusterLevel !== previousLevel) {
      edges.push(clusterAngle);
      kept.push(clusterLevel);
    }
    previousLevel = clusterLevel;
    clusterAngle = angle;
    clusterLevel = level;
    clusters++;
  }
  if (clusters === 1) firstLevel = clusterLevel;
  const firstAngle = angles[0] as number;
  // A cluster straddling 2π: the transition just after 0 is the later one (it sits at 2π plus a
  // little), so its level stands and the last cluster, just before 2π, is dropped.
  const lastFolds = clusters > 1 && firstAngle + TAU - clusterAngle < EDGE_EPSILON;
  if (clusters > 1 && !lastFolds && clusterLevel !== previousLevel) {
    edges.push(clusterAngle);
    kept.push(clusterLevel);
  }
  const lastLevel = lastFolds ? previousLevel : clusterLevel;
  // The first cluster, unless it repeats the last level round the period (a single cluster is
  // kept: it is the whole signal).
  const mergedCount = lastFolds ? clusters - 1 : clusters;
  if (mergedCount === 1 || firstLevel !== lastLevel) {
    edges.unshift(firstAngle);
    kept.unshift(firstLevel);
  }
  if (edges.length === 0) return { edges: [0], levels: [firstLevel] };
  return { edges, levels: kept };
}

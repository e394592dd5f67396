import type { Waveform } from './Waveform.js';
import { waveformFromAscending } from './waveformFromAscending.js';

/**
 * Combines waveforms point by point: the result holds `combine(levels)` wherever the inputs
 * hold `levels` (one level per input, in the order given). Exact: the result's edges are the
 * union of the inputs' edges, then canonicalised as `waveformFromTransitions` canonicalises them
 * (`waveformFromAscending`).
 *
 * Used for line-to-line voltages (leg a − leg b) and for sums of cells.
 *
 * @param waveforms - at least one valid waveform
 * @param combine - a pure function of one level per input, in volts
 */
export function combineWaveforms(
  waveforms: readonly Waveform[],
  combine: (levels: readonly number[]) => number,
): Waveform {
  const count = waveforms.length;
  if (count === 0) throw new RangeError('waveforms must hold at least one waveform');
  const edgeLists = waveforms.map((w) => w.edges);
  const levelLists = waveforms.map((w) => w.levels);
  // Before the first edge each input holds its last level (the period wraps round).
  const current = levelLists.map((levels) => levels[levels.length - 1] as number);
  // Each input's edges ascend: merge them, taking the next smallest angle each step (k-way
  // merge; a handful of inputs, so a scan beats a heap).
  const next = new Array<number>(count).fill(0);
  const angles: number[] = [];
  const combined: number[] = [];
  for (;;) {
    let angle = Infinity;
    // Bounds are checked against the lengths: reading past an array's end is slow in V8.
    for (let k = 0; k < count; k++) {
      const edges = edgeLists[k] as number[];
      const i = next[k] as number;
      if (i < edges.length && (edges[i] as number) < angle) angle = edges[i] as number;
    }
    if (angle === Infinity) break;
    // Apply every input's change at this exact angle before evaluating.
    for (let k = 0; k < count; k++) {
      const edges = edgeLists[k] as number[];
      const i = next[k] as number;
      if (i < edges.length && edges[i] === angle) {
        current[k] = (levelLists[k] as number[])[i] as number;
        next[k] = i + 1;
      }
    }
    angles.push(angle);
    combined.push(combine(current));
  }
  // The merged angles ascend in [0, 2π): canonicalise them as waveformFromTransitions would.
  return waveformFromAscending(angles, combined);
}

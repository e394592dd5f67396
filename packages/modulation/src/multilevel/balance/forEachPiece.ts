import { TAU } from '../../math.js';
import type { Waveform } from '../../waveform/Waveform.js';

/**
 * Internal: cuts one fundamental period [0, 2π] at every edge of `waveforms` and every angle of
 * `breaks` (each in [0, 2π)), and calls `visit` for each piece [a, b] with the level each
 * waveform holds on it (in the order given). Pieces are visited in ascending order; within a
 * piece every waveform is constant, so integrals over it are exact.
 */
export function forEachPiece(
  waveforms: readonly Waveform[],
  breaks: readonly number[],
  visit: (a: number, b: number, levels: readonly number[]) => void,
): void {
  let size = 2 + breaks.length;
  for (const w of waveforms) size += w.edges.length;
  const cuts = new Float64Array(size);
  cuts.set(breaks, 2);
  cuts[1] = TAU;
  let offset = 2 + breaks.length;
  for (const w of waveforms) {
    cuts.set(w.edges, offset);
    offset += w.edges.length;
  }
  // A typed array sorts numerically without a comparator: several times faster on long lists.
  cuts.sort();
  // The level each waveform holds before its first edge is its last level (it wraps round).
  const levels = waveforms.map((w) => w.levels[w.levels.length - 1] as number);
  const next = waveforms.map(() => 0);
  let previous = 0;
  for (const cut of cuts) {
    if (cut > previous) visit(previous, cut, levels);
    previous = Math.max(previous, cut);
    // Every waveform whose next edge is at this cut changes level here.
    for (let k = 0; k < waveforms.length; k++) {
      const { edges, levels: held } = waveforms[k] as Waveform;
      let index = next[k] as number;
      while (index < edges.length && (edges[index] as number) <= cut) {
        levels[k] = held[index] as number;
        index++;
      }
      next[k] = index;
    }
  }
}

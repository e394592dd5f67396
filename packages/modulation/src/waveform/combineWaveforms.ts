import type { Waveform } from './Waveform.js';
import { waveformFromTransitions, type Transition } from './waveformFromTransitions.js';

/**
 * Combines waveforms point by point: the result holds `combine(levels)` wherever the inputs
 * hold `levels` (one level per input, in the order given). Exact: the result's edges are the
 * union of the inputs' edges, then canonicalised by {@link waveformFromTransitions}.
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
  const events: { angle: number; source: number; level: number }[] = [];
  const current = waveforms.map((w) => w.levels[w.levels.length - 1] as number);
  waveforms.forEach((w, source) => {
    w.edges.forEach((angle, i) => events.push({ angle, source, level: w.levels[i] as number }));
  });
  events.sort((a, b) => a.angle - b.angle);
  const transitions: Transition[] = [];
  for (let i = 0; i < events.length;) {
    const angle = (events[i] as (typeof events)[number]).angle;
    // Apply every input's change at this exact angle before evaluating.
    while (i < events.length && (events[i] as (typeof events)[number]).angle === angle) {
      const e = events[i] as (typeof events)[number];
      current[e.source] = e.level;
      i++;
    }
    transitions.push({ angle, level: combine(current) });
  }
  return waveformFromTransitions(transitions);
}

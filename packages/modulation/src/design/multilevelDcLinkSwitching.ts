import type { MultilevelTopology, MultilevelWaveforms } from '../multilevel/MultilevelTypes.js';
import { combineWaveforms } from '../waveform/combineWaveforms.js';
import type { Waveform } from '../waveform/Waveform.js';

/**
 * The switching functions `dcLinkFigures` takes for a multilevel bridge whose DC side carries one
 * current, else null. A flying-capacitor leg's current leaves the DC link through exactly one
 * switch of its outermost cell (cell 1): the upper one while that cell's state s₁ is 1, so the
 * positive rail carries Σ s₁,k·i_k and the negative rail the same back (Σ i_k = 0 for a star
 * load, or the full bridge's ±i); standard circuit analysis (T. A. Meynard and H. Foch, 1992).
 * In dcLinkFigures' convention (i_dc = Σ (v_k/vdc)·i_k) that is v_k = (s₁,k − ½)·vdc a leg for a
 * three-phase bridge and v = (s₁,a − s₁,b)·vdc for a single-phase full bridge.
 * NPC and T-type links have a midpoint and cascaded cells a source each: more than one DC
 * current, so null (their figures are the balance's).
 * Internal: part of analyseDesign.
 */
export function multilevelDcLinkSwitching(
  waveforms: MultilevelWaveforms & { topology: MultilevelTopology },
  vdc: number,
): Waveform[] | null {
  if (waveforms.topology !== 'flying-capacitor') return null;
  const outer = waveforms.legs.map((leg) => leg.cells[0]?.waveform);
  if (outer.some((state) => state === undefined)) return null;
  const states = outer as Waveform[];
  if (waveforms.phaseCount === 3)
    return states.map((state) => combineWaveforms([state], ([s = 0]) => (s - 0.5) * vdc));
  return [combineWaveforms(states, ([a = 0, b = 0]) => (a - b) * vdc)];
}

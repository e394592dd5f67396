import { middlePhase } from '../three-phase/middlePhase.js';
import { isReducedCommonMode, type TimerTableInputs } from './timerTableInputs.js';
import type { CompareSense } from './timerTableTypes.js';

/**
 * Internal to timerTable: the compare sense of every channel at every entry (channel-major).
 * `'below'` everywhere, except for the reduced common-mode methods (`azspwm1`, `nspwm`; A. M.
 * Hava and E. Ün, IEEE Trans. Power Electronics, 2009, from memory), whose middle phase compares
 * its reference with the inverted carrier: the high side is then on while the counter is above
 * `full − compare`, the pulse centred on the counter peak.
 *
 * Which phase is the middle one is decided as the library's `threePhase` decides it with
 * regular-asymmetric sampling (`invertsCarrier`): once per carrier half period, at that half
 * period's carrier zero crossing. The table reproduces that modulator's pulses a quarter carrier
 * period earlier (it samples each half period at its centre, `threePhase` at its start), so that
 * crossing is the end of the entry's own half period: entry i (of 2·mf) takes the middle phase at
 * θ = (i + 1)·π/mf. Then every sense change falls on an update event (a counter peak or valley)
 * and the rebuilt gates equal `threePhase`'s edge for edge.
 */
export function compareSenses(
  inputs: Pick<TimerTableInputs, 'modulation' | 'tableLength'>,
  channelCount: number,
): CompareSense[][] {
  const { modulation, tableLength } = inputs;
  const reduced = isReducedCommonMode(modulation);
  const middle = Array.from({ length: tableLength }, (_, i) =>
    reduced ? middlePhase(((i + 1) * 2 * Math.PI) / tableLength) : -1,
  );
  return Array.from({ length: channelCount }, (_, k) =>
    middle.map((phase): CompareSense => (phase === k ? 'above' : 'below')),
  );
}

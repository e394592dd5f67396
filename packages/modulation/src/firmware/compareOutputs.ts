import { harmonics } from '../spectrum/harmonics.js';
import { thd } from '../spectrum/thd.js';
import type { Waveform } from '../waveform/Waveform.js';
import type { FirmwareEffect } from './firmwareEffectTypes.js';
import type { TimerTable } from './timerTableTypes.js';

/** Internal: the default highest order, four carrier groups (covers the unipolar 2mf group twice). */
export function defaultMaxOrder(table: TimerTable): number {
  return Math.min(100_000, 4 * table.carrierPeriodsPerFundamental + 1);
}

/** Internal: fundamental and THD of two waveforms, reference against realised. */
export function compareOutputs(
  reference: Waveform,
  realised: Waveform,
  maxOrder: number,
): FirmwareEffect {
  const before = harmonics(reference, maxOrder);
  const after = harmonics(realised, maxOrder);
  const b1 = before[1] as { amplitude: number; phase: number };
  const a1 = after[1] as { amplitude: number; phase: number };
  const referenceThd = thd(before);
  const realisedThd = thd(after);
  let phaseChange = a1.phase - b1.phase;
  phaseChange -= 2 * Math.PI * Math.round(phaseChange / (2 * Math.PI));
  return {
    reference,
    realised,
    referenceFundamental: b1.amplitude,
    realisedFundamental: a1.amplitude,
    fundamentalChange: a1.amplitude - b1.amplitude,
    fundamentalPhaseChange: phaseChange,
    referenceThd,
    realisedThd,
    thdChange: realisedThd - referenceThd,
    maxOrder,
  };
}

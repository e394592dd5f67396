import { assertNumberInRange } from '../validation/assertions.js';
import { compareOutputs, defaultMaxOrder } from './compareOutputs.js';
import type { FirmwareEffect } from './firmwareEffectTypes.js';
import { timerTableWaveforms } from './timerTableWaveforms.js';
import type { TimerTable } from './timerTableTypes.js';

/** Options of {@link quantisationEffect}. */
export interface QuantisationEffectOptions {
  /** Highest harmonic order for THD. @default 4·(carrier periods per fundamental) + 1 */
  maxOrder?: number;
}

/** Result of {@link quantisationEffect}. */
export interface QuantisationEffect extends FirmwareEffect {
  /** The table's largest rounding error, volts of leg average (from {@link timerTable}). */
  maxQuantisationError: number;
}

/**
 * Effect of rounding the compare values to whole counts: the output realised from the
 * table's compare values against the one the unrounded duties (duty·fullScale, fractional
 * counts) would give, both without dead time. Exact waveforms, exact harmonics.
 */
export function quantisationEffect(
  table: TimerTable,
  options: QuantisationEffectOptions = {},
): QuantisationEffect {
  const { maxOrder = defaultMaxOrder(table) } = options;
  assertNumberInRange('maxOrder', maxOrder, { min: 1, max: 100_000, integer: true });
  const ideal = timerTableWaveforms(table, { counts: 'ideal', includeDeadTime: false });
  const quantised = timerTableWaveforms(table, { counts: 'quantised', includeDeadTime: false });
  return {
    ...compareOutputs(
      ideal.outputs[0] as FirmwareEffect['reference'],
      quantised.outputs[0] as FirmwareEffect['reference'],
      maxOrder,
    ),
    maxQuantisationError: table.maxQuantisationError,
  };
}

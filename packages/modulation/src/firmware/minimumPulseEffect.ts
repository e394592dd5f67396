import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import type { Waveform } from '../waveform/Waveform.js';
import { compareOutputs, defaultMaxOrder } from './compareOutputs.js';
import type { FirmwareEffect } from './firmwareEffectTypes.js';
import { timerTableWaveforms } from './timerTableWaveforms.js';
import type { NarrowPulseAction, TimerTable } from './timerTableTypes.js';

/** Options of {@link minimumPulseEffect}. */
export interface MinimumPulseEffectOptions {
  /** Narrowest pulse the gate driver and switches accept, seconds (≥ 0, ≤ a carrier period). */
  minPulseWidth: number;
  /** `'drop'`: a narrower pulse is left out; `'clamp'`: it is widened to the minimum. @default 'drop' */
  action?: NarrowPulseAction;
  /** Highest harmonic order for THD. @default 4·(carrier periods per fundamental) + 1 */
  maxOrder?: number;
}

/** Result of {@link minimumPulseEffect}. */
export interface MinimumPulseEffect extends FirmwareEffect {
  /** Pulses (on or off) narrower than the minimum that were dropped or clamped, all channels. */
  adjustedPulses: number;
  action: NarrowPulseAction;
}

/**
 * Effect of a minimum pulse width: every on-pulse, then every off-pulse, of each channel's
 * gate signal (from the quantised compare values, without dead time) that is narrower than
 * `minPulseWidth` is dropped or clamped to the minimum, centred where it was. Near the peaks
 * of the reference this removes or widens the narrow pulses, which changes the fundamental
 * (dropping narrow off-pulses raises it) and adds low-order distortion. Common practice
 * (gate drivers and switches need a minimum on- and off-time).
 */
export function minimumPulseEffect(
  table: TimerTable,
  options: MinimumPulseEffectOptions,
): MinimumPulseEffect {
  const { minPulseWidth, action = 'drop', maxOrder = defaultMaxOrder(table) } = options;
  assertNumberInRange('minPulseWidth', minPulseWidth, {
    min: 0,
    max: 1 / table.realisedCarrierFrequency,
  });
  assertOneOf('action', action, ['drop', 'clamp'] as const);
  assertNumberInRange('maxOrder', maxOrder, { min: 1, max: 100_000, integer: true });
  const before = timerTableWaveforms(table, { includeDeadTime: false });
  const after = timerTableWaveforms(table, {
    includeDeadTime: false,
    minimumPulse: { width: minPulseWidth, action },
  });
  return {
    ...compareOutputs(before.outputs[0] as Waveform, after.outputs[0] as Waveform, maxOrder),
    adjustedPulses: after.adjustedPulses,
    action,
  };
}

import type { Waveform } from '../waveform/Waveform.js';
import { compareOutputs, defaultMaxOrder } from './compareOutputs.js';
import { deadTimeEffect, type DeadTimeEffect } from './deadTimeEffect.js';
import type { FirmwareEffect } from './firmwareEffectTypes.js';
import { minimumPulseEffect, type MinimumPulseEffect } from './minimumPulseEffect.js';
import { quantisationEffect, type QuantisationEffect } from './quantisationEffect.js';
import { timerTableWaveforms } from './timerTableWaveforms.js';
import type { NarrowPulseAction, TimerTable } from './timerTableTypes.js';

/** Options of {@link firmwareEffects}. */
export interface FirmwareEffectsOptions {
  /** Lag of the load current behind sin θ, rad. @default 0 */
  currentAngle?: number;
  /** Minimum pulse width, s. @default 0 (none) */
  minPulseWidth?: number;
  /** @default 'drop' */
  action?: NarrowPulseAction;
  /** Highest harmonic order for THD. @default 4·(carrier periods per fundamental) + 1 */
  maxOrder?: number;
  /**
   * Device on-state voltage drops, volts ≥ 0 (the threshold model of `timerTableWaveforms`:
   * the conducting transistor takes `transistor`, the conducting diode `diode`, against the
   * current). @default none (ideal switches)
   */
  onStateDrop?: { transistor: number; diode: number };
}

/** Result of {@link firmwareEffects}. */
export interface FirmwareEffects {
  quantisation: QuantisationEffect;
  deadTime: DeadTimeEffect;
  minimumPulse: MinimumPulseEffect;
  /**
   * The on-state drops alone: the rounded counts with dead time and ideal switches against the
   * same with the drops, for the same current; null without `onStateDrop`.
   */
  onStateDrop: FirmwareEffect | null;
  /** All of them at once (rounded counts, minimum pulse, then dead time) against the ideal duties. */
  combined: FirmwareEffect;
}

/**
 * The effects a firmware engineer should see before flashing a table, each isolated
 * (quantisation: ideal → rounded counts; dead time: rounded counts without → with dead time;
 * minimum pulse: rounded counts without → with the minimum width; with `onStateDrop`, the
 * devices' on-state drops: ideal switches → the drops, dead time included), and all of them
 * together against the ideal duties. See {@link quantisationEffect}, {@link deadTimeEffect},
 * {@link minimumPulseEffect} for the models and sources.
 */
export function firmwareEffects(
  table: TimerTable,
  options: FirmwareEffectsOptions = {},
): FirmwareEffects {
  const {
    currentAngle = 0,
    minPulseWidth = 0,
    action = 'drop',
    maxOrder = defaultMaxOrder(table),
    onStateDrop,
  } = options;
  const quantisation = quantisationEffect(table, { maxOrder });
  const deadTime = deadTimeEffect(table, { currentAngle, maxOrder });
  const minimumPulse = minimumPulseEffect(table, { minPulseWidth, action, maxOrder });
  const ideal = timerTableWaveforms(table, { counts: 'ideal', includeDeadTime: false });
  const realised = timerTableWaveforms(table, {
    currentAngle,
    includeDeadTime: true,
    ...(minPulseWidth > 0 ? { minimumPulse: { width: minPulseWidth, action } } : {}),
    ...(onStateDrop === undefined ? {} : { onStateDrop }),
  });
  const dropEffect = (drops: { transistor: number; diode: number }): FirmwareEffect =>
    compareOutputs(
      timerTableWaveforms(table, { currentAngle, includeDeadTime: true }).outputs[0] as Waveform,
      timerTableWaveforms(table, { currentAngle, includeDeadTime: true, onStateDrop: drops })
        .outputs[0] as Waveform,
      maxOrder,
    );
  return {
    quantisation,
    deadTime,
    minimumPulse,
    onStateDrop: onStateDrop === undefined ? null : dropEffect(onStateDrop),
    combined: compareOutputs(
      ideal.outputs[0] as Waveform,
      realised.outputs[0] as Waveform,
      maxOrder,
    ),
  };
}

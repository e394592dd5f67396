import { TAU } from '../math.js';
import { assertNumberInRange } from '../validation/assertions.js';
import type { Waveform } from '../waveform/Waveform.js';
import { compareOutputs, defaultMaxOrder } from './compareOutputs.js';
import type { FirmwareEffect } from './firmwareEffectTypes.js';
import { timerTableWaveforms } from './timerTableWaveforms.js';
import type { TimerTable } from './timerTableTypes.js';
import { harmonics } from '../spectrum/harmonics.js';

/** Options of {@link deadTimeEffect}. */
export interface DeadTimeEffectOptions {
  /** Lag of the load current behind sin θ, rad (leg a / A carries sin(θ − currentAngle)). @default 0 */
  currentAngle?: number;
  /** Highest harmonic order for THD. @default 4·(carrier periods per fundamental) + 1 */
  maxOrder?: number;
}

/** Result of {@link deadTimeEffect}. */
export interface DeadTimeEffect extends FirmwareEffect {
  /** Average leg-voltage error over a carrier period, V: vdc·realisedDeadTime·realisedCarrierFrequency. */
  legVoltageError: number;
  /** Fundamental the average-value model predicts, V (see the function's notes). */
  predictedFundamental: number;
  /** predictedFundamental − referenceFundamental, V. */
  predictedFundamentalChange: number;
}

/**
 * Effect of the dead time: the output with the table's dead time against the same compare
 * values without it, for a sinusoidal load current lagging sin θ by `currentAngle`.
 *
 * Average-value model (T. Murai, T. Watanabe, S. Miyairi, IEEE Trans. Ind. Appl. 1987, from
 * memory): in every carrier period the leg loses (current > 0) or gains (current < 0) the
 * volt-seconds of one dead time, an average error ΔV = td·fsw·vdc with the sign of the
 * current, i.e. a square wave −ΔV·sgn(i). Its fundamental is −(4/π)·ΔV·sin(θ − φ) per leg;
 * the H-bridge output (leg B carries −i) gets twice that, −(8/π)·ΔV·sin(θ − φ), and a
 * line-to-line voltage √3·(4/π)·ΔV. With the current in phase with the voltage the
 * fundamental falls by (8/π)·td·fsw·vdc (H-bridge). The model ignores pulses swallowed by the
 * dead time (near 0 and 100 % duty) and the carrier period in which the current changes sign.
 */
export function deadTimeEffect(
  table: TimerTable,
  options: DeadTimeEffectOptions = {},
): DeadTimeEffect {
  const { currentAngle = 0, maxOrder = defaultMaxOrder(table) } = options;
  assertNumberInRange('currentAngle', currentAngle, { min: -1e6, max: 1e6 });
  assertNumberInRange('maxOrder', maxOrder, { min: 1, max: 100_000, integer: true });
  const without = timerTableWaveforms(table, { includeDeadTime: false, currentAngle });
  const withDead = timerTableWaveforms(table, { includeDeadTime: true, currentAngle });
  const effect = compareOutputs(
    without.outputs[0] as Waveform,
    withDead.outputs[0] as Waveform,
    maxOrder,
  );
  const legVoltageError =
    (table.parameters.vdc * table.deadTimeCounts) / table.ticksPerCarrierPeriod;
  const reference = harmonics(without.outputs[0] as Waveform, 1)[1] as {
    amplitude: number;
    phase: number;
  };
  // Phasors in the sine basis: X·sin(θ + p) ↔ X·e^{jp}; leg error −(4/π)·ΔV·e^{−jψ}.
  const legError = (psi: number): [number, number] => [
    -(4 / Math.PI) * legVoltageError * Math.cos(-psi),
    -(4 / Math.PI) * legVoltageError * Math.sin(-psi),
  ];
  const { modulation } = table.parameters;
  let error: [number, number];
  if (modulation.method === 'three-phase') {
    const [ar, ai] = legError(currentAngle);
    const [br, bi] = legError(currentAngle + TAU / 3);
    error = [ar - br, ai - bi];
  } else {
    const [ar, ai] = legError(currentAngle);
    error = [2 * ar, 2 * ai];
  }
  const predictedFundamental = Math.hypot(
    reference.amplitude * Math.cos(reference.phase) + error[0],
    reference.amplitude * Math.sin(reference.phase) + error[1],
  );
  return {
    ...effect,
    legVoltageError,
    predictedFundamental,
    predictedFundamentalChange: predictedFundamental - effect.referenceFundamental,
  };
}

import { TAU } from '../math.js';
import { harmonics } from '../spectrum/harmonics.js';
import { thd } from '../spectrum/thd.js';
import { assertFiniteArray, assertNumberInRange } from '../validation/assertions.js';
import type { Waveform } from '../waveform/Waveform.js';
import { compensateDeadTime, type CompensatedTimerTable } from './compensateDeadTime.js';
import { defaultMaxOrder } from './compareOutputs.js';
import { timerTableWaveforms } from './timerTableWaveforms.js';
import type { TimerTable } from './timerTableTypes.js';

/** Options of {@link deadTimeCompensation}. */
export interface DeadTimeCompensationOptions {
  /**
   * Lag of each leg's current behind its sine reference, rad: leg a (A) carries
   * sin(θ − currentAngle), legs b, c lag a further 2π/3, 4π/3, H-bridge leg B the opposite. The
   * realised waveforms are built with it.
   * @default 0
   */
  currentAngle?: number;
  /**
   * The lag the correction assumes (the firmware's prediction of the load angle), rad; give one
   * different from `currentAngle` to see what a wrong prediction does.
   * @default currentAngle
   */
  predictedCurrentAngle?: number;
  /** Orders reported before and after. @default [5, 7, 11, 13] three-phase, [3, 5, 7] H-bridge */
  orders?: readonly number[];
  /** Highest order of the THD. @default 4·(carrier periods per fundamental) + 1 */
  maxOrder?: number;
}

/** The first output's figures (H-bridge vAB or line vab): peak volts, THD a ratio to maxOrder. */
export interface CompensationFigures {
  fundamental: number;
  harmonics: { order: number; amplitude: number }[];
  thd: number;
}

/** Result of {@link deadTimeCompensation}; plain data. */
export interface DeadTimeCompensation extends CompensatedTimerTable {
  /** The table without dead time: what the reference asks for. */
  ideal: CompensationFigures;
  /** The table as it is, with its dead time. */
  uncompensated: CompensationFigures;
  /** The corrected table with its dead time. */
  compensated: CompensationFigures;
  /** The exact first output the corrected table produces with dead time (timer ticks as edges). */
  compensatedOutput: Waveform;
}

/**
 * Dead-time compensation by the sign of the predicted phase current (T. Murai, T. Watanabe,
 * S. Miyairi, IEEE Trans. Ind. Appl., 1987, from memory): in each carrier period dead time takes
 * from a leg the high time of its delayed turn-ons while the current flows out of the leg (the
 * lower diode holds it low) and gives it while the current flows in, so each compare value is moved
 * by those ticks the other way, by the sign of the current predicted at the entry's angle.
 *
 * Ticks per carrier period (D = the table's dead-time ticks), from the switching model of
 * {@link timerTableWaveforms}: 'dead-time-register' (every turn-on delayed by D) loses D for a
 * positive current and gains D for a negative one; 'compare-offset' (edges moved by ⌊D/2⌋ and
 * D − ⌊D/2⌋) loses 2⌊D/2⌋ and gains 2(D − ⌊D/2⌋). A count is 2 ticks of pulse for centre-aligned
 * counting (the pulse spans both halves) and 1 for edge-aligned, so the correction is that many
 * ticks divided by the ticks a count is worth, rounded to whole counts. Clamped entries (0 or 100 %
 * duty) switch nothing and are left alone; corrected values are held within [0, full scale].
 *
 * What it cannot correct: the carrier periods in which the current changes sign (the predicted
 * sign is wrong for part of them), the current's ripple about its prediction, a wrong prediction
 * of the load angle, pulses narrower than the dead time, and half a count of rounding. The result
 * reports the first output's exact fundamental and low-order harmonics with neither dead time nor
 * correction, with dead time, and with both, from the exact waveforms the tables produce.
 */
export function deadTimeCompensation(
  table: TimerTable,
  options: DeadTimeCompensationOptions = {},
): DeadTimeCompensation {
  const { modulation } = table.parameters;
  const threePhase = modulation.method === 'three-phase';
  const {
    currentAngle = 0,
    predictedCurrentAngle = currentAngle,
    orders = threePhase ? [5, 7, 11, 13] : [3, 5, 7],
    maxOrder = defaultMaxOrder(table),
  } = options;
  assertNumberInRange('currentAngle', currentAngle, { min: -TAU, max: TAU });
  assertFiniteArray('orders', orders, 1, 50);
  orders.forEach((n, i) =>
    assertNumberInRange(`orders[${i}]`, n, { min: 2, max: maxOrder, integer: true }),
  );
  assertNumberInRange('maxOrder', maxOrder, { min: 2, max: 100_000, integer: true });

  const {
    table: corrected,
    correction,
    correctionTicks,
    deadTimeTicks,
  } = compensateDeadTime(table, { predictedCurrentAngle });
  const figures = (waveform: Waveform): CompensationFigures => {
    const spectrum = harmonics(waveform, maxOrder);
    return {
      fundamental: spectrum[1]?.amplitude ?? 0,
      harmonics: orders.map((order) => ({ order, amplitude: spectrum[order]?.amplitude ?? 0 })),
      thd: thd(spectrum),
    };
  };
  const first = (t: TimerTable, includeDeadTime: boolean): Waveform =>
    timerTableWaveforms(t, { includeDeadTime, currentAngle }).outputs[0] as Waveform;
  const compensatedOutput = first(corrected, true);
  return {
    table: corrected,
    correction,
    correctionTicks,
    deadTimeTicks,
    ideal: figures(first(table, false)),
    uncompensated: figures(first(table, true)),
    compensated: figures(compensatedOutput),
    compensatedOutput,
  };
}

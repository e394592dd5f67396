import { TAU } from '../math.js';
import { harmonics } from '../spectrum/harmonics.js';
import { thd } from '../spectrum/thd.js';
import { assertFiniteArray, assertNumberInRange } from '../validation/assertions.js';
import type { Waveform } from '../waveform/Waveform.js';
import { channelCurrentPhases } from './channelCurrentPhases.js';
import { complementaryCompares } from './complementaryCompares.js';
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
export interface DeadTimeCompensation {
  /** The table with compare, high- and low-side values corrected (duty stays the ideal one). */
  table: TimerTable;
  /** Counts added to each channel's compare value per entry (0 where the leg is clamped). */
  correction: number[][];
  /** Ticks of high time the correction adds per carrier period for a positive (out of the leg) and a negative current. */
  correctionTicks: { positive: number; negative: number };
  /** Ticks of high time dead time removes (positive current) or adds (negative) per carrier period. */
  deadTimeTicks: { positive: number; negative: number };
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
  assertNumberInRange('predictedCurrentAngle', predictedCurrentAngle, { min: -TAU, max: TAU });
  assertFiniteArray('orders', orders, 1, 50);
  orders.forEach((n, i) =>
    assertNumberInRange(`orders[${i}]`, n, { min: 2, max: maxOrder, integer: true }),
  );
  assertNumberInRange('maxOrder', maxOrder, { min: 2, max: 100_000, integer: true });

  const dead = table.deadTimeCounts;
  const half = Math.floor(dead / 2);
  const deadTimeTicks =
    table.parameters.deadTimeMethod === 'compare-offset'
      ? { positive: 2 * half, negative: 2 * (dead - half) }
      : { positive: dead, negative: dead };
  const ticksPerCount = table.ticksPerCarrierPeriod / table.fullScaleCounts;
  const counts = {
    positive: Math.round(deadTimeTicks.positive / ticksPerCount),
    negative: Math.round(deadTimeTicks.negative / ticksPerCount),
  };
  const full = table.fullScaleCounts;
  const lags = channelCurrentPhases(table, predictedCurrentAngle);
  const correction: number[][] = [];
  const channels = table.channels.map((channel, k) => {
    const lag = lags[k] as number;
    const added = channel.compare.map((c, i) => {
      if (c <= 0 || c >= full) return 0;
      const current = Math.sin((table.entryAngles[i] as number) - lag);
      const wanted = current > 0 ? counts.positive : current < 0 ? -counts.negative : 0;
      return Math.min(full, Math.max(0, c + wanted)) - c;
    });
    correction.push(added);
    const compare = channel.compare.map((c, i) => c + (added[i] as number));
    const offset = table.parameters.deadTimeMethod === 'compare-offset' ? dead : 0;
    return { ...channel, compare, ...complementaryCompares(compare, full, offset) };
  });
  const corrected: TimerTable = {
    ...table,
    channels,
    warnings: [
      ...table.warnings,
      {
        field: 'deadTime',
        message: `compare values corrected for dead time by +${counts.positive} / −${counts.negative} counts by the sign of the current predicted at a lag of ${predictedCurrentAngle} rad (T. Murai et al., 1987); a wrong prediction of the load angle makes the error worse, not better`,
      },
    ],
  };
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
    correctionTicks: {
      positive: counts.positive * ticksPerCount,
      negative: counts.negative * ticksPerCount,
    },
    deadTimeTicks,
    ideal: figures(first(table, false)),
    uncompensated: figures(first(table, true)),
    compensated: figures(compensatedOutput),
    compensatedOutput,
  };
}

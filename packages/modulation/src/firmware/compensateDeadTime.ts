import { TAU } from '../math.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { channelCurrentPhases } from './channelCurrentPhases.js';
import { complementaryCompares } from './complementaryCompares.js';
import { senseChangeCorrection } from './senseChangeCorrection.js';
import type { TimerTable } from './timerTableTypes.js';

/** Result of {@link compensateDeadTime}; plain data. */
export interface CompensatedTimerTable {
  /** The table with compare, high- and low-side values corrected (duty stays the ideal one). */
  table: TimerTable;
  /** Counts added to each channel's compare value per entry (0 where the leg is clamped). */
  correction: number[][];
  /** Ticks of high time the correction adds per carrier period for a positive (out of the leg) and a negative current. */
  correctionTicks: { positive: number; negative: number };
  /** Ticks of high time dead time removes (positive current) or adds (negative) per carrier period. */
  deadTimeTicks: { positive: number; negative: number };
}

/**
 * A timer table whose compare values are corrected for its dead time by the sign of the phase
 * current predicted at each entry (T. Murai, T. Watanabe, S. Miyairi, IEEE Trans. Ind. Appl.,
 * 1987, from memory): what a controller loads. The rules, the limits and the measured effect are
 * those of {@link deadTimeCompensation}, which also builds the waveforms before and after.
 * Where a channel's compare sense changes (the reduced common-mode methods `azspwm1`, `nspwm`) the
 * leg switches at the update event itself, one pulse more than the per-period rule counts; that
 * edge's dead time is corrected too, by the sign of the current predicted at the update (a whole
 * D counts on the entry whose pulse starts or ends there).
 *
 * @param options.predictedCurrentAngle - lag of leg a's current behind sin θ, rad (legs b, c a
 *   further 2π/3, 4π/3; H-bridge leg B the opposite current), in [−2π, 2π]. @default 0
 */
export function compensateDeadTime(
  table: TimerTable,
  { predictedCurrentAngle = 0 }: { predictedCurrentAngle?: number } = {},
): CompensatedTimerTable {
  assertNumberInRange('predictedCurrentAngle', predictedCurrentAngle, { min: -TAU, max: TAU });
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
    const atSenseChanges = senseChangeCorrection(table, channel, lag);
    const added = channel.compare.map((c, i) => {
      if (c <= 0 || c >= full) return 0;
      const current = Math.sin((table.entryAngles[i] as number) - lag);
      const wanted =
        (current > 0 ? counts.positive : current < 0 ? -counts.negative : 0) +
        (atSenseChanges[i] as number);
      return Math.min(full, Math.max(0, c + wanted)) - c;
    });
    correction.push(added);
    const compare = channel.compare.map((c, i) => c + (added[i] as number));
    const offset = table.parameters.deadTimeMethod === 'compare-offset' ? dead : 0;
    return {
      ...channel,
      compare,
      ...complementaryCompares(compare, full, offset, channel.sense),
    };
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
  return {
    table: corrected,
    correction,
    correctionTicks: {
      positive: counts.positive * ticksPerCount,
      negative: counts.negative * ticksPerCount,
    },
    deadTimeTicks,
  };
}

import { ParameterRangeError } from '../validation/errors.js';
import { RATIO_TOLERANCE, type TimerTableInputs } from './timerTableInputs.js';

/** Fewest timer counts a carrier period may hold (below this the duty has no resolution). */
const MIN_PERIOD_COUNTS = 2;

/** The counter's period and the dead time in timer ticks. */
export interface TimerTiming {
  /** timerClock/carrierFrequency before rounding (ticks). */
  exactTicks: number;
  ticksPerCarrierPeriod: number;
  /** TOP (edge-aligned) or P (centre-aligned), counts. */
  periodRegister: number;
  /** The compare value of 100 % duty (counts). */
  fullScaleCounts: number;
  /** The dead time rounded up to whole ticks. */
  deadTimeCounts: number;
}

/**
 * Internal to timerTable: the period register for the counting mode (edge-aligned: TOP = ticks − 1,
 * full scale TOP + 1; centre-aligned: P = clock/(2·carrier), full scale P; common practice, from
 * memory) and the dead time in ticks, rounded up so it is never shorter than asked.
 *
 * @throws ParameterRangeError when the period does not fit the counter or has fewer than 2
 *   counts, or the dead time is half a carrier period or more
 */
export function timerTableTiming(
  inputs: Pick<
    TimerTableInputs,
    'countingMode' | 'timerClock' | 'carrierFrequency' | 'counterBits' | 'deadTime'
  >,
): TimerTiming {
  const { countingMode, timerClock, carrierFrequency, counterBits, deadTime } = inputs;
  const period = periodTiming(countingMode, timerClock, carrierFrequency, counterBits);
  const carrierPeriodSeconds = 1 / carrierFrequency;
  if (deadTime >= carrierPeriodSeconds / 2) {
    throw new ParameterRangeError(
      'deadTime',
      `a time in seconds ≥ 0 and < half the carrier period (${carrierPeriodSeconds / 2} s)`,
      deadTime,
    );
  }
  // Math.max: a zero dead time gives 0 ticks, not −0 (which JSON writes as 0).
  const deadTimeCounts = Math.max(0, Math.ceil(deadTime * timerClock - RATIO_TOLERANCE));
  if (2 * deadTimeCounts >= period.ticksPerCarrierPeriod) {
    throw new ParameterRangeError(
      'deadTime',
      `shorter than half the carrier period in counts (${period.ticksPerCarrierPeriod / 2} ticks); got ${deadTimeCounts} ticks`,
      deadTime,
    );
  }
  return { ...period, deadTimeCounts };
}

function periodTiming(
  mode: TimerTableInputs['countingMode'],
  clock: number,
  carrier: number,
  bits: number,
): Omit<TimerTiming, 'deadTimeCounts'> {
  const maxCount = 2 ** bits;
  if (mode === 'edge-aligned') {
    const exact = clock / carrier;
    const ticks = Math.round(exact);
    if (ticks > maxCount || ticks < MIN_PERIOD_COUNTS) {
      throw new ParameterRangeError(
        'timerClock/carrierFrequency',
        `${MIN_PERIOD_COUNTS} to 2^${bits} = ${maxCount} counts for a ${bits}-bit edge-aligned counter (TOP = ticks − 1 ≤ ${maxCount - 1}); use a prescaler, a wider counter or another carrier frequency`,
        exact,
      );
    }
    return {
      exactTicks: exact,
      ticksPerCarrierPeriod: ticks,
      periodRegister: ticks - 1,
      fullScaleCounts: ticks,
    };
  }
  const exactPeriod = clock / (2 * carrier);
  const period = Math.round(exactPeriod);
  if (period > maxCount - 1 || period < MIN_PERIOD_COUNTS) {
    throw new ParameterRangeError(
      'timerClock/(2·carrierFrequency)',
      `${MIN_PERIOD_COUNTS} to ${maxCount - 1} counts for a ${bits}-bit centre-aligned counter (period register P ≤ 2^${bits} − 1); use a prescaler, a wider counter or another carrier frequency`,
      exactPeriod,
    );
  }
  return {
    exactTicks: 2 * exactPeriod,
    ticksPerCarrierPeriod: 2 * period,
    periodRegister: period,
    fullScaleCounts: period,
  };
}

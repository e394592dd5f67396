import type { MultilevelCarrierOptions } from '../multilevel/MultilevelTypes.js';
import type { DeadTimeMethod, TimerPeriodFigures, TimerWarning } from './timerTableTypes.js';

/**
 * Types of a multilevel timer table ({@link multilevelTimerTable}). Plain, serialisable data.
 *
 * Units: frequencies in hertz, times in seconds, voltages in volts, angles in radians of the
 * fundamental, compare values, offsets and ticks in timer counts (ticks of the timer clock).
 */

/**
 * The multilevel carrier modulation a table is built from: `multilevelCarrier`'s options with
 * regular sampling (a timer holds one compare value per update). `mf` may be left out: it is
 * carrierFrequency/fundamentalFrequency; when given it must equal that ratio.
 */
export type MultilevelTimerModulation = Omit<MultilevelCarrierOptions, 'mf' | 'sampling'> & {
  /** @default carrierFrequency/fundamentalFrequency */
  mf?: number;
  /** @default 'regular-symmetric' */
  sampling?: 'regular-symmetric' | 'regular-asymmetric';
};

/** Options of {@link multilevelTimerTable}. */
export interface MultilevelTimerTableOptions {
  modulation: MultilevelTimerModulation;
  /** Fundamental (output) frequency, Hz. */
  fundamentalFrequency: number;
  /** Carrier frequency of every carrier (each device's switching period), Hz. */
  carrierFrequency: number;
  /** Timer input clock after the prescaler, Hz. */
  timerClock: number;
  /**
   * Only `'centre-aligned'` (up-down counting): the triangle carriers of multilevel carrier PWM
   * are up-down counters; an up-counter gives a sawtooth carrier, another modulation.
   * @default 'centre-aligned'
   */
  countingMode?: 'centre-aligned';
  /** Counter width in bits, integer 8..32. @default 16 */
  counterBits?: number;
  /** Dead time between the two switches of each complementary pair, seconds. @default 0 */
  deadTime?: number;
  /**
   * `'dead-time-register'`: one compare value per pair; the timer's dead-time generator delays
   * every turn-on by the dead time. `'compare-offset'`: separate upper and lower compare values,
   * each half the dead time from the ideal edge; refused when a pair has an edge at a counter
   * peak or valley (a band's duty reaching 0 or 100 %), which no compare offset can blank.
   * @default 'dead-time-register'
   */
  deadTimeMethod?: DeadTimeMethod;
  /**
   * Entries per fundamental period; must divide the compare updates per fundamental period
   * (mf, × 2 for asymmetric sampling).
   * @default the updates per fundamental period (one entry per update)
   */
  tableLength?: number;
}

/** One up-down counter (one carrier): its place in time, shared by every pair it drives. */
export interface MultilevelTimerCounter {
  /** `carrier 1` … (level-shifted, bottom band first) or `cell 1` … (phase-shifted). */
  name: string;
  /** Delay of this carrier behind the in-phase carrier, carrier radians (0, π, k·2π/N …). */
  carrierDelay: number;
  /**
   * Ticks this counter starts after the first counter (index 0), 0 ≤ offset <
   * ticksPerCarrierPeriod: start the first at its peak, then each counter at its peak this many
   * ticks later (the carrier's phase shift, rounded to a tick).
   */
  offsetTicks: number;
  /**
   * Tick of the fundamental period (tick 0 at θ = 0) at which this counter's entry 0 begins: a
   * counter peak, 0 ≤ startTick < ticksPerCarrierPeriod.
   */
  startTick: number;
  /** Angle at which the reference is sampled for each entry of this counter, rad. */
  entryAngles: number[];
}

/**
 * Two switches driven as a complementary pair by one compare value against one counter: a timer
 * channel's main output and its complementary output.
 */
export interface MultilevelTimerPair {
  /** Switch on while the counter is below its compare value (`S1`, `cell 2 upper`, …). */
  main: string;
  /** Its complement, on while the counter is at or above its compare value (`S3`, …). */
  complement: string;
  /** Index into `counters`. */
  counter: number;
  /** What the pair's carrier compares, in words (the band or the reference's sign). */
  description: string;
  /** Ideal duty of the main switch per entry, fraction in [0, 1] (no dead time). */
  duty: number[];
  /** round(duty·P) per entry, counts (no dead time). */
  compare: number[];
  /** The main switch's compare value per entry, counts (dead time applied for 'compare-offset'). */
  mainCompare: number[];
  /** The complement's compare value per entry, counts (dead time applied for 'compare-offset'). */
  complementCompare: number[];
}

/** The pairs of one leg (or cascaded string), as `multilevelCarrier` names its legs. */
export interface MultilevelTimerLeg {
  /** `leg a`, `leg b`, `leg c` or `string a` … */
  name: string;
  pairs: MultilevelTimerPair[];
}

/**
 * Result of {@link multilevelTimerTable}. Its period figures are those of a centre-aligned counter:
 * periodRegister = fullScaleCounts = P, ticksPerCarrierPeriod = 2·P.
 */
export interface MultilevelTimerTable extends TimerPeriodFigures {
  /** Every input, defaults filled in. */
  parameters: {
    modulation: Required<Omit<MultilevelTimerModulation, 'zeroSequence'>> & {
      zeroSequence?: MultilevelTimerModulation['zeroSequence'];
    };
    fundamentalFrequency: number;
    carrierFrequency: number;
    timerClock: number;
    countingMode: 'centre-aligned';
    counterBits: number;
    deadTime: number;
    deadTimeMethod: DeadTimeMethod;
    tableLength: number;
  };
  /** Unit of each numeric field of `parameters` and of the result. */
  units: Record<string, string>;
  /** The generation conventions and the complementary pairing, one sentence each. */
  conventions: string[];
  counters: MultilevelTimerCounter[];
  legs: MultilevelTimerLeg[];
  /** Largest |counter offset rounded − exact| over the counters, ticks (≤ ½). */
  maxOffsetRoundingTicks: number;
  /** Largest |compare − duty·P| over the table, ticks (≤ ½). */
  maxCompareRoundingTicks: number;
  warnings: TimerWarning[];
}

import { ZERO_SEQUENCES, type ZeroSequence } from '../three-phase/ZeroSequence.js';

/**
 * Types of a timer compare table ({@link timerTable}). Plain, serialisable data.
 *
 * Units: frequencies in hertz, times in seconds, voltages in volts, angles in radians of the
 * fundamental, compare and period values in timer counts (ticks of the timer clock).
 */

/**
 * The zero sequences a timer table takes: every carrier zero sequence, the discontinuous clamps
 * (each equals five-segment space vector with the same clamping, regular sampled: Holmes and
 * Lipo, 2003, ch. 7) and the reduced common-mode methods `azspwm1` and `nspwm` (A. M. Hava and
 * E. Ün, IEEE Trans. Power Electronics, 2009), whose middle leg runs with the compare sense
 * `'above'` ({@link CompareSense}).
 */
export type TimerZeroSequence = ZeroSequence;

/** The zero sequences a timer table takes, in the order of {@link ZERO_SEQUENCES}. */
export const TIMER_ZERO_SEQUENCES: readonly TimerZeroSequence[] = ZERO_SEQUENCES;

/**
 * How a channel's high-side output follows the counter in one entry (the channel's compare
 * polarity):
 * - `'below'`: high while the counter is below the high-side compare value (every entry of every
 *   method but the reduced common-mode ones): the reference against the carrier.
 * - `'above'`: high while the counter is above it: the reference against the inverted carrier,
 *   which the reduced common-mode methods (`azspwm1`, `nspwm`) give the middle phase. The
 *   compare values are then `full − compare` (dead time apart), so the high-side pulse is
 *   centred on the counter peak instead of the valley and keeps its width.
 * Firmware applies it by switching the channel's output polarity (active-high below the compare
 * value, or above it) at the update event that loads the entry's compare values.
 */
export type CompareSense = 'below' | 'above';

/** The modulation a table is built from (regular-sampled sine reference, peak `ma`). */
export type TimerModulation =
  | {
      /** Single-phase H-bridge, sine reference `ma·sin θ` against one carrier. */
      method: 'sine-triangle';
      /**
       * `'bipolar'`: one channel (leg A); leg B is driven crosswise from leg A's complementary
       * outputs (the diagonal pairs switch together). `'unipolar'`: two channels, leg A from
       * `+ma·sin θ` and leg B from `−ma·sin θ`, both against the same carrier.
       */
      scheme: 'bipolar' | 'unipolar';
      ma: number;
    }
  | {
      /** Three-phase two-level inverter, legs a, b, c at 0, −2π/3, −4π/3. */
      method: 'three-phase';
      /** @default 'none' */
      zeroSequence?: TimerZeroSequence;
      ma: number;
    };

/** Counting mode of the timer. */
export type CountingMode = 'edge-aligned' | 'centre-aligned';

/** What is done to a pulse narrower than the minimum width: left out, or widened to it. */
export type NarrowPulseAction = 'drop' | 'clamp';

/** How the dead time reaches the hardware. */
export type DeadTimeMethod = 'compare-offset' | 'dead-time-register';

/** Options of {@link timerTable}. */
export interface TimerTableOptions {
  modulation: TimerModulation;
  /** Fundamental (output) frequency, Hz. */
  fundamentalFrequency: number;
  /** Carrier (switching) frequency, Hz. */
  carrierFrequency: number;
  /**
   * `'regular-symmetric'`: one compare value per carrier period; `'regular-asymmetric'`: one
   * per half carrier period (centre-aligned only). The reduced common-mode methods (`azspwm1`,
   * `nspwm`) take `'regular-asymmetric'` only, as `threePhase` does (each half period's compare
   * sense follows its own middle phase).
   * @default 'regular-asymmetric' for `azspwm1` and `nspwm`, else 'regular-symmetric'
   */
  sampling?: 'regular-symmetric' | 'regular-asymmetric';
  /** Timer input clock after the prescaler, Hz. */
  timerClock: number;
  /** @default 'centre-aligned' */
  countingMode?: CountingMode;
  /** Counter width in bits, integer 8..32. @default 16 */
  counterBits?: number;
  /** Dead time between complementary outputs, seconds. @default 0 */
  deadTime?: number;
  /**
   * `'compare-offset'` (centre-aligned only): separate high- and low-side compare values,
   * each moved half the dead time away from the ideal edge. `'dead-time-register'`: one
   * compare value per channel; the timer's dead-time generator delays every turn-on. With a
   * dead time the reduced common-mode methods take `'dead-time-register'` only: where the
   * compare sense changes the leg switches at the update event itself (a counter peak or
   * valley), and no compare offset can separate the two switches there.
   * @default 'dead-time-register' for edge-aligned and for `azspwm1`/`nspwm`, else 'compare-offset'
   */
  deadTimeMethod?: DeadTimeMethod;
  /**
   * Entries per fundamental period; must divide the updates per fundamental period
   * (carrierFrequency/fundamentalFrequency, × 2 for asymmetric sampling). The reduced
   * common-mode methods take only the default (each half period has its own compare sense).
   * @default the updates per fundamental period (one entry per update)
   */
  tableLength?: number;
  /** DC bus voltage, V (for the quantisation figures and the realised waveforms). @default 1 */
  vdc?: number;
}

/** One timer channel (one inverter leg). */
export interface TimerChannel {
  /** Short identifier, `a`, `b` or `c` (used for C and CSV names). */
  name: string;
  /** What the channel drives, in words. */
  description: string;
  /** Ideal duty cycle of the high-side switch per entry, fraction in [0, 1] (no dead time). */
  duty: number[];
  /**
   * Ideal compare value per entry, round(duty·full) counts (no dead time): the high-side on-time
   * in counts per update, whatever the entry's sense (the register value itself for `'below'`).
   */
  compare: number[];
  /**
   * Compare sense per entry: `'below'` (high side on while the counter is below `highSide`)
   * or `'above'` (on while it is above; the reduced common-mode methods' middle phase).
   */
  sense: CompareSense[];
  /**
   * High-side compare value per entry, counts, as the register is loaded: `compare`
   * (`'below'`) or `full − compare` (`'above'`), then moved by the dead time for
   * 'compare-offset' (below: −⌊D/2⌋; above: +⌊D/2⌋).
   */
  highSide: number[];
  /**
   * Low-side compare value per entry, counts: the low side is on while the counter is at or
   * above it (`'below'`) or below it (`'above'`); the high side's value moved the other way by
   * D − ⌊D/2⌋ for 'compare-offset'.
   */
  lowSide: number[];
}

/** A soft problem: the table is usable but the engineer should know. */
export interface TimerWarning {
  field: string;
  message: string;
}

/** The period, update and dead-time figures every timer table reports (two-level and multilevel). */
export interface TimerPeriodFigures {
  /** Value for the period register: TOP = ticks − 1 (edge-aligned) or P (centre-aligned). */
  periodRegister: number;
  /** Compare value of 100 % duty: TOP + 1 (edge-aligned) or P (centre-aligned). */
  fullScaleCounts: number;
  /** Timer clock ticks in one carrier period: TOP + 1 or 2·P. */
  ticksPerCarrierPeriod: number;
  /** Carrier frequency the rounded period register gives, Hz. */
  realisedCarrierFrequency: number;
  /** Fundamental frequency the table gives at the realised carrier frequency, Hz. */
  realisedFundamentalFrequency: number;
  /** Carrier periods per fundamental period (integer). */
  carrierPeriodsPerFundamental: number;
  /** Compare updates per fundamental period (carrier periods, × 2 for asymmetric sampling). */
  updatesPerFundamental: number;
  /** Consecutive updates that reuse one entry (updatesPerFundamental / tableLength). */
  updatesPerEntry: number;
  /** Dead time in timer ticks (rounded up, so never shorter than asked). */
  deadTimeCounts: number;
  /** deadTimeCounts / timerClock, s. */
  realisedDeadTime: number;
}

/** Result of {@link timerTable}. */
export interface TimerTable extends TimerPeriodFigures {
  /** Every input, defaults filled in. */
  parameters: {
    modulation: {
      method: 'sine-triangle' | 'three-phase';
      scheme?: 'bipolar' | 'unipolar';
      zeroSequence?: TimerZeroSequence;
      ma: number;
    };
    fundamentalFrequency: number;
    carrierFrequency: number;
    sampling: 'regular-symmetric' | 'regular-asymmetric';
    timerClock: number;
    countingMode: CountingMode;
    counterBits: number;
    deadTime: number;
    deadTimeMethod: DeadTimeMethod;
    tableLength: number;
    vdc: number;
  };
  /** Unit of each numeric field of `parameters` and of the result. */
  units: Record<string, string>;
  /** The generation conventions, one sentence each (copied into the C header). */
  conventions: string[];
  /** Angle at which each entry's reference was sampled, radians of the fundamental. */
  entryAngles: number[];
  channels: TimerChannel[];
  /** Change of a leg's average voltage for one count, V (vdc / fullScaleCounts). */
  quantisationStep: number;
  /** Largest |rounded − ideal| compare over the table, expressed in volts of leg average. */
  maxQuantisationError: number;
  warnings: TimerWarning[];
}

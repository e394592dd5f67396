import { assertTimerFrequencies } from './assertTimerFrequencies.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import {
  TIMER_ZERO_SEQUENCES,
  type CountingMode,
  type DeadTimeMethod,
  type TimerModulation,
  type TimerTableOptions,
} from './timerTableTypes.js';

/** How the table samples the reference: once or twice per carrier period. */
export type TimerSampling = NonNullable<TimerTableOptions['sampling']>;

/** Relative tolerance for "is an integer" tests on frequency ratios (floating-point input). */
export const RATIO_TOLERANCE = 1e-9;

/**
 * Most entries a timer table may hold per fundamental period (each entry holds a compare value per
 * channel): bounds the work and the size of the answer; a controller's table is far shorter.
 */
export const MAX_TIMER_TABLE_LENGTH = 65_536;

/** The options of {@link timerTable} checked, with their defaults and the table's size. */
export interface TimerTableInputs {
  modulation: TimerModulation;
  fundamentalFrequency: number;
  carrierFrequency: number;
  sampling: TimerSampling;
  timerClock: number;
  countingMode: CountingMode;
  counterBits: number;
  deadTime: number;
  deadTimeMethod: DeadTimeMethod;
  vdc: number;
  /** Carrier periods per fundamental period (an integer ≥ 3). */
  carrierPeriods: number;
  /** Compare updates per fundamental period (twice the carrier periods with asymmetric sampling). */
  updatesPerFundamental: number;
  /** Entries of the table per fundamental period (a divisor of updatesPerFundamental). */
  tableLength: number;
}

/**
 * Internal to timerTable: checks every option (ranges, kinds, the combinations a counting mode
 * allows), applies the defaults and sizes the table, before any work.
 *
 * @throws ParameterRangeError / ParameterTypeError naming the field
 */
export function timerTableInputs(options: TimerTableOptions): TimerTableInputs {
  const modulation = checkModulation(options.modulation);
  const reducedCommonMode = isReducedCommonMode(modulation);
  const {
    fundamentalFrequency,
    carrierFrequency,
    sampling = reducedCommonMode ? 'regular-asymmetric' : 'regular-symmetric',
    timerClock,
    countingMode = 'centre-aligned',
    counterBits = 16,
    deadTime = 0,
    vdc = 1,
  } = options;
  assertTimerFrequencies({ fundamentalFrequency, carrierFrequency, timerClock });
  assertOneOf('sampling', sampling, ['regular-symmetric', 'regular-asymmetric'] as const);
  assertOneOf('countingMode', countingMode, ['edge-aligned', 'centre-aligned'] as const);
  assertNumberInRange('counterBits', counterBits, { min: 8, max: 32, integer: true });
  assertNumberInRange('deadTime', deadTime, { min: 0 });
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  const deadTimeMethod: DeadTimeMethod =
    options.deadTimeMethod ??
    (countingMode === 'centre-aligned' && !reducedCommonMode
      ? 'compare-offset'
      : 'dead-time-register');
  assertOneOf('deadTimeMethod', deadTimeMethod, ['compare-offset', 'dead-time-register'] as const);
  if (reducedCommonMode) {
    assertReducedCommonModeTimer(modulation, {
      countingMode,
      sampling,
      deadTimeMethod,
      deadTime,
    });
  }
  if (countingMode === 'edge-aligned' && sampling === 'regular-asymmetric') {
    throw new ParameterRangeError(
      'sampling',
      "'regular-symmetric' when countingMode is 'edge-aligned' (asymmetric sampling needs an up-down counter)",
      sampling,
    );
  }
  if (countingMode === 'edge-aligned' && deadTimeMethod === 'compare-offset') {
    throw new ParameterRangeError(
      'deadTimeMethod',
      "'dead-time-register' when countingMode is 'edge-aligned' (an up-counter has no second edge to offset at its reset)",
      deadTimeMethod,
    );
  }
  const carrierPeriods = integerRatio(carrierFrequency, fundamentalFrequency);
  const updatesPerFundamental = carrierPeriods * (sampling === 'regular-asymmetric' ? 2 : 1);
  const tableLength = checkedTableLength(options.tableLength, updatesPerFundamental, sampling);
  if (reducedCommonMode && tableLength !== updatesPerFundamental) {
    throw new ParameterRangeError(
      'tableLength',
      `${updatesPerFundamental}, the default (one entry per half carrier period), for zeroSequence '${modulation.method === 'three-phase' ? modulation.zeroSequence : ''}': each half period takes its own compare sense`,
      tableLength,
    );
  }
  return {
    modulation,
    fundamentalFrequency,
    carrierFrequency,
    sampling,
    timerClock,
    countingMode,
    counterBits,
    deadTime,
    deadTimeMethod,
    vdc,
    carrierPeriods,
    updatesPerFundamental,
    tableLength,
  };
}

function checkModulation(modulation: unknown): TimerModulation {
  if (typeof modulation !== 'object' || modulation === null) {
    throw new ParameterTypeError(
      'modulation',
      "an object { method: 'sine-triangle' | 'three-phase', ma, ... }",
      modulation,
    );
  }
  const m = modulation as Record<string, unknown>;
  assertOneOf('modulation.method', m.method, ['sine-triangle', 'three-phase'] as const);
  assertNumberInRange('modulation.ma', m.ma, { min: 0, minExclusive: true, max: 4 });
  if (m.method === 'sine-triangle') {
    assertOneOf('modulation.scheme', m.scheme, ['bipolar', 'unipolar'] as const);
    return { method: 'sine-triangle', scheme: m.scheme, ma: m.ma };
  }
  const zeroSequence = m.zeroSequence ?? 'none';
  assertOneOf('modulation.zeroSequence', zeroSequence, TIMER_ZERO_SEQUENCES);
  return { method: 'three-phase', zeroSequence, ma: m.ma };
}

/** Whether the table is for a reduced common-mode method (the middle leg's sense is inverted). */
export function isReducedCommonMode(modulation: TimerModulation): boolean {
  return (
    modulation.method === 'three-phase' &&
    (modulation.zeroSequence === 'azspwm1' || modulation.zeroSequence === 'nspwm')
  );
}

/**
 * The timer a reduced common-mode table needs: an up-down counter sampling each half period
 * (asymmetric sampling), as `threePhase` samples these methods, and
 * the dead-time generator when there is a dead time, since the leg switches at the update event
 * itself wherever the compare sense changes.
 */
function assertReducedCommonModeTimer(
  modulation: TimerModulation,
  timer: {
    countingMode: CountingMode;
    sampling: TimerSampling;
    deadTimeMethod: DeadTimeMethod;
    deadTime: number;
  },
): void {
  const name = `zeroSequence '${modulation.method === 'three-phase' ? modulation.zeroSequence : ''}'`;
  if (timer.countingMode !== 'centre-aligned') {
    throw new ParameterRangeError(
      'countingMode',
      `'centre-aligned' for ${name} (its middle leg's compare sense changes each half period, at the counter's peaks and valleys)`,
      timer.countingMode,
    );
  }
  if (timer.sampling !== 'regular-asymmetric') {
    throw new ParameterRangeError(
      'sampling',
      `'regular-asymmetric' for ${name} (each half period takes its own compare sense, as threePhase samples it)`,
      timer.sampling,
    );
  }
  if (timer.deadTime > 0 && timer.deadTimeMethod === 'compare-offset') {
    throw new ParameterRangeError(
      'deadTimeMethod',
      `'dead-time-register' for ${name} with a dead time (where the compare sense changes the leg switches at a counter peak or valley, and no compare offset can separate the two switches there)`,
      timer.deadTimeMethod,
    );
  }
}

function integerRatio(carrierFrequency: number, fundamentalFrequency: number): number {
  const ratio = carrierFrequency / fundamentalFrequency;
  const rounded = Math.round(ratio);
  if (rounded < 3 || Math.abs(ratio - rounded) > RATIO_TOLERANCE * ratio) {
    throw new ParameterRangeError(
      'carrierFrequency/fundamentalFrequency',
      'an integer ≥ 3 (the table holds whole carrier periods per fundamental period)',
      ratio,
    );
  }
  return rounded;
}

/** The table length given, or one entry per compare update; a divisor of the updates, bounded. */
function checkedTableLength(
  given: number | undefined,
  updatesPerFundamental: number,
  sampling: TimerSampling,
): number {
  if (given === undefined && updatesPerFundamental > MAX_TIMER_TABLE_LENGTH) {
    // The default (one entry per compare update) would size the table from the two frequencies
    // alone; refuse before any work rather than build millions of rows.
    throw new ParameterRangeError(
      'tableLength',
      `given when carrierFrequency/fundamentalFrequency${sampling === 'regular-asymmetric' ? ' × 2' : ''} (${updatesPerFundamental} compare updates per period) exceeds ${MAX_TIMER_TABLE_LENGTH}: a divisor of ${updatesPerFundamental} up to ${MAX_TIMER_TABLE_LENGTH}`,
      undefined,
    );
  }
  const tableLength = given ?? updatesPerFundamental;
  assertNumberInRange('tableLength', tableLength, {
    min: 1,
    max: Math.min(updatesPerFundamental, MAX_TIMER_TABLE_LENGTH),
    integer: true,
  });
  if (updatesPerFundamental % tableLength !== 0) {
    throw new ParameterRangeError(
      'tableLength',
      `a divisor of ${updatesPerFundamental} (compare updates per fundamental period)`,
      tableLength,
    );
  }
  return tableLength;
}

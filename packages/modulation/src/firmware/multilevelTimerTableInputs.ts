import { assertMultilevelCarrierOptions } from '../multilevel/carrier/assertMultilevelCarrierOptions.js';
import type { MultilevelCarrierOptions } from '../multilevel/MultilevelTypes.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { assertTimerFrequencies } from './assertTimerFrequencies.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { withFieldPrefix } from '../validation/withFieldPrefix.js';
import { MAX_TIMER_TABLE_LENGTH, RATIO_TOLERANCE } from './timerTableInputs.js';
import type { MultilevelTimerTableOptions } from './multilevelTimerTableTypes.js';
import type { DeadTimeMethod } from './timerTableTypes.js';

/**
 * Most compare values a multilevel timer table may hold per fundamental period (entries ×
 * complementary pairs of every leg): bounds the work and the answer before any is done. The
 * largest two-level table (65 536 entries × 3 legs) is 196 608.
 */
export const MAX_MULTILEVEL_TIMER_VALUES = 262_144;

/** The options of {@link multilevelTimerTable} checked, with their defaults and sizes. */
export interface MultilevelTimerTableInputs {
  /** The modulation with `mf` and `sampling` filled in, as `multilevelCarrier` takes it. */
  modulation: MultilevelCarrierOptions & {
    sampling: 'regular-symmetric' | 'regular-asymmetric';
    carrierPhase: number;
  };
  fundamentalFrequency: number;
  carrierFrequency: number;
  timerClock: number;
  countingMode: 'centre-aligned';
  counterBits: number;
  deadTime: number;
  deadTimeMethod: DeadTimeMethod;
  /** Compare updates per fundamental period and counter (mf, × 2 for asymmetric sampling). */
  updatesPerFundamental: number;
  tableLength: number;
  /** Complementary pairs over every leg (levels − 1 a leg or string). */
  pairCount: number;
}

/**
 * Internal to multilevelTimerTable: checks every option (the modulation by
 * `assertMultilevelCarrierOptions`, its fields named `modulation.…`), applies the defaults and
 * sizes the table, before any work.
 *
 * @throws ParameterRangeError / ParameterTypeError naming the field
 */
export function multilevelTimerTableInputs(
  options: MultilevelTimerTableOptions,
): MultilevelTimerTableInputs {
  const {
    fundamentalFrequency,
    carrierFrequency,
    timerClock,
    countingMode = 'centre-aligned',
    counterBits = 16,
    deadTime = 0,
    deadTimeMethod = 'dead-time-register',
  } = options;
  assertTimerFrequencies({ fundamentalFrequency, carrierFrequency, timerClock });
  if (countingMode !== 'centre-aligned') {
    throw new ParameterRangeError(
      'countingMode',
      "'centre-aligned' (the triangle carriers of multilevel carrier PWM are up-down counters; an up-counter is a sawtooth carrier, another modulation)",
      countingMode,
    );
  }
  assertNumberInRange('counterBits', counterBits, { min: 8, max: 32, integer: true });
  assertNumberInRange('deadTime', deadTime, { min: 0 });
  assertOneOf('deadTimeMethod', deadTimeMethod, ['compare-offset', 'dead-time-register'] as const);
  const mf = carrierPeriods(carrierFrequency, fundamentalFrequency);
  const modulation = checkedModulation(options.modulation, mf);
  const updatesPerFundamental = mf * (modulation.sampling === 'regular-asymmetric' ? 2 : 1);
  // Single-phase: a full bridge of two legs, or one cascaded string; three-phase: three.
  const legs =
    modulation.phaseCount === 3 ? 3 : modulation.topology === 'cascaded-h-bridge' ? 1 : 2;
  const pairCount = legs * (modulation.levels - 1);
  const tableLength = checkedTableLength(options.tableLength, updatesPerFundamental, pairCount);
  return {
    modulation,
    fundamentalFrequency,
    carrierFrequency,
    timerClock,
    countingMode,
    counterBits,
    deadTime,
    deadTimeMethod,
    updatesPerFundamental,
    tableLength,
    pairCount,
  };
}

/** Carrier periods per fundamental period: a whole number, 1 to 10 000 (the bounds of mf). */
function carrierPeriods(carrierFrequency: number, fundamentalFrequency: number): number {
  const ratio = carrierFrequency / fundamentalFrequency;
  const rounded = Math.round(ratio);
  if (rounded < 1 || rounded > 10_000 || Math.abs(ratio - rounded) > RATIO_TOLERANCE * ratio) {
    throw new ParameterRangeError(
      'carrierFrequency/fundamentalFrequency',
      'an integer from 1 to 10000 (the table holds whole carrier periods per fundamental period; it is mf)',
      ratio,
    );
  }
  return rounded;
}

function checkedModulation(
  modulation: unknown,
  mf: number,
): MultilevelTimerTableInputs['modulation'] {
  if (typeof modulation !== 'object' || modulation === null) {
    throw new ParameterTypeError(
      'modulation',
      'an object { topology, levels, carriers, phaseCount, ma, vdc, ... }',
      modulation,
    );
  }
  const m = modulation as Record<string, unknown>;
  const sampling = m.sampling ?? 'regular-symmetric';
  assertOneOf('modulation.sampling', sampling, [
    'regular-symmetric',
    'regular-asymmetric',
  ] as const);
  if (m.mf !== undefined && m.mf !== mf) {
    throw new ParameterRangeError(
      'modulation.mf',
      `carrierFrequency/fundamentalFrequency = ${mf}, or left out`,
      m.mf,
    );
  }
  const checked = { ...m, mf, sampling, carrierPhase: m.carrierPhase ?? 0 };
  withFieldPrefix('modulation.', () => {
    assertMultilevelCarrierOptions(checked);
  });
  // Only the fields the modulation has (a caller's object may carry others, such as `method`).
  const { topology, levels, carriers, phaseCount, ma, vdc, zeroSequence } =
    checked as unknown as MultilevelCarrierOptions;
  return {
    topology,
    levels,
    carriers,
    phaseCount,
    ma,
    mf,
    vdc,
    ...(zeroSequence !== undefined ? { zeroSequence } : {}),
    sampling,
    carrierPhase: checked.carrierPhase as number,
  };
}

/** The table length given, or one entry per compare update; a divisor of the updates, bounded. */
function checkedTableLength(
  given: number | undefined,
  updatesPerFundamental: number,
  pairCount: number,
): number {
  const largest = Math.min(
    updatesPerFundamental,
    MAX_TIMER_TABLE_LENGTH,
    Math.floor(MAX_MULTILEVEL_TIMER_VALUES / pairCount),
  );
  if (given === undefined && updatesPerFundamental > largest) {
    // The default (one entry per compare update) would size the table from the frequencies
    // alone; refuse before any work rather than build it.
    throw new ParameterRangeError(
      'tableLength',
      `given when the compare updates per fundamental period (${updatesPerFundamental}) × the ${pairCount} complementary pairs exceed ${MAX_MULTILEVEL_TIMER_VALUES} compare values: a divisor of ${updatesPerFundamental} up to ${largest}`,
      undefined,
    );
  }
  const tableLength = given ?? updatesPerFundamental;
  assertNumberInRange('tableLength', tableLength, { min: 1, max: largest, integer: true });
  if (updatesPerFundamental % tableLength !== 0) {
    throw new ParameterRangeError(
      'tableLength',
      `a divisor of ${updatesPerFundamental} (compare updates per fundamental period)`,
      tableLength,
    );
  }
  return tableLength;
}

import { TAU } from '../math.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import type { AngleTable } from './angleTableTypes.js';

/** Options of {@link angleTableFixedPoint}. */
export interface AngleTableFixedPointOptions {
  /** n of the unsigned fixed-point format Q0.n of the period fractions, 8..32. @default 16 */
  fractionBits?: number;
  /** Timer input clock after the prescaler, Hz (> 0). */
  timerClock: number;
  /** Fundamental (output) frequency, Hz (> 0). */
  fundamentalFrequency: number;
}

/** The table's angles as integers a controller stores. */
export interface AngleTableFixedPoint {
  fractionBits: number;
  /** Per row, round(α/2π · 2^n) per angle (Q0.n fractions of the period); null where not solved. */
  fractions: (number[] | null)[];
  /** Resolution of a fraction: 2^−n of the period. */
  fractionResolution: number;
  /** Timer ticks in one fundamental period: round(timerClock / fundamentalFrequency). */
  ticksPerPeriod: number;
  /** timerClock / ticksPerPeriod, Hz: the fundamental the rounded period gives. */
  realisedFundamentalFrequency: number;
  /** Per row, round(α/2π · ticksPerPeriod) per angle; null where not solved. */
  ticks: (number[] | null)[];
  timerClock: number;
  fundamentalFrequency: number;
}

/**
 * The angles of an {@link angleTable} as fractions of the fundamental period in unsigned fixed
 * point Q0.n (value = round(α/2π·2^n), read back as value·2^−n of the period, so within half
 * a step, 2^−(n+1), of the exact fraction) and as timer ticks from the start of the period for a
 * timer clock and fundamental frequency (round(α/2π·ticksPerPeriod), within half a tick). Both
 * roundings are to nearest (common practice for table generation).
 *
 * @throws ParameterRangeError naming the field: `fractionBits` outside 8..32,
 *   `timerClock` or `fundamentalFrequency` not > 0, or a period of fewer than 4 or more than
 *   2^32 − 1 ticks (`timerClock`)
 */
export function angleTableFixedPoint(
  table: AngleTable,
  options: AngleTableFixedPointOptions,
): AngleTableFixedPoint {
  const { fractionBits = 16, timerClock, fundamentalFrequency } = options;
  assertNumberInRange('fractionBits', fractionBits, { min: 8, max: 32, integer: true });
  assertNumberInRange('timerClock', timerClock, { min: 0, minExclusive: true, max: 1e12 });
  assertNumberInRange('fundamentalFrequency', fundamentalFrequency, {
    min: 0,
    minExclusive: true,
    max: 1e6,
  });
  const ticksPerPeriod = Math.round(timerClock / fundamentalFrequency);
  if (ticksPerPeriod < 4 || ticksPerPeriod > 2 ** 32 - 1) {
    throw new ParameterRangeError(
      'timerClock',
      `a clock giving 4 to 2^32 − 1 ticks per fundamental period at ${fundamentalFrequency} Hz`,
      timerClock,
    );
  }
  const full = 2 ** fractionBits;
  const encode = (scale: number) =>
    table.rows.map((row) =>
      row.solved ? row.angles.map((a) => Math.round((a / TAU) * scale)) : null,
    );
  return {
    fractionBits,
    fractions: encode(full),
    fractionResolution: 1 / full,
    ticksPerPeriod,
    realisedFundamentalFrequency: timerClock / ticksPerPeriod,
    ticks: encode(ticksPerPeriod),
    timerClock,
    fundamentalFrequency,
  };
}

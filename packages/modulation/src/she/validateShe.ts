/** Validation shared by the she/ entry points (internal). */
import { HALF_PI } from '../math.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { assertFiniteArray, assertNumberInRange } from '../validation/assertions.js';
import { fundamentalLimit } from './sheModel.js';
import type { FundamentalRange, SheKind } from './SheKind.js';

/** The most first-quarter angles a pattern may have; bounds the cost of one solve. */
export const MAX_SHE_ANGLES = 64;

/** The highest harmonic order that may be eliminated or weighted. */
export const MAX_SHE_ORDER = 10_000;

/** Asserts angles are finite, strictly ascending, inside (0, π/2), 1..64 of them. */
export function assertFirstQuarterAngles(
  field: string,
  angles: unknown,
): asserts angles is number[] {
  assertFiniteArray(field, angles, 1, MAX_SHE_ANGLES);
  for (let k = 0; k < angles.length; k++) {
    const angle = angles[k] as number;
    if (!(angle > 0 && angle < HALF_PI)) {
      throw new ParameterRangeError(`${field}[${k}]`, 'an angle in (0, π/2) radians', angle);
    }
    if (k > 0 && angle <= (angles[k - 1] as number)) {
      throw new ParameterRangeError(
        `${field}[${k}]`,
        `strictly greater than ${field}[${k - 1}] = ${angles[k - 1]}`,
        angle,
      );
    }
  }
}

/** Asserts a list of distinct odd harmonic orders in [3, 10000]. */
export function assertOddOrders(field: string, orders: unknown): asserts orders is number[] {
  if (!Array.isArray(orders)) throw new ParameterTypeError(field, 'an array of odd orders', orders);
  const seen = new Set<number>();
  orders.forEach((order: unknown, i) => {
    assertNumberInRange(`${field}[${i}]`, order, { min: 3, max: MAX_SHE_ORDER, integer: true });
    if (order % 2 === 0) {
      throw new ParameterRangeError(
        `${field}[${i}]`,
        'an odd order ≥ 3 (quarter-wave symmetry leaves no even harmonics to eliminate)',
        order,
      );
    }
    if (seen.has(order))
      throw new ParameterRangeError(`${field}[${i}]`, 'an order not listed twice', order);
    seen.add(order);
  });
}

/**
 * Asserts a wanted fundamental in (0, limit) volts, the limit being the pattern's maximum
 * (of the staircase of `cellVoltages` when given).
 */
export function assertFundamental(
  field: string,
  value: unknown,
  kind: SheKind,
  count: number,
  vdc: number,
  cellVoltages?: readonly number[],
): asserts value is number {
  const limit = fundamentalLimit(kind, count, vdc, cellVoltages);
  assertNumberInRange(field, value, { min: 0, minExclusive: true, max: limit, maxExclusive: true });
}

/**
 * Asserts the DC source voltages of a staircase of unequal cells: only for kind 'staircase', one
 * finite voltage > 0 (volts) per first-quarter angle, cell k switching at angle k.
 */
export function assertCellVoltages(
  field: string,
  value: unknown,
  kind: SheKind,
  count: number,
): asserts value is number[] {
  if (kind !== 'staircase') {
    throw new ParameterRangeError(
      field,
      "absent unless kind is 'staircase' (a bipolar pattern has one DC source, vdc)",
      value,
    );
  }
  if (!Array.isArray(value)) {
    throw new ParameterTypeError(field, 'an array of cell voltages in volts', value);
  }
  if (value.length !== count) {
    throw new ParameterRangeError(
      `${field}.length`,
      `count = ${count} (one DC source per first-quarter angle)`,
      value.length,
    );
  }
  value.forEach((voltage: unknown, k) => {
    assertNumberInRange(`${field}[${k}]`, voltage, { min: 0, minExclusive: true });
  });
}

/**
 * Resolves the number of angles from `angles` (validated) or `count` (an integer 1..64); at
 * least one must be given, and when both are, they must agree.
 */
export function resolveCount(angles: unknown, count: unknown): number {
  if (angles !== undefined) {
    assertFirstQuarterAngles('angles', angles);
    if (count !== undefined && count !== angles.length) {
      throw new ParameterRangeError('count', `equal to angles.length = ${angles.length}`, count);
    }
    return angles.length;
  }
  if (count === undefined) {
    throw new ParameterTypeError(
      'angles',
      'an array of first-quarter angles (or give count)',
      angles,
    );
  }
  assertNumberInRange('count', count, { min: 1, max: MAX_SHE_ANGLES, integer: true });
  return count;
}

/** Asserts a sweep grid: from and to inside (0, limit) volts, points an integer 1..10000. */
export function assertFundamentalRange(
  field: string,
  range: unknown,
  kind: SheKind,
  count: number,
  vdc: number,
  cellVoltages?: readonly number[],
): asserts range is FundamentalRange {
  if (typeof range !== 'object' || range === null) {
    throw new ParameterTypeError(field, 'an object { from, to, points }', range);
  }
  const { from, to, points } = range as Partial<FundamentalRange>;
  assertFundamental(`${field}.from`, from, kind, count, vdc, cellVoltages);
  assertFundamental(`${field}.to`, to, kind, count, vdc, cellVoltages);
  assertNumberInRange(`${field}.points`, points, { min: 1, max: 10_000, integer: true });
}

/** The grid of a {@link FundamentalRange}: `points` values from `from` to `to` inclusive. */
export function fundamentalGrid({ from, to, points }: FundamentalRange): number[] {
  if (points === 1) return [from];
  return Array.from({ length: points }, (_, i) => from + ((to - from) * i) / (points - 1));
}

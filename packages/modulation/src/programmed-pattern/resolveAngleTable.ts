/** Validation and resolution of the options of the angle-table functions (internal). */
import { SHE_KINDS } from '../she/SheKind.js';
import {
  assertFirstQuarterAngles,
  assertOddOrders,
  MAX_SHE_ANGLES,
  MAX_SHE_ORDER,
} from '../she/validateShe.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { MAX_ANGLE_TABLE_ROWS, type AngleTable } from './angleTableTypes.js';

/** The largest modulation index of a programmed pattern: a square wave's 4/π (not reached). */
export const PATTERN_MA_LIMIT = 4 / Math.PI;

/** A pattern with its defaults filled in. */
export type ResolvedPattern = AngleTable['parameters']['pattern'];

/** Asserts and completes a pattern; fields are named `pattern.<field>`. */
export function resolvePattern(pattern: unknown): ResolvedPattern {
  if (typeof pattern !== 'object' || pattern === null) {
    throw new ParameterTypeError('pattern', 'an object { method, kind, vdc, ... }', pattern);
  }
  const p = pattern as Partial<Record<string, unknown>>;
  assertOneOf('pattern.method', p.method, [
    'selective-harmonic-elimination',
    'optimal-pattern',
  ] as const);
  assertOneOf('pattern.kind', p.kind, SHE_KINDS);
  assertNumberInRange('pattern.vdc', p.vdc, { min: 0, minExclusive: true });
  if (p.method === 'selective-harmonic-elimination') {
    assertOddOrders('pattern.eliminate', p.eliminate);
    if (p.eliminate.length > MAX_SHE_ANGLES - 1) {
      throw new ParameterRangeError(
        'pattern.eliminate.length',
        `at most ${MAX_SHE_ANGLES - 1} orders (one angle each, one more for the fundamental)`,
        p.eliminate.length,
      );
    }
    return { method: p.method, kind: p.kind, vdc: p.vdc, eliminate: [...p.eliminate] };
  }
  const { objective = 'wthd', maxOrder = 99 } = p;
  assertNumberInRange('pattern.count', p.count, { min: 1, max: MAX_SHE_ANGLES, integer: true });
  assertOneOf('pattern.objective', objective, ['wthd', 'thd'] as const);
  assertNumberInRange('pattern.maxOrder', maxOrder, { min: 3, max: MAX_SHE_ORDER, integer: true });
  return { method: p.method, kind: p.kind, vdc: p.vdc, count: p.count, objective, maxOrder };
}

/** Number of first-quarter angles of a resolved pattern. */
export function patternCount(pattern: ResolvedPattern): number {
  return pattern.method === 'selective-harmonic-elimination'
    ? pattern.eliminate.length + 1
    : pattern.count;
}

/** Volts of fundamental per unit of ma: vdc (bipolar) or N·vdc (staircase of N cells). */
export function maScale(pattern: ResolvedPattern): number {
  return (pattern.kind === 'staircase' ? patternCount(pattern) : 1) * pattern.vdc;
}

/** Asserts an ma range `from` < `to` inside (0, 4/π); fields `ma.from`, `ma.to`. */
export function assertMaRange(ma: unknown): asserts ma is { from: number; to: number } {
  if (typeof ma !== 'object' || ma === null) {
    throw new ParameterTypeError('ma', 'an object { from, to }', ma);
  }
  const { from, to } = ma as Partial<Record<string, unknown>>;
  const range = { min: 0, minExclusive: true, max: PATTERN_MA_LIMIT, maxExclusive: true };
  assertNumberInRange('ma.from', from, range);
  assertNumberInRange('ma.to', to, range);
  if (!(to > from)) throw new ParameterRangeError('ma.to', `greater than ma.from = ${from}`, to);
}

/** Asserts a row count, an integer 2..`max`. */
export function assertRows(
  field: string,
  rows: unknown,
  max = MAX_ANGLE_TABLE_ROWS,
): asserts rows is number {
  assertNumberInRange(field, rows, { min: 2, max, integer: true });
}

/** Asserts optional starting angles: valid first-quarter angles, `count` of them. */
export function assertStartAngles(angles: unknown, count: number): void {
  if (angles === undefined) return;
  assertFirstQuarterAngles('angles', angles);
  if (angles.length !== count) {
    throw new ParameterRangeError(
      'angles.length',
      `${count} (the pattern's number of angles)`,
      angles.length,
    );
  }
}

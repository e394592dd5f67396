import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { ParameterTypeError } from '../validation/errors.js';
import { DAMPING_PLACEMENTS, type LcFilterOptions } from './LcFilterOptions.js';

/**
 * Asserts that `value` is a valid {@link LcFilterOptions}.
 * @param prefix - prepended to field names in messages, e.g. `'filter.'`
 * @throws ParameterTypeError or ParameterRangeError naming the field and its range
 */
export function assertLcFilter(value: unknown, prefix = ''): asserts value is LcFilterOptions {
  if (typeof value !== 'object' || value === null) {
    throw new ParameterTypeError(prefix === '' ? 'filter' : prefix.slice(0, -1), 'an object { l, c, ... }', value);
  }
  const { l, c, rDamping = 0, dampingPlacement = 'series-with-capacitor', cDamping, loadR } = value as LcFilterOptions;
  assertNumberInRange(`${prefix}l`, l, { min: 0, minExclusive: true });
  assertNumberInRange(`${prefix}c`, c, { min: 0, minExclusive: true });
  assertOneOf(`${prefix}dampingPlacement`, dampingPlacement, DAMPING_PLACEMENTS);
  const seriesPlacement = dampingPlacement === 'series-with-capacitor';
  assertNumberInRange(`${prefix}rDamping`, rDamping, { min: 0, minExclusive: !seriesPlacement });
  if (dampingPlacement === 'parallel-rc') {
    assertNumberInRange(`${prefix}cDamping`, cDamping, { min: 0, minExclusive: true });
  }
  if (loadR !== undefined) assertNumberInRange(`${prefix}loadR`, loadR, { min: 0, minExclusive: true });
}

import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { DAMPING_PLACEMENTS, type LcFilterOptions } from './LcFilterOptions.js';

/** Smallest normal double: l·c and l/c below it have lost precision (or underflowed to 0). */
const SMALLEST_NORMAL = 2.2250738585072014e-308;

/**
 * Asserts that `value` is a valid {@link LcFilterOptions}: each of l and c finite and > 0, and
 * together such that l·c and l/c are normal finite doubles (≥ 2.2e-308 and ≤ 1.8e308), so the
 * resonance 1/(2π√(LC)) and the impedance √(L/C) are finite.
 * @param prefix - prepended to field names in messages, e.g. `'filter.'`
 * @throws ParameterTypeError or ParameterRangeError naming the field and its range
 */
export function assertLcFilter(value: unknown, prefix = ''): asserts value is LcFilterOptions {
  if (typeof value !== 'object' || value === null) {
    throw new ParameterTypeError(
      prefix === '' ? 'filter' : prefix.slice(0, -1),
      'an object { l, c, ... }',
      value,
    );
  }
  const {
    l,
    c,
    rDamping = 0,
    dampingPlacement = 'series-with-capacitor',
    cDamping,
    loadR,
  } = value as LcFilterOptions;
  assertNumberInRange(`${prefix}l`, l, { min: 0, minExclusive: true });
  assertNumberInRange(`${prefix}c`, c, { min: 0, minExclusive: true });
  const product = l * c;
  const ratio = l / c;
  if (
    !(product >= SMALLEST_NORMAL) ||
    !(ratio >= SMALLEST_NORMAL) ||
    !Number.isFinite(product) ||
    !Number.isFinite(ratio)
  ) {
    // Name the one further from 1 in orders of magnitude: it is what pushed l·c or l/c out.
    const cIsExtreme = Math.abs(Math.log10(c)) >= Math.abs(Math.log10(l));
    const [field, value] = cIsExtreme ? [`${prefix}c`, c] : [`${prefix}l`, l];
    const allowed = `a finite number > 0 with l·c and l/c between 2.2e-308 and 1.8e308 (got l·c = ${product.toPrecision(3)}, l/c = ${ratio.toPrecision(3)})`;
    throw new ParameterRangeError(field, allowed, value);
  }
  assertOneOf(`${prefix}dampingPlacement`, dampingPlacement, DAMPING_PLACEMENTS);
  const seriesPlacement = dampingPlacement === 'series-with-capacitor';
  assertNumberInRange(`${prefix}rDamping`, rDamping, { min: 0, minExclusive: !seriesPlacement });
  if (dampingPlacement === 'parallel-rc') {
    assertNumberInRange(`${prefix}cDamping`, cDamping, { min: 0, minExclusive: true });
  }
  if (loadR !== undefined)
    assertNumberInRange(`${prefix}loadR`, loadR, { min: 0, minExclusive: true });
}

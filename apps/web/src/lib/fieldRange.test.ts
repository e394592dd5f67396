import { DESIGN_BOUNDS } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { rangeError, rangeText } from './fieldRange';

// Issue 10: errors on the field they concern, in that field's unit, one limit, quoting what was
// entered. The bounds are the library's DESIGN_BOUNDS (SI); the expected words are the form's.
describe('rangeText', () => {
  it('states one range in the unit the field shows', () => {
    expect(rangeText(DESIGN_BOUNDS.vdc, { unit: 'V' })).toBe('above 0 to 100,000 V');
    // load.l is 0 to 100 H: shown in mH, 0 to 100,000 mH.
    expect(rangeText(DESIGN_BOUNDS['load.l'], { scale: 1e3, unit: 'mH' })).toBe(
      'from 0 to 100,000 mH',
    );
    expect(rangeText({ min: 2, max: 400, integer: true })).toBe('a whole number from 2 to 400');
    expect(rangeText({ min: 0, minExclusive: true })).toBe('above 0');
  });
});

describe('rangeError', () => {
  it('is undefined for an allowed value and names the field, the range and the entry otherwise', () => {
    expect(rangeError('DC bus', 400, DESIGN_BOUNDS.vdc, { unit: 'V' })).toBeUndefined();
    expect(rangeError('DC bus', 1e308, DESIGN_BOUNDS.vdc, { unit: 'V' })).toBe(
      'DC bus must be above 0 to 100,000 V (entered 1e+308 V)',
    );
    expect(rangeError('Modulation index ma', -1, DESIGN_BOUNDS['modulation.ma'])).toBe(
      'Modulation index ma must be above 0 to 4 (entered -1)',
    );
  });

  it('quotes the entry in the field unit, not in SI (2 µH typed as 0.002 mH)', () => {
    // filter.l is 1 nH to 100 H; 0.0000001 mH = 1e-10 H is below it.
    expect(
      rangeError('Filter L', 1e-10, DESIGN_BOUNDS['filter.l'], { scale: 1e3, unit: 'mH' }),
    ).toBe('Filter L must be from 0.000001 to 100,000 mH (entered 1e-7 mH)');
  });

  it('asks for a number when the box is empty or holds text (NaN)', () => {
    expect(rangeError('DC bus', Number.NaN, DESIGN_BOUNDS.vdc, { unit: 'V' })).toBe(
      'Enter a number: DC bus is above 0 to 100,000 V',
    );
  });

  it('refuses a fraction where a whole number is needed', () => {
    expect(rangeError('Frequency ratio mf', 0.5, { min: 1, max: 1000, integer: true })).toBe(
      'Frequency ratio mf must be a whole number from 1 to 1,000 (entered 0.5)',
    );
  });
});

import { describe, expect, it } from 'vitest';
import { assertCPrefix } from '../assertCPrefix.js';
import { timerTable, timerTableToCHeader } from '../index.js';
import { angleTable, angleTableToCHeader } from '../../programmed-pattern/index.js';

// A C identifier is a letter or _ followed by letters, digits and _ (ISO/IEC 9899:1999
// §6.4.2.1); the writers cap it at 40 characters so every name they append stays within the 63
// significant characters C99 guarantees (§5.2.4.1).
const accepted = ['a', '_', 'pwm_table', 'Pump2_SHE', 'x'.repeat(40)];
const refused: unknown[] = ['', '9lives', 'pump-she', 'pump she', 'é', 'x'.repeat(41), 7, null];

function message(run: () => unknown): string | undefined {
  try {
    run();
  } catch (error) {
    return (error as Error).message;
  }
  return undefined;
}

const timer = timerTable({
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
  fundamentalFrequency: 50,
  carrierFrequency: 1_000,
  timerClock: 64e6,
  vdc: 400,
});
const angles = angleTable({
  pattern: { method: 'selective-harmonic-elimination', kind: 'bipolar', vdc: 400, eliminate: [5] },
  ma: { from: 0.5, to: 0.6 },
  rows: 2,
});
const fixedPoint = { fractionBits: 16, timerClock: 64e6, fundamentalFrequency: 50 };

describe('assertCPrefix: the one prefix check of both C header writers', () => {
  it.each(accepted)('accepts %j', (prefix) => {
    expect(() => assertCPrefix('prefix', prefix)).not.toThrow();
  });

  it.each(refused)('refuses %j naming the field and the allowed form', (prefix) => {
    expect(() => assertCPrefix('prefix', prefix)).toThrow(
      /^prefix must be a C identifier of 1 to 40 characters/,
    );
  });

  it.each(refused)('both writers refuse %j with the same words as the check', (prefix) => {
    const expected = message(() => assertCPrefix('prefix', prefix));
    expect(expected).toBeDefined();
    expect(message(() => timerTableToCHeader(timer, { prefix: prefix as string }))).toBe(expected);
    expect(
      message(() => angleTableToCHeader(angles, { ...fixedPoint, prefix: prefix as string })),
    ).toBe(expected);
  });

  it('both writers take the longest accepted prefix', () => {
    const prefix = 'x'.repeat(40);
    expect(timerTableToCHeader(timer, { prefix })).toContain(`${prefix}_`);
    expect(angleTableToCHeader(angles, { ...fixedPoint, prefix })).toContain(`${prefix}_`);
  });
});

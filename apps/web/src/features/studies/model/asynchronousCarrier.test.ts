import { describe, expect, it } from 'vitest';
import { hasAsynchronousCarrier } from './asynchronousCarrier';
import { defaultDraft } from './studyDraft';

describe('hasAsynchronousCarrier', () => {
  const draft = defaultDraft();
  it('is true for a carrier in range that is no whole multiple of the fundamental (1075 Hz at 50 Hz, mf 21.5)', () => {
    expect(
      hasAsynchronousCarrier({ ...draft, fundamentalFrequency: 50, carrierFrequency: 1075 }),
    ).toBe(true);
    expect(
      hasAsynchronousCarrier({ ...draft, fundamentalFrequency: 30, carrierFrequency: 70 }),
    ).toBe(true);
  });
  it('is false for a whole multiple, a carrier out of range, or a method without a carrier', () => {
    expect(
      hasAsynchronousCarrier({ ...draft, fundamentalFrequency: 50, carrierFrequency: 1050 }),
    ).toBe(false);
    expect(
      hasAsynchronousCarrier({ ...draft, fundamentalFrequency: 50, carrierFrequency: -5 }),
    ).toBe(false);
    expect(
      hasAsynchronousCarrier({ ...draft, fundamentalFrequency: 0, carrierFrequency: 1075 }),
    ).toBe(false);
    expect(
      hasAsynchronousCarrier({
        ...draft,
        method: 'selective-harmonic-elimination',
        fundamentalFrequency: 50,
        carrierFrequency: 1075,
      }),
    ).toBe(false);
  });
});

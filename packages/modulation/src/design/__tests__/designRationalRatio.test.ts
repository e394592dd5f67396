import { describe, expect, it } from 'vitest';
import { MAX_DESIGN_FUNDAMENTAL_PERIODS } from '../designBounds.js';
import { designFrequencyRatio } from '../designFrequencyRatio.js';
import { designRationalRatio } from '../designRationalRatio.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';

describe('designRationalRatio', () => {
  it('gives a synchronous carrier as p/1 with no error, as designFrequencyRatio does', () => {
    const design = { fundamentalFrequency: 50, carrierFrequency: 1050 };
    expect(designRationalRatio(design)).toEqual({ p: 21, q: 1, error: 0 });
    expect(designFrequencyRatio(design)).toBe(21);
  });

  it('gives a rational ratio exactly: 5 kHz over 48 Hz is 625/6 (hand-worked), error below 1e-9 Hz', () => {
    const { p, q, error } = designRationalRatio({
      fundamentalFrequency: 48,
      carrierFrequency: 5000,
    });
    expect({ p, q }).toEqual({ p: 625, q: 6 });
    expect(Math.abs(error)).toBeLessThan(1e-9);
    // The whole-ratio path still refuses it, naming the carrier.
    expect(
      rangeErrorField(() =>
        designFrequencyRatio({ fundamentalFrequency: 48, carrierFrequency: 5000 }),
      ),
    ).toBe('carrierFrequency');
  });

  it('approximates an asynchronous ratio by the nearest p/q with q ≤ 64, and states the error in hertz', () => {
    // 10 kHz over 37.3 Hz: 268.0965…, no p/q with q ≤ 64. The nearest fraction is checked by
    // trying every q (the definition), and its distance is below 1/(q·(N + 1)) (the Farey
    // sequence of order N: neighbours a/b < c/d have bc − ad = 1; Hardy and Wright, ch. 3,
    // from memory).
    const design = { fundamentalFrequency: 37.3, carrierFrequency: 10_000 };
    const ratio = 10_000 / 37.3;
    const { p, q, error } = designRationalRatio(design);
    let best = Infinity;
    for (let k = 1; k <= MAX_DESIGN_FUNDAMENTAL_PERIODS; k++) {
      best = Math.min(best, Math.abs(Math.round(ratio * k) / k - ratio));
    }
    expect(q).toBeGreaterThan(1);
    expect(Math.abs(p / q - ratio)).toBeLessThanOrEqual(best + 1e-12);
    expect(Math.abs(p / q - ratio)).toBeLessThan(1 / (q * (MAX_DESIGN_FUNDAMENTAL_PERIODS + 1)));
    expect(Math.abs(error - ((p / q) * 37.3 - 10_000))).toBeLessThan(1e-9);
    expect(Math.abs(error)).toBeGreaterThan(0);
  });

  it('names carrierFrequency with its range when the ratio is below 1 or above 1000', () => {
    expect(
      rangeErrorField(() =>
        designRationalRatio({ fundamentalFrequency: 50, carrierFrequency: 40 }),
      ),
    ).toBe('carrierFrequency');
    expect(() =>
      designRationalRatio({ fundamentalFrequency: 50, carrierFrequency: 50_050 }),
    ).toThrow(/1 to 1000 times/);
  });
});

import { describe, expect, it } from 'vitest';
import { harmonics, wthd } from '../../spectrum/index.js';
import { optimalPulseSweep, sheWaveform } from '../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

describe('optimalPulseSweep', () => {
  it('follows one smooth family of optima across the fundamental', () => {
    const vdc = 100;
    const scale = (4 * vdc) / Math.PI;
    const progress: number[] = [];
    const result = optimalPulseSweep({
      kind: 'bipolar',
      vdc,
      count: 4,
      maxOrder: 59,
      fundamentals: { from: 0.3 * scale, to: 0.8 * scale, points: 26 },
      onProgress: (f) => progress.push(f),
    });
    expect(progress.at(-1)).toBe(1);
    expect(result.solvedFraction, result.message).toBe(1);
    for (let i = 0; i < result.points.length; i++) {
      const point = result.points[i];
      if (point === undefined) continue;
      // Fundamental met and objective equal to the exact spectrum's WTHD (Holmes and Lipo, 2003, ch. 3).
      const spectrum = harmonics(sheWaveform(point.angles, { kind: 'bipolar', vdc }), 59);
      assertInDelta(
        spectrum[1]?.amplitude ?? NaN,
        point.fundamental,
        1e-9 * point.fundamental,
        'V₁',
      );
      assertInDelta(point.objective, wthd(spectrum), 1e-12, 'WTHD');
      const before = result.points[i - 1];
      if (before !== undefined && point.continued) {
        const jump = Math.max(
          ...point.angles.map((a, k) => Math.abs(a - (before.angles[k] as number))),
        );
        expect(jump).toBeLessThan(0.1);
      }
    }
  });
});

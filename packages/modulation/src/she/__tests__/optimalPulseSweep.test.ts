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

  it('a sweep run in two parts with `previous` follows the same family as one run', () => {
    const vdc = 100;
    const scale = (4 * vdc) / Math.PI;
    const grid = Array.from({ length: 10 }, (_, i) => (0.3 + (0.5 * i) / 9) * scale);
    const options = { kind: 'bipolar' as const, vdc, count: 4, maxOrder: 59 };
    const whole = optimalPulseSweep({
      ...options,
      fundamentals: { from: grid[0] as number, to: grid[9] as number, points: 10 },
    });
    const first = optimalPulseSweep({
      ...options,
      fundamentals: { from: grid[0] as number, to: grid[4] as number, points: 5 },
    });
    const second = optimalPulseSweep({
      ...options,
      fundamentals: { from: grid[5] as number, to: grid[9] as number, points: 5 },
      previous: first.points[4]?.angles,
    });
    expect(second.points[0]?.continued).toBe(true);
    [...first.points, ...second.points].forEach((point, i) => {
      const reference = whole.points[i];
      expect(point.continued).toBe(reference?.continued);
      // Same optimum: the optimiser converges to rounding level (tolerance from the stopping rule).
      point.angles.forEach((a, k) =>
        assertInDelta(a, reference?.angles[k] ?? NaN, 1e-8, `point ${i} angle ${k}`),
      );
    });
    expect(() =>
      optimalPulseSweep({
        ...options,
        fundamentals: { from: 40, to: 50, points: 2 },
        previous: [0.1, 0.2],
      }),
    ).toThrow(/previous.length/);
  });
});

import { describe, expect, it } from 'vitest';
import { mulberry32 } from '../mulberry32.js';

describe('mulberry32', () => {
  it('repeats its sequence for a seed and differs between seeds', () => {
    const a = mulberry32(42);
    const b = mulberry32(42);
    const c = mulberry32(43);
    const first = Array.from({ length: 100 }, () => a());
    expect(Array.from({ length: 100 }, () => b())).toEqual(first);
    expect(Array.from({ length: 100 }, () => c())).not.toEqual(first);
  });

  it('draws uniformly from [0, 1): mean 1/2 and variance 1/12 within 6 standard errors', () => {
    // Uniform on [0, 1): mean 1/2, variance 1/12, fourth central moment 1/80 (textbook facts).
    // Standard error of the mean over n draws: √(1/12 / n); of the variance: √((1/80 − 1/144)/n).
    const n = 200_000;
    const random = mulberry32(0x5eed);
    let sum = 0;
    let sumSquares = 0;
    let min = 1;
    let max = 0;
    for (let k = 0; k < n; k++) {
      const x = random();
      sum += x;
      sumSquares += x * x;
      min = Math.min(min, x);
      max = Math.max(max, x);
    }
    const mean = sum / n;
    const variance = sumSquares / n - mean * mean;
    expect(min).toBeGreaterThanOrEqual(0);
    expect(max).toBeLessThan(1);
    expect(Math.abs(mean - 0.5)).toBeLessThan(6 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(6 * Math.sqrt((1 / 80 - 1 / 144) / n));
  });
});

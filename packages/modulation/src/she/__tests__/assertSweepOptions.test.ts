import { describe, expect, it } from 'vitest';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import {
  assertOptimalPulseSweepOptions,
  assertSheSweepOptions,
  optimalPulseSweep,
  sheSweep,
} from '../index.js';

// The largest fundamental of a bipolar quarter-wave pattern is the square wave's, 4·vdc/π
// (Fourier series of a square wave; Patel and Hoft, IEEE Trans. Ind. Appl., 1973).
const vdc = 100;
const limit = (4 * vdc) / Math.PI;
const she = { kind: 'bipolar' as const, vdc, count: 3, eliminate: [5, 7] };
const optimal = { kind: 'bipolar' as const, vdc, count: 3, maxOrder: 49 };

describe('assertSheSweepOptions and assertOptimalPulseSweepOptions: a whole sweep checked without solving', () => {
  it('accept a range whose ends lie inside (0, 4·vdc/π)', () => {
    const fundamentals = { from: 0.1 * limit, to: 0.999 * limit, points: 10_000 };
    expect(() => assertSheSweepOptions({ ...she, fundamentals })).not.toThrow();
    expect(() => assertOptimalPulseSweepOptions({ ...optimal, fundamentals })).not.toThrow();
  });

  it.each([
    ['fundamentals.to', { from: 40, to: 1.001 * limit, points: 5 }],
    ['fundamentals.from', { from: limit, to: 40, points: 5 }],
    ['fundamentals.from', { from: 0, to: 40, points: 5 }],
    ['fundamentals.points', { from: 40, to: 80, points: 10_001 }],
  ])('name %s, as the sweep itself does', (field, fundamentals) => {
    expect(rangeErrorField(() => assertSheSweepOptions({ ...she, fundamentals }))).toBe(field);
    expect(rangeErrorField(() => sheSweep({ ...she, fundamentals }))).toBe(field);
    expect(
      rangeErrorField(() => assertOptimalPulseSweepOptions({ ...optimal, fundamentals })),
    ).toBe(field);
    expect(rangeErrorField(() => optimalPulseSweep({ ...optimal, fundamentals }))).toBe(field);
  });

  it('name the other fields the sweeps check before their first solve', () => {
    const fundamentals = { from: 40, to: 80, points: 3 };
    expect(
      rangeErrorField(() => assertSheSweepOptions({ ...she, eliminate: [5], fundamentals })),
    ).toBe('eliminate.length');
    expect(
      rangeErrorField(() => assertSheSweepOptions({ ...she, fundamentals, maxBranches: 0 })),
    ).toBe('maxBranches');
    expect(
      rangeErrorField(() =>
        assertOptimalPulseSweepOptions({ ...optimal, fundamentals, previous: [0.1, 0.2] }),
      ),
    ).toBe('previous.length');
    expect(
      rangeErrorField(() =>
        assertOptimalPulseSweepOptions({ ...optimal, fundamentals, maxOrder: 2 }),
      ),
    ).toBe('maxOrder');
  });
});

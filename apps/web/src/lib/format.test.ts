import { describe, expect, it } from 'vitest';
import { formatWorstOrder } from './format';

describe('formatWorstOrder', () => {
  it('names the order and its share at the digits asked for', () => {
    expect(formatWorstOrder({ order: 7, ratio: 0.1234 }, 3)).toBe('7 at 12.340 %');
    expect(formatWorstOrder({ order: 5, ratio: 0.00006 })).toBe('5 at 0.01 %');
  });

  it('names none when the worst share rounds to zero at those digits', () => {
    // 4.9e-6 is 0.00049 %: "0.000 %" at three decimals, so no order is named.
    expect(formatWorstOrder({ order: 30, ratio: 4.9e-6 }, 3)).toBe('every order under 0.0005 %');
    expect(formatWorstOrder({ order: 30, ratio: 1e-16 })).toBe('every order under 0.005 %');
  });
});

import { describe, expect, it } from 'vitest';
import { isOrderedInQuarter, maxOrderedStep, smallestGap } from '../orderedStep.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

// Gaps of first-quarter angles, one block per pattern (a cascaded cell each); values by hand.
describe('ordering in blocks', () => {
  const twoCells = [0.1, 0.5, 0.2, 0.3];

  it('measures each block against 0 and π/2 on its own', () => {
    // Block 1: 0.1, 0.4, π/2 − 0.5; block 2: 0.2, 0.1, π/2 − 0.3: the smallest is 0.1.
    assertInDelta(smallestGap(twoCells, 2), 0.1, 1e-15, 'blocks of 2');
    // As one pattern, 0.2 after 0.5 is out of order: a negative gap of −0.3.
    assertInDelta(smallestGap(twoCells), -0.3, 1e-15, 'one block');
    expect(isOrderedInQuarter(twoCells, 2)).toBe(true);
    expect(isOrderedInQuarter(twoCells)).toBe(false);
  });

  it('limits a step by the gaps of each block (fraction-to-boundary, 0.9)', () => {
    // Only the first angle of block 2 moves, down by 0.5: its gap to 0 (0.2) may shrink by 90 %,
    // so t = 0.9·0.2/0.5 = 0.36; block 1 does not limit it.
    assertInDelta(maxOrderedStep(twoCells, [0, 0, -0.5, 0], 2), 0.36, 1e-15, 't');
    // The second angle of block 1 moving up by 2 meets π/2: t = 0.9·(π/2 − 0.5)/2.
    assertInDelta(
      maxOrderedStep(twoCells, [0, 2, 0, 0], 2),
      (0.9 * (Math.PI / 2 - 0.5)) / 2,
      1e-15,
      't',
    );
    expect(maxOrderedStep(twoCells, [0.01, 0.01, 0.01, 0.01], 2)).toBe(1);
  });
});

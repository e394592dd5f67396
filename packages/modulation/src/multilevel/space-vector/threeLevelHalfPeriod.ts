import type {
  ThreeLevelSpaceVectorSelection,
  ThreeLevelSwitchingState,
} from './threeLevelSpaceVectorTypes.js';

/** States and durations of the first half of a three-level switching period. */
export interface ThreeLevelHalfPeriod {
  /** N-type form of the redundant small vector, the other two vectors, P-type form. */
  states: [
    ThreeLevelSwitchingState,
    ThreeLevelSwitchingState,
    ThreeLevelSwitchingState,
    ThreeLevelSwitchingState,
  ];
  /** Fractions of the whole switching period; they sum to 1/2. */
  durations: [number, number, number, number];
}

/**
 * The first half of a symmetric three-level switching period (the second half is its mirror
 * image): N-type form, the other two vectors in the selection's order, P-type form, each held
 * half its dwell time. Each step raises one leg by one level (Holmes and Lipo 2003, ch. 11).
 * Internal helper of the three-level space-vector functions.
 */
export function threeLevelHalfPeriod({
  vectors,
  redundant,
}: ThreeLevelSpaceVectorSelection): ThreeLevelHalfPeriod {
  const [, first, second] = vectors;
  return {
    states: [
      redundant.negative,
      first.states[0] as ThreeLevelSwitchingState,
      second.states[0] as ThreeLevelSwitchingState,
      redundant.positive,
    ],
    durations: [
      redundant.negativeDwell / 2,
      first.dwell / 2,
      second.dwell / 2,
      redundant.positiveDwell / 2,
    ],
  };
}

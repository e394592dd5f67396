import { threeLevelHalfPeriod } from './threeLevelHalfPeriod.js';
import { threeLevelSpaceVector } from './threeLevelSpaceVector.js';
import type {
  ThreeLevelReference,
  ThreeLevelSpaceVectorSequence,
} from './threeLevelSpaceVectorTypes.js';

/**
 * The symmetric switching sequence of one three-level switching period for a reference vector:
 * seven states, starting and ending on the redundant small vector's N-type form with its P-type
 * form in the middle, for example in sector 1, region 2: `ONN PNN PON POO PON PNN ONN`. The
 * N-type form is held (1 − smallVectorSplit)·t/2 at each end, the P-type form
 * smallVectorSplit·t in the middle (t the small vector's dwell), the other two vectors half
 * their dwell on each side. Consecutive states differ by one level in one leg, so each leg
 * switches twice a period, one level at a time (the sequence of level-shifted PD carriers with
 * the zero sequence of B. P. McGrath, D. G. Holmes and T. A. Lipo, IEEE Trans. Power Electron.,
 * 2003, when the split is 0.5; Holmes and Lipo 2003, ch. 11).
 *
 * @param reference - `{ m, theta, smallVectorSplit }` as for {@link threeLevelSpaceVector}
 * @returns the selection plus `states` and `durations` (seven each, zeros kept, summing to 1)
 * @throws ParameterRangeError naming `m`, `theta` or `smallVectorSplit`
 */
export function threeLevelSpaceVectorSequence(
  reference: ThreeLevelReference,
): ThreeLevelSpaceVectorSequence {
  const selection = threeLevelSpaceVector(reference);
  const { states, durations } = threeLevelHalfPeriod(selection);
  const [n, first, second, p] = states;
  const [tn, t1, t2, tp] = durations;
  return {
    ...selection,
    states: [n, first, second, p, second, first, n],
    durations: [tn, t1, t2, 2 * tp, t2, t1, tn],
  };
}

import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { halfPeriodSequence } from './halfPeriodSequence.js';
import { locateSector } from './locateSector.js';
import { spaceVector } from './spaceVector.js';
import type {
  LegDuties,
  SpaceVectorReference,
  SpaceVectorSequence,
  SpaceVectorSequenceKind,
  SwitchingState,
  ZeroVectorClamping,
} from './spaceVectorTypes.js';

/** Sequence kinds accepted by the space-vector functions. */
export const SPACE_VECTOR_SEQUENCES: readonly SpaceVectorSequenceKind[] = [
  'seven-segment',
  'five-segment',
];

/** Five-segment zero-vector choices accepted by the space-vector functions. */
export const ZERO_VECTOR_CLAMPINGS: readonly ZeroVectorClamping[] = [
  'dpwm-min',
  'dpwm-max',
  'dpwm0',
  'dpwm1',
  'dpwm2',
  'dpwm3',
];

/** Options of {@link spaceVectorSequence}. */
export interface SpaceVectorSequenceOptions {
  /** @default 'seven-segment' */
  sequence?: SpaceVectorSequenceKind;
  /**
   * Seven-segment only: fraction of t0 spent on '000' (the rest on '111'); 0.5 is the centred
   * space vector, equivalent to min-max zero-sequence injection.
   * @default 0.5
   */
  zeroSplit?: number;
  /**
   * Five-segment only: which zero vector each period uses (see {@link ZeroVectorClamping}).
   * @default 'dpwm1'
   */
  clamping?: ZeroVectorClamping;
}

/**
 * The switching sequence of one switching period for a reference vector: the states in order,
 * their durations and each leg's duty cycle, all as fractions of the switching period.
 *
 * Symmetric (centre-aligned) sequences: seven-segment 000-A-B-111-B-A-000 with the zero time
 * split `zeroSplit`:(1 − zeroSplit) between 000 and 111; five-segment Z-N-F-N-Z with one zero
 * vector chosen by `clamping`. A is the active vector with one leg high, B the one with two
 * (van der Broeck et al., IEEE Trans. Ind. Appl., 1988; Holmes and Lipo 2003, ch. 5 and 7).
 * A leg's duty is the total duration of the states in which it is high.
 *
 * Sectors and their halves are half-open, like [0, π/3) and [0, π/6): a reference exactly on a
 * sector boundary belongs to the sector that starts there, one exactly at a sector's middle
 * (t1 = t2) to the second half, and an angle within about 1e-12 rad of either counts as on it.
 * So the clamping choices of DPWM0–3 switch by the same rule at θ, θ + 2π/3 and θ + π however θ
 * was computed.
 *
 * @param reference - `{ m, theta }` as for {@link spaceVector}
 * @returns dwell times plus `states`, `durations` (7 or 5 entries, zeros kept) and `duties`
 * @throws ParameterRangeError naming the field (`m`, `theta`, `sequence`, `zeroSplit`, `clamping`)
 */
export function spaceVectorSequence(
  reference: SpaceVectorReference,
  {
    sequence = 'seven-segment',
    zeroSplit = 0.5,
    clamping = 'dpwm1',
  }: SpaceVectorSequenceOptions = {},
): SpaceVectorSequence {
  assertOneOf('sequence', sequence, SPACE_VECTOR_SEQUENCES);
  assertNumberInRange('zeroSplit', zeroSplit, { min: 0, max: 1 });
  assertOneOf('clamping', clamping, ZERO_VECTOR_CLAMPINGS);
  const dwell = spaceVector(reference);
  const { secondHalf } = locateSector(reference.theta);
  const half = halfPeriodSequence(dwell, secondHalf, { sequence, zeroSplit, clamping });
  const count = half.states.length;
  // Mirror the half period; the middle state appears twice and becomes one segment.
  const states: SwitchingState[] = [...half.states, ...half.states.slice(0, count - 1).reverse()];
  const durations = [
    ...half.durations.slice(0, count - 1),
    2 * (half.durations[count - 1] as number),
    ...half.durations.slice(0, count - 1).reverse(),
  ];
  return { ...dwell, sequence, states, durations, duties: legDuties(states, durations) };
}

function legDuties(states: readonly SwitchingState[], durations: readonly number[]): LegDuties {
  const high = [0, 0, 0];
  states.forEach((state, i) => {
    for (let leg = 0; leg < 3; leg++) {
      if (state[leg] === '1') high[leg] = (high[leg] as number) + (durations[i] as number);
    }
  });
  return { a: high[0] as number, b: high[1] as number, c: high[2] as number };
}

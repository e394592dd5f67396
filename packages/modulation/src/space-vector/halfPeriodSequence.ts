import type {
  SpaceVectorDwell,
  SpaceVectorSequenceKind,
  SwitchingState,
  ZeroVectorClamping,
} from './spaceVectorTypes.js';

/** Active vectors V1…V6 at angles 0, π/3, …, 5π/3 (legs a, b, c). */
export const ACTIVE_VECTORS: readonly SwitchingState[] = ['100', '110', '010', '011', '001', '101'];

/** Options of {@link halfPeriodSequence}, all set. */
export interface HalfPeriodOptions {
  sequence: SpaceVectorSequenceKind;
  zeroSplit: number;
  clamping: ZeroVectorClamping;
}

/** States and durations of the first half of a switching period. */
export interface HalfPeriodSequence {
  states: SwitchingState[];
  /** Fractions of the whole switching period; they sum to 1/2. */
  durations: number[];
}

/**
 * The first half of a symmetric switching period (the second half is its mirror image):
 * seven-segment 000-A-B-111 with durations k·t0/2, tA/2, tB/2, (1 − k)·t0/2 (k = zeroSplit);
 * five-segment Z-N-F with t0/2, tN/2, tF/2, where N is the active vector one switch away from
 * the zero vector Z. Consecutive states differ in one leg, so each leg switches at most twice
 * per period (Holmes and Lipo 2003, ch. 5 and 7). Internal helper, inputs already validated.
 *
 * @param dwell - the dwell times of the reference, from `spaceVector`
 * @param secondHalf - the reference lies in the second half of its sector, from
 *   `locateSector` on the same angle: the five-segment clamping choices switch there.
 *   Not t2 ≥ t1: at the sector's middle t1 and t2 are equal sines rounded two ways, and the
 *   comparison would choose the zero vector by rounding.
 */
export function halfPeriodSequence(
  dwell: SpaceVectorDwell,
  secondHalf: boolean,
  { sequence, zeroSplit, clamping }: HalfPeriodOptions,
): HalfPeriodSequence {
  const { sector, t1, t2, t0 } = dwell;
  const first = ACTIVE_VECTORS[sector - 1] as SwitchingState;
  const second = ACTIVE_VECTORS[sector % 6] as SwitchingState;
  // Odd sectors start at a one-leg-high vector (100, 010, 001), even ones at a two-legs-high one.
  const oddSector = sector % 2 === 1;
  const single = oddSector ? first : second;
  const double = oddSector ? second : first;
  const tSingle = oddSector ? t1 : t2;
  const tDouble = oddSector ? t2 : t1;
  if (sequence === 'seven-segment') {
    return {
      states: ['000', single, double, '111'],
      durations: [(zeroSplit * t0) / 2, tSingle / 2, tDouble / 2, ((1 - zeroSplit) * t0) / 2],
    };
  }
  const zero = fiveSegmentZero(clamping, oddSector, !secondHalf);
  return zero === '000'
    ? { states: ['000', single, double], durations: [t0 / 2, tSingle / 2, tDouble / 2] }
    : { states: ['111', double, single], durations: [t0 / 2, tDouble / 2, tSingle / 2] };
}

/**
 * Zero vector of a five-segment period. `nearFirst`: the reference is in the first half of its
 * sector, [0, π/6), nearer Vk than Vk+1.
 */
function fiveSegmentZero(
  clamping: ZeroVectorClamping,
  oddSector: boolean,
  nearFirst: boolean,
): '000' | '111' {
  // Near a one-leg-high vertex that leg's phase is at its positive peak: clamp it high.
  const nearSingle = oddSector === nearFirst;
  switch (clamping) {
    case 'dpwm-min':
      return '000';
    case 'dpwm-max':
      return '111';
    case 'dpwm1':
      return nearSingle ? '111' : '000';
    case 'dpwm3':
      return nearSingle ? '000' : '111';
    case 'dpwm2':
      return oddSector ? '111' : '000';
    case 'dpwm0':
      return oddSector ? '000' : '111';
  }
}

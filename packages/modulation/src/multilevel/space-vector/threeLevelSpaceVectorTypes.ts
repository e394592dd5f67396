import type { SpaceVectorSampling } from '../../space-vector/spaceVectorWaveforms.js';

/**
 * Types of the three-level space-vector functions (N. Celanovic and D. Boroyevich, "A
 * comprehensive study of neutral-point voltage balancing problem in three-level
 * neutral-point-clamped voltage source PWM inverters", IEEE Trans. Power Electron., 2000;
 * Holmes and Lipo 2003, ch. 11).
 *
 * A switching state names legs a, b, c in that order with the trade's letters: `P` the leg at
 * +vdc/2 from the DC midpoint, `O` at the midpoint, `N` at −vdc/2. Its space vector is the
 * Clarke transform v = (2/3)·(va + a·vb + a²·vc), a = e^{j2π/3}, as for two levels: large
 * vectors (`PNN` …) have length 2vdc/3 at the angles of the two-level active vectors, medium ones
 * (`PON` …) vdc/√3 at the angles between, small ones (`POO` = `ONN` …) vdc/3 at the large ones'
 * angles, and `PPP`, `OOO`, `NNN` are zero.
 */

/** One leg's level: `P` +vdc/2, `O` the DC midpoint, `N` −vdc/2. */
export type ThreeLevelLegState = 'P' | 'O' | 'N';

/** The state of legs a, b, c, for example `PON`. */
export type ThreeLevelSwitchingState =
  `${ThreeLevelLegState}${ThreeLevelLegState}${ThreeLevelLegState}`;

/** Length class of a three-level space vector: 0, vdc/3, vdc/√3 or 2vdc/3. */
export type ThreeLevelVectorKind = 'zero' | 'small' | 'medium' | 'large';

/**
 * Which of a sector's four triangles holds the reference (sector k between the large vectors at
 * (k − 1)·π/3 and k·π/3):
 * - 1: the inner triangle, the zero vector and the sector's two small vectors;
 * - 2: the small, large and medium vector next to the sector's first large vector;
 * - 3: the middle triangle, the two small vectors and the medium vector;
 * - 4: the small, medium and large vector next to the sector's second large vector.
 */
export type ThreeLevelRegion = 1 | 2 | 3 | 4;

/**
 * A reference vector for one switching period.
 * - `m` = √3·|Vref|/vdc, the two-level index (|Vref| the peak phase voltage): 1 is the circle
 *   inscribed in the hexagon, the end of the linear range, as for two levels.
 * - `theta`: the vector's angle in radians from the phase-a axis (`PNN`), positive sequence
 *   a → b → c; any finite value.
 * - `smallVectorSplit`: the share of the redundant small vector's dwell time spent on its P-type
 *   form (the form whose legs are at P and O, such as `POO`); the rest goes to the N-type form
 *   (legs at O and N, such as `ONN`). 0.5 splits it equally. @default 0.5
 */
export interface ThreeLevelReference {
  m: number;
  theta: number;
  smallVectorSplit?: number;
}

/** One of the three vectors nearest the reference, with its dwell time. */
export interface ThreeLevelSelectedVector {
  kind: ThreeLevelVectorKind;
  /**
   * The switching states the sequence uses for it: two for the redundant small vector (N-type
   * form first, then P-type), one for each of the other two vectors.
   */
  states: ThreeLevelSwitchingState[];
  /** Fraction of the switching period spent on the vector (all its states), in [0, 1]. */
  dwell: number;
}

/** The redundant small vector's two forms and how its dwell time is shared between them. */
export interface ThreeLevelRedundantPair {
  /** The P-type form (legs at P and O), for example `POO`. */
  positive: ThreeLevelSwitchingState;
  /** The N-type form (legs at O and N), for example `ONN`. */
  negative: ThreeLevelSwitchingState;
  /** Fractions of the switching period on each form; they sum to the small vector's dwell. */
  positiveDwell: number;
  negativeDwell: number;
}

/** The nearest three vectors of a reference and their dwell times. */
export interface ThreeLevelSpaceVectorSelection {
  /** 1…6; sector k spans [(k − 1)·π/3, k·π/3). */
  sector: number;
  region: ThreeLevelRegion;
  /**
   * The redundant small vector first, then the other two in the order the switching sequence
   * applies them after the small vector's N-type form. Dwell times sum to 1.
   */
  vectors: [ThreeLevelSelectedVector, ThreeLevelSelectedVector, ThreeLevelSelectedVector];
  redundant: ThreeLevelRedundantPair;
}

/** The switching sequence of one switching period. */
export interface ThreeLevelSpaceVectorSequence extends ThreeLevelSpaceVectorSelection {
  /**
   * Seven states from the start of the period: N-type form, the two other vectors, P-type form,
   * and back; consecutive states differ by one level in one leg.
   */
  states: ThreeLevelSwitchingState[];
  /** Duration of each state, fractions of the switching period, summing to 1 (zeros kept). */
  durations: number[];
}

/**
 * Options shared by the three-level space-vector functions over a fundamental period. Give
 * exactly one of `m` and `ma`.
 */
export interface ThreeLevelModulationOptions {
  /** m = √3·|V1|/vdc, in [0, 1] (the linear range; |V1| the peak phase fundamental). */
  m?: number;
  /** Or the carrier-style index ma = 2·|V1|/vdc = 2m/√3, in [0, 2/√3]. */
  ma?: number;
  /**
   * Switching periods per fundamental period, a whole number in [1, 100000] (so that one
   * fundamental period holds the whole pattern).
   */
  frequencyRatio: number;
  /**
   * Regular sampling: `symmetric` one sample at each switching period's start for the whole
   * period, `asymmetric` a second one at its middle for the second half. @default 'symmetric'
   */
  sampling?: SpaceVectorSampling;
  /** Share of the redundant small vector's dwell on its P-type form, [0, 1]. @default 0.5 */
  smallVectorSplit?: number;
}

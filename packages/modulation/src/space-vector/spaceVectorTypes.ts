/**
 * Types shared by the space-vector functions.
 *
 * Switching states are written as three characters for legs a, b, c in that order: '1' means
 * the leg's upper switch is on (leg at +vdc/2 from the DC midpoint), '0' the lower one (−vdc/2).
 * Active vectors V1…V6 are '100', '110', '010', '011', '001', '101' at space-vector angles
 * 0, π/3, …, 5π/3; the zero vectors are '000' (V0) and '111' (V7) (van der Broeck, Skudelny,
 * Stanke, IEEE Trans. Ind. Appl., 1988; Holmes and Lipo 2003, ch. 5).
 */

/** One of the eight switching states of a two-level three-phase leg set, legs a, b, c. */
export type SwitchingState = '000' | '100' | '110' | '010' | '011' | '001' | '101' | '111';

/**
 * A reference space vector.
 * - `m`: modulation index m = √3·|Vref|/vdc (|Vref| the peak phase voltage of the reference);
 *   m = 1 is the inscribed circle of the hexagon, the end of the linear range.
 * - `theta`: the reference vector's angle in radians, measured from the phase-a axis (V1, state
 *   '100'), positive sequence a → b → c; any finite value, wrapped into [0, 2π).
 */
export interface SpaceVectorReference {
  m: number;
  theta: number;
}

/**
 * Sector and dwell times of a reference vector, as fractions of the switching period.
 * - `sector`: 1…6; sector k spans [(k − 1)·π/3, k·π/3) between active vectors Vk and Vk+1.
 * - `t1`: time on Vk (the vector at the sector's start angle); `t2`: time on Vk+1;
 *   `t0`: time on the zero vectors together; t1 + t2 + t0 = 1.
 */
export interface SpaceVectorDwell {
  sector: number;
  t1: number;
  t2: number;
  t0: number;
}

/**
 * Segment sequence within one switching period.
 * - `'seven-segment'`: continuous, both zero vectors, 000-A-B-111-B-A-000 (A the active vector
 *   with one leg high, B the one with two legs high), every leg switches twice per period.
 * - `'five-segment'`: discontinuous, one zero vector per period, Z-N-F-N-Z; one leg does not
 *   switch in that period (it is clamped to a DC rail).
 */
export type SpaceVectorSequenceKind = 'seven-segment' | 'five-segment';

/**
 * Which zero vector a five-segment sequence uses (the trade's DPWM names; Holmes and Lipo
 * 2003, ch. 7; A. M. Hava, R. J. Kerkman, T. A. Lipo, IEEE Trans. Power Electron., 1998,
 * the mapping of DPWM0/2 to their clamping intervals recalled from memory):
 * - `'dpwm-min'`: always '000' (each phase clamped to the negative rail for 120° around its
 *   negative peak).
 * - `'dpwm-max'`: always '111' (clamped to the positive rail for 120° around the positive peak).
 * - `'dpwm1'`: the phase whose reference has the largest magnitude is clamped, 60° intervals
 *   centred on each positive and negative peak ('111' in the half-sector next to a one-leg-high
 *   vector, '000' next to a two-legs-high vector).
 * - `'dpwm3'`: the opposite choice to dpwm1 in each half-sector (30° clamps either side of
 *   the dpwm1 intervals).
 * - `'dpwm2'`: whole-sector choice, '111' in odd sectors and '000' in even ones: each phase is
 *   clamped for 60° starting at its peak, i.e. the clamping interval lags the voltage peak by 30°.
 * - `'dpwm0'`: '000' in odd sectors and '111' in even ones: the interval leads the peak by 30°.
 */
export type ZeroVectorClamping = 'dpwm-min' | 'dpwm-max' | 'dpwm0' | 'dpwm1' | 'dpwm2' | 'dpwm3';

/** Fraction of each switching period each leg spends high (upper switch on), in [0, 1]. */
export interface LegDuties {
  a: number;
  b: number;
  c: number;
}

/** The switching sequence of one switching period, with the dwell times it realises. */
export interface SpaceVectorSequence extends SpaceVectorDwell {
  /** The sequence kind used. */
  sequence: SpaceVectorSequenceKind;
  /** Switching states in the order applied, from the start of the switching period. */
  states: SwitchingState[];
  /** Duration of each state, fractions of the switching period, summing to 1 (zeros kept). */
  durations: number[];
  /** Per-leg duty cycles, fractions of the switching period. */
  duties: LegDuties;
}

/**
 * How the reference is treated beyond the linear range:
 * - `'linear'`: m ≤ 1, unchanged.
 * - `'overmodulation-i'`: Holtz mode I, magnitude limited to the hexagon, circle radius raised
 *   to compensate the lost fundamental, angle unchanged.
 * - `'overmodulation-ii'`: Holtz mode II, vector on the hexagon, held at the vertices for the
 *   holding angle.
 * - `'six-step'`: holding angle π/6, the vector jumps from vertex to vertex.
 * - `'magnitude-limited'`: the simple uncompensated hexagon limit (method `'hexagon-limit'`).
 */
export type OvermodulationMode =
  'linear' | 'overmodulation-i' | 'overmodulation-ii' | 'six-step' | 'magnitude-limited';

/**
 * Overmodulation methods:
 * - `'two-mode'`: J. Holtz, W. Lotzkat, A. M. Khambadkone, "On continuous control of PWM
 *   inverters in the overmodulation range including the six-step mode", IEEE Trans. Power
 *   Electron., 1993: mode I then mode II, continuous up to six-step.
 * - `'hexagon-limit'`: the vector's magnitude is clipped to the hexagon, angle kept, no
 *   compensation (common practice); its fundamental stays below m and below (3/π)·ln 3.
 */
export type OvermodulationMethod = 'two-mode' | 'hexagon-limit';

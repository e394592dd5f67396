import type { SineTriangleOptions } from '../carrier/sineTriangle.js';
import type { MultilevelCarrierOptions } from '../multilevel/MultilevelTypes.js';
import type { ThreeLevelSpaceVectorWaveformOptions } from '../multilevel/space-vector/threeLevelSpaceVectorWaveforms.js';
import type { SheKind } from '../she/SheKind.js';
import type { SpaceVectorWaveformOptions } from '../space-vector/spaceVectorWaveforms.js';
import type { ThreePhaseOptions } from '../three-phase/threePhase.js';

/** Single-phase H-bridge, sine-triangle PWM: the fields of `sineTriangle`. */
export type SineTriangleModulation = { method: 'sine-triangle' } & SineTriangleOptions;

/** Three-phase two-level bridge, carrier PWM with a zero sequence: the fields of `threePhase`. */
export type ThreePhaseCarrierModulation = { method: 'three-phase' } & ThreePhaseOptions;

/** Three-phase two-level bridge, regular-sampled space vector: the fields of `spaceVectorWaveforms`. */
export type SpaceVectorModulation = { method: 'space-vector' } & SpaceVectorWaveformOptions;

/**
 * A stored quarter-wave pattern (single-phase) given by its first-quarter switching angles, as
 * `sheWaveform` builds it (conventions in `SheKind`).
 */
export interface StoredPatternFields {
  /** `'bipolar'` two-level ±vdc, or `'staircase'` of equal DC cells of vdc each. */
  kind: SheKind;
  /** DC voltage, volts, > 0: the bipolar level or each staircase cell's. */
  vdc: number;
  /** First-quarter switching angles, radians, strictly ascending in (0, π/2). */
  angles: number[];
  /**
   * Staircase only: each cell's DC source, volts (> 0), one per angle, cell k switching at angle
   * k (cascaded cells on unequal sources; see `sheWaveform`). Every cell at vdc when left out.
   */
  cellVoltages?: number[];
  /** The fundamental the angles were solved for, peak volts (a record; figures come from the angles). */
  fundamental?: number;
}

/** A pattern solved by selective harmonic elimination (H. S. Patel and R. G. Hoft, 1973). */
export type HarmonicEliminationModulation = {
  method: 'selective-harmonic-elimination';
} & StoredPatternFields & {
    /** Odd orders the angles were solved to eliminate (a record). */
    eliminate?: number[];
  };

/** An optimal pulse pattern (minimum weighted distortion, see `optimalPulsePattern`). */
export type OptimalPatternModulation = { method: 'optimal-pattern' } & StoredPatternFields;

/**
 * A multilevel bridge (NPC, T-type, flying-capacitor or cascaded H-bridge legs) under
 * level-shifted or phase-shifted carrier PWM: the fields of `multilevelCarrier` (conventions in
 * `MultilevelCarrierOptions`; its `phaseCount` says whether the bridge is single- or three-phase).
 */
export type MultilevelCarrierModulation = {
  method: 'multilevel-carrier';
} & MultilevelCarrierOptions;

/**
 * A three-phase three-level bridge (NPC or T-type legs) under nearest-three-vector space vector
 * PWM: the fields of `threeLevelSpaceVectorWaveforms` (exactly one of m and ma; vdc the whole DC
 * link; the redundant small vector's split a parameter).
 */
export type MultilevelSpaceVectorModulation = {
  method: 'multilevel-space-vector';
} & ThreeLevelSpaceVectorWaveformOptions;

/**
 * Every modulation method the library offers, discriminated on `method`. Each variant carries
 * the fields of the library function that builds it, DC bus and frequency ratio included; an
 * `InverterDesign` holds the same without those two, which the design supplies.
 */
export type Modulation =
  | SineTriangleModulation
  | ThreePhaseCarrierModulation
  | SpaceVectorModulation
  | HarmonicEliminationModulation
  | OptimalPatternModulation
  | MultilevelCarrierModulation
  | MultilevelSpaceVectorModulation;

/** The `method` names. */
export type ModulationMethod = Modulation['method'];

/** The methods, in the order the API and the dashboard list them. */
export const MODULATION_METHODS: readonly ModulationMethod[] = [
  'sine-triangle',
  'three-phase',
  'space-vector',
  'selective-harmonic-elimination',
  'optimal-pattern',
  'multilevel-carrier',
  'multilevel-space-vector',
];

/** A label a person reads for each method. */
export const MODULATION_METHOD_LABELS: Readonly<Record<ModulationMethod, string>> = {
  'sine-triangle': 'Single-phase sine-triangle',
  'three-phase': 'Three-phase carrier with zero sequence',
  'space-vector': 'Three-phase space vector',
  'selective-harmonic-elimination': 'Selective harmonic elimination pattern',
  'optimal-pattern': 'Optimal pulse pattern',
  'multilevel-carrier': 'Multilevel carrier (level- or phase-shifted)',
  'multilevel-space-vector': 'Three-level space vector (NPC or T-type)',
};

/**
 * The methods that always drive a three-phase bridge. A multilevel carrier modulation drives
 * the bridge its own `phaseCount` says, so it is in neither list: ask `modulationPhaseCount`.
 */
export const THREE_PHASE_METHODS: readonly ModulationMethod[] = [
  'three-phase',
  'space-vector',
  'multilevel-space-vector',
];

/** The methods with a carrier (or switching period) whose frequency the design sets. */
export const CARRIER_METHODS: readonly ModulationMethod[] = [
  'sine-triangle',
  'three-phase',
  'space-vector',
  'multilevel-carrier',
  'multilevel-space-vector',
];

/** The methods given by stored first-quarter angles. */
export const PATTERN_METHODS: readonly ModulationMethod[] = [
  'selective-harmonic-elimination',
  'optimal-pattern',
];

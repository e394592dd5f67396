import type { CarrierSampling } from '../carrier/CarrierSampling.js';
import type { Waveform } from '../waveform/Waveform.js';

/**
 * The multilevel bridge legs the library models (Holmes and Lipo, 2003, ch. 11):
 * - `npc`: three-level neutral-point-clamped leg (A. Nabae, I. Takahashi, H. Akagi, IEEE Trans.
 *   Ind. Appl., 1981): four series switches S1–S4 and two clamp diodes to the DC midpoint.
 * - `t-type`: three-level T-type leg: S1 to the positive rail, S4 to the negative rail, and a
 *   bidirectional pair S2/S3 from the output to the DC midpoint. Same output levels as `npc`;
 *   different devices conduct and switch in each state.
 * - `flying-capacitor`: an N-level leg of N − 1 nested commutation cells with flying capacitors
 *   charged to k·vdc/(N − 1) (T. A. Meynard and H. Foch, 1992).
 * - `cascaded-h-bridge`: a string of `cells` H-bridges per phase, each on its own isolated DC
 *   source of vdc, giving 2·cells + 1 phase levels.
 */
export type MultilevelTopology = 'npc' | 't-type' | 'flying-capacitor' | 'cascaded-h-bridge';

/** The topologies, in the order the API and the dashboard list them. */
export const MULTILEVEL_TOPOLOGIES: readonly MultilevelTopology[] = [
  'npc',
  't-type',
  'flying-capacitor',
  'cascaded-h-bridge',
];

/** A label a person reads for each topology. */
export const MULTILEVEL_TOPOLOGY_LABELS: Readonly<Record<MultilevelTopology, string>> = {
  npc: 'Three-level neutral-point-clamped (NPC)',
  't-type': 'Three-level T-type',
  'flying-capacitor': 'Flying capacitor',
  'cascaded-h-bridge': 'Cascaded H-bridge',
};

/**
 * How the carriers of a multilevel modulator are arranged (B. P. McGrath and D. G. Holmes, IEEE
 * Trans. Ind. Electron., 2002; Holmes and Lipo, 2003, ch. 11):
 * - level-shifted: levels − 1 carriers stacked in contiguous bands that together span ±1,
 *   `pd` all in phase (phase disposition), `pod` those above zero in phase opposition to those
 *   below (phase opposition disposition), `apod` each in opposition to its neighbours
 *   (alternative phase opposition disposition);
 * - `phase-shifted`: one full-range carrier per commutation cell (flying capacitor) or per
 *   H-bridge cell (cascaded), each delayed from the last by an equal share of a carrier period.
 */
export type MultilevelCarrierArrangement = 'pd' | 'pod' | 'apod' | 'phase-shifted';

/** The arrangements, in the order the API and the dashboard list them. */
export const MULTILEVEL_CARRIER_ARRANGEMENTS: readonly MultilevelCarrierArrangement[] = [
  'pd',
  'pod',
  'apod',
  'phase-shifted',
];

/** A label a person reads for each arrangement. */
export const MULTILEVEL_CARRIER_ARRANGEMENT_LABELS: Readonly<
  Record<MultilevelCarrierArrangement, string>
> = {
  pd: 'Level-shifted, phase disposition (PD)',
  pod: 'Level-shifted, phase opposition disposition (POD)',
  apod: 'Level-shifted, alternative phase opposition disposition (APOD)',
  'phase-shifted': 'Phase-shifted carriers',
};

/** The carrier arrangements each topology accepts. */
export const MULTILEVEL_CARRIERS_BY_TOPOLOGY: Readonly<
  Record<MultilevelTopology, readonly MultilevelCarrierArrangement[]>
> = {
  npc: ['pd', 'pod', 'apod'],
  't-type': ['pd', 'pod', 'apod'],
  'flying-capacitor': ['phase-shifted'],
  'cascaded-h-bridge': ['phase-shifted', 'pd', 'pod', 'apod'],
};

/** The zero sequences a three-phase multilevel carrier modulator accepts (see `ZeroSequence`). */
export type MultilevelZeroSequence = 'none' | 'third-harmonic' | 'min-max';

/** The zero sequences, in the order the API and the dashboard list them. */
export const MULTILEVEL_ZERO_SEQUENCES: readonly MultilevelZeroSequence[] = [
  'none',
  'third-harmonic',
  'min-max',
];

/**
 * Options of `multilevelCarrier`: a single- or three-phase multilevel bridge under carrier PWM.
 *
 * Conventions:
 * - `vdc`: for `npc`, `t-type` and `flying-capacitor` the whole DC link, volts; each leg's output
 *   to the DC midpoint takes the `levels` values −vdc/2 + k·vdc/(levels − 1), k = 0…levels − 1.
 *   For `cascaded-h-bridge` each cell's DC source, volts (as a staircase pattern's cells); a
 *   phase string's output takes the 2·cells + 1 values k·vdc, k = −cells…cells.
 * - The reference of phase k is ma·sin(θ − k·2π/3) plus the zero sequence, normalised so that ±1
 *   spans the whole output range of a leg (or string); ma = 1 reaches the outer level with a
 *   sine reference, 2/√3 with `third-harmonic` or `min-max` (the same linear range as two-level).
 * - Carriers are unit triangles of `mf` cycles a period aligned as the two-level carrier
 *   (`carrierPhase` 0 puts a valley of every in-phase carrier at θ = π/2), each level-shifted
 *   carrier scaled into its band.
 * - Single-phase: `npc`, `t-type` and `flying-capacitor` form a full bridge of two legs driven by
 *   +reference and −reference (output = leg a − leg b, 2·levels − 1 levels); `cascaded-h-bridge`
 *   is one string. Three-phase: three legs (strings) in star.
 */
export interface MultilevelCarrierOptions {
  topology: MultilevelTopology;
  /**
   * Output levels of a leg: 3 for `npc` and `t-type`; 3…9 for `flying-capacitor`; for
   * `cascaded-h-bridge` the levels of a string, odd, 3…17 (cells = (levels − 1)/2).
   */
  levels: number;
  carriers: MultilevelCarrierArrangement;
  /** 1: single-phase bridge; 3: three-phase bridge. */
  phaseCount: 1 | 3;
  /** Modulation index, (0, 1000]; above the linear range is overmodulation. */
  ma: number;
  /** Carrier cycles per fundamental period of each carrier, integer in [1, 10000]. */
  mf: number;
  /** Volts, > 0; see the conventions above. */
  vdc: number;
  /** Three-phase only. @default 'none' */
  zeroSequence?: MultilevelZeroSequence;
  /** @default 'natural' */
  sampling?: CarrierSampling;
  /** Delay of every carrier in carrier radians, as for the two-level methods. @default 0 */
  carrierPhase?: number;
}

/** One semiconductor switch's gate signal. */
export interface MultilevelSwitch {
  /** For example `S1`, `S2`, `cell 2 upper`, `cell 1 leg L upper`. */
  name: string;
  /** 1 while the switch is gated on, 0 while off, one fundamental period. */
  on: Waveform;
}

/** One leg of a multilevel bridge (or one cell string of a cascaded bridge). */
export interface MultilevelLeg {
  /** `leg a`, `leg b`, `leg c` (or `string a`, … for a cascaded bridge). */
  name: string;
  /** Output to the DC midpoint (to the string's neutral end for a cascaded bridge), volts. */
  output: Waveform;
  /** Every switch of the leg, top to bottom (cell by cell for flying capacitor and cascaded). */
  switches: MultilevelSwitch[];
  /**
   * The cells of the leg: for `cascaded-h-bridge` each cell's output voltage (volts); for
   * `flying-capacitor` each commutation cell's state (its upper switch, 0/1, outermost first);
   * empty for `npc` and `t-type`.
   */
  cells: { name: string; waveform: Waveform }[];
}

/** The waveforms of a multilevel bridge over one fundamental period, exact. */
export interface MultilevelWaveforms {
  phaseCount: 1 | 3;
  /** Levels of one leg (string). */
  levels: number;
  /** Two legs (single-phase full bridge), one string (single-phase cascaded) or three (a, b, c). */
  legs: MultilevelLeg[];
}

import type { LcFilterOptions } from '../filter/LcFilterOptions.js';
import type { BackEmf } from '../load/RlLoad.js';
import type { Modulation } from './Modulation.js';

/** Omit distributed over each member of a union, so the discriminant survives. */
type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;

/**
 * A modulation as a design holds it: every field of {@link Modulation} except the DC bus
 * (`vdc`) and the frequency ratio (`mf`, `frequencyRatio`), which the design supplies.
 */
export type DesignModulation = DistributiveOmit<Modulation, 'vdc' | 'mf' | 'frequencyRatio'>;

/** The LC output filter of each phase (its load is the design's `load`, so no `loadR`). */
export type DesignFilter = Omit<LcFilterOptions, 'loadR'>;

/**
 * The load of each phase: series R–L with an optional sinusoidal back-EMF at the fundamental,
 * e = amplitude·sin(θ + phase) (a motor winding's induced voltage); star-connected for a
 * three-phase bridge, so each phase sees its phase-to-star-point voltage.
 */
export interface DesignLoad {
  /** Resistance, ohms, > 0. */
  r: number;
  /** Inductance, henries, ≥ 0. */
  l: number;
  /** Back-EMF, peak volts and radians. @default none */
  emf?: BackEmf;
}

/**
 * One inverter design: everything the design report is computed from.
 * - `vdc`: DC bus, volts (the bipolar level or each staircase cell for a stored pattern).
 * - `fundamentalFrequency`: output frequency, hertz.
 * - `carrierFrequency`: carrier (switching period) frequency, hertz, for the carrier methods and
 *   space vector; the frequency ratio mf = carrierFrequency/fundamentalFrequency must be a whole
 *   number. Stored patterns have no carrier and leave it out.
 * - `modulation`: the method and its options.
 * - `filter`: optional LC output filter per phase; `load`: optional R–L(–EMF) load per phase.
 */
export interface InverterDesign {
  vdc: number;
  fundamentalFrequency: number;
  carrierFrequency?: number;
  modulation: DesignModulation;
  filter?: DesignFilter | null;
  load?: DesignLoad | null;
}

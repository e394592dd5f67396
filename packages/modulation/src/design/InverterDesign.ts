import type { LcFilterOptions } from '../filter/LcFilterOptions.js';
import type { BackEmf } from '../load/RlLoad.js';
import type { SemiconductorDevice } from '../losses/lossTypes.js';
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
 * The grid a grid-connected bridge feeds, per phase: the design's `filter` (L1 and the capacitor
 * with its damping) then the grid-side inductor `l2`, the grid's resistance `r` and inductance
 * `l`, and a sinusoidal source at the fundamental, e_a = √2·V_ph·sin(θ + phase) with
 * V_ph = lineVoltage/√3 for a three-phase bridge (star, b and c lag by 2π/3 and 4π/3) or
 * lineVoltage for a single-phase one. Without a filter the bridge feeds the grid through
 * l2 + l alone (an L filter). A design with a grid has no `load`.
 */
export interface DesignGrid {
  /** Grid voltage, volts rms line to line (three-phase) or rms (single-phase), > 0. */
  lineVoltage: number;
  /** Angle of phase a's grid voltage against the bridge's sin θ, radians. @default 0 */
  phase?: number;
  /** Resistance in series with the grid (the grid's with l2's), ohms, > 0. */
  r: number;
  /** Grid inductance (the short-circuit impedance's), henries, ≥ 0. */
  l: number;
  /** Grid-side filter inductor L2, henries, ≥ 0. */
  l2: number;
  /** The current controller's bandwidth, hertz, to compare the resonance with. @default none */
  controlBandwidth?: number;
  /**
   * Whether the bridge generates power into the grid (PV, storage, a UPS feeding back): IEEE Std
   * 519's footnote then holds it to Table 2's first row (I_SC/I_L < 20) whatever its actual
   * ratio (from memory). `false` for equipment that draws power (an active front end), which is
   * read on the row of its own I_SC/I_L. IEEE Std 1547 does not depend on it. @default true
   */
  generation?: boolean;
}

/**
 * One inverter design: everything the design report is computed from.
 * - `vdc`: DC bus, volts (the bipolar level or each staircase cell for a stored pattern).
 * - `fundamentalFrequency`: output frequency, hertz.
 * - `carrierFrequency`: carrier (switching period) frequency, hertz, for the carrier methods and
 *   space vector. The frequency ratio mf = carrierFrequency/fundamentalFrequency must be a whole
 *   number for the multilevel methods; sine-triangle, three-phase carrier and space vector take
 *   any ratio in [1, 1000] (a fixed carrier at any speed), analysed exactly at its nearest p/q
 *   with q ≤ 64 over q fundamental periods (`analyseDesign`, `DesignReport.carrierSpan`). Stored
 *   patterns have no carrier and leave it out.
 * - `modulation`: the method and its options.
 * - `filter`: optional LC output filter per phase; `load`: optional R–L(–EMF) load per phase.
 * - `grid`: optional grid the bridge feeds through the filter (then no `load`).
 * - `device`: optional switching device of every switch position (an IGBT with its diode or a
 *   MOSFET, datasheet values at the operating temperature, bounds `LOSS_DEVICE_BOUNDS`); with it
 *   the report gives the semiconductor losses by device (`losses`). Left out for none (the API
 *   takes no null here, so a bad device value is named alone).
 */
export interface InverterDesign {
  vdc: number;
  fundamentalFrequency: number;
  carrierFrequency?: number;
  modulation: DesignModulation;
  filter?: DesignFilter | null;
  load?: DesignLoad | null;
  grid?: DesignGrid | null;
  device?: SemiconductorDevice;
}

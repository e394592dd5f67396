/**
 * Where the damping resistor of an LC output filter sits.
 *
 * - `'series-with-capacitor'`: rDamping in series with c (simple; the high-frequency roll-off
 *   falls from −40 to −20 dB/decade above 1/(2π·rDamping·c)).
 * - `'parallel-rc'`: rDamping in series with a blocking capacitor `cDamping`, the branch placed
 *   across c (the common parallel-damping arrangement; keeps −40 dB/decade and takes no
 *   fundamental-frequency loss in a DC path).
 * - `'parallel-with-inductor'`: rDamping across l (roll-off −20 dB/decade at high frequency).
 */
export type DampingPlacement = 'series-with-capacitor' | 'parallel-rc' | 'parallel-with-inductor';

/** The placements {@link DampingPlacement} allows, for validation and forms. */
export const DAMPING_PLACEMENTS: readonly DampingPlacement[] = [
  'series-with-capacitor',
  'parallel-rc',
  'parallel-with-inductor',
];

/**
 * A second-order LC output filter: series inductance `l` from the inverter to the output node,
 * shunt capacitance `c` at the output, a damping resistor, and an optional resistive load.
 * H(jω) = V_out/V_in.
 */
export interface LcFilterOptions {
  /** Series inductance, henries, > 0. */
  l: number;
  /** Shunt capacitance, farads, > 0. */
  c: number;
  /**
   * Damping resistance, ohms. ≥ 0 for `'series-with-capacitor'` (0 is undamped); > 0 for the
   * other placements. @default 0
   */
  rDamping?: number;
  /** Where rDamping sits. @default 'series-with-capacitor' */
  dampingPlacement?: DampingPlacement;
  /** Blocking capacitance in series with rDamping, farads, > 0; `'parallel-rc'` only. */
  cDamping?: number;
  /** Resistive load across the output, ohms, > 0. @default none (open circuit) */
  loadR?: number;
}

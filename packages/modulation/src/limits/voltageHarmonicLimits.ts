/** One row of a voltage-distortion limit table, by the bus voltage at the point of common coupling. */
export interface VoltageLimitRow {
  /** Upper end of the row's bus-voltage range, volts rms line to line (inclusive). */
  maxBusVoltage: number;
  /** The range in words. */
  busRange: string;
  /** Largest individual harmonic, as a ratio of the fundamental. */
  individual: number;
  /** Largest total harmonic distortion, as a ratio. */
  thd: number;
}

/** The standard a limit table comes from. */
export interface LimitStandard {
  name: string;
  edition: string;
  table: string;
  /** True: the values were recalled, not read from the standard (confirm them with it). */
  recalledFromMemory: boolean;
  /** Highest harmonic order the table evaluates. */
  maxOrder: number;
}

/** IEEE Std 519-2022, Table 1 (voltage distortion at the point of common coupling). */
export const IEEE_519_2022_VOLTAGE: LimitStandard = {
  name: 'IEEE Std 519',
  edition: '2022',
  table: 'Table 1, voltage distortion limits',
  recalledFromMemory: true,
  maxOrder: 50,
};

/**
 * Voltage distortion limits of IEEE Std 519-2022, Table 1, recalled from memory (see
 * docs/references.md): confirm with the standard itself and the local utility.
 */
export const IEEE_519_2022_VOLTAGE_LIMITS: readonly VoltageLimitRow[] = [
  { maxBusVoltage: 1_000, busRange: 'V ≤ 1.0 kV', individual: 0.05, thd: 0.08 },
  { maxBusVoltage: 69_000, busRange: '1 kV < V ≤ 69 kV', individual: 0.03, thd: 0.05 },
  { maxBusVoltage: 161_000, busRange: '69 kV < V ≤ 161 kV', individual: 0.015, thd: 0.025 },
  { maxBusVoltage: Number.POSITIVE_INFINITY, busRange: 'V > 161 kV', individual: 0.01, thd: 0.015 },
];

/** The caution shown with every limit check. */
export const HARMONIC_LIMIT_CAUTION =
  'The limits are IEEE Std 519-2022 Table 1 values recalled from memory, not read from the standard: confirm them with the ' +
  'standard and the local utility. They apply to the voltage at the point of common coupling with the utility; this check ' +
  'is idealised (ideal switches, no grid impedance) and is no substitute for measurement, protective design, or the codes ' +
  'and licensed practice that apply where the equipment is built and installed. Inverter DC buses and outputs are lethal.';

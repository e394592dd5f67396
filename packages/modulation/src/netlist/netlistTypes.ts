import type { TimerTable } from '../firmware/timerTableTypes.js';

/** Options of {@link spiceNetlistSources} and {@link timerTableToSpiceNetlist}. */
export interface SpiceNetlistOptions {
  /**
   * Seconds each rising edge takes, > 0 and shorter than the shortest time between two edges of
   * a signal.
   * @default 1e-7
   */
  riseTime?: number;
  /** Seconds each falling edge takes, as `riseTime`. @default riseTime */
  fallTime?: number;
  /** Whole fundamental periods to write, an integer from 1 to 1000. @default 1 */
  periods?: number;
  /** Gate signal level while a switch is on, volts in (0, 1000]; off is 0 V. @default 1 */
  gateVoltage?: number;
  /**
   * Phase of the load current behind sin θ on leg a, radians in [−2π, 2π]: during dead time a
   * leg follows its freewheeling diode, so the leg voltages depend on the current's sign.
   * @default 0
   */
  currentAngle?: number;
  /**
   * Device on-state drops, volts in [0, 10000], in the leg voltages (the threshold model of
   * `timerTableWaveforms`: the conducting transistor or diode takes its drop against the
   * current). The gates do not change. @default none (ideal switches)
   */
  onStateDrop?: { transistor: number; diode: number };
}

/** One piecewise-linear voltage source of the netlist. */
export interface PwlSource {
  /** Element name, starting with V as SPICE requires: `Vgate_a_high`. */
  name: string;
  /** Positive and negative node; `0` is ground, here the DC midpoint. */
  nodes: [string, string];
  /** The signal in words (the netlist's comment line above the source). */
  description: string;
  /** (seconds, volts) pairs, times strictly increasing from 0. */
  points: [number, number][];
}

/** The sources of a netlist with the options they were made with, defaults filled in. */
export interface SpiceNetlistSources {
  /** The table the sources come from. */
  table: TimerTable;
  /** The realised fundamental period, seconds. */
  period: number;
  periods: number;
  riseTime: number;
  fallTime: number;
  gateVoltage: number;
  currentAngle: number;
  /** The drops in the leg voltages, volts; null for ideal switches. */
  onStateDrop: { transistor: number; diode: number } | null;
  /** Each switch's gate (`gate_<leg>_high`, `gate_<leg>_low`), then each leg's voltage (`leg_<leg>`). */
  sources: PwlSource[];
}

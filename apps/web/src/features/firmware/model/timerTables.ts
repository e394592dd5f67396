import {
  deadTimeCompensation,
  firmwareEffectSpectra,
  firmwareEffects,
  timerTable,
  timerTableToCHeader,
  timerTableToCsv,
  timerTableToJson,
  timerTableToSpiceNetlist,
  type DeadTimeCompensation,
  type FirmwareEffects,
  type SpiceNetlistOptions,
  type TimerTable,
  type TimerTableOptions,
} from '@pulsewright/modulation';
import { libraryFieldError } from '../../../lib/libraryFieldError';

// The page builds the table with the library in the browser so it follows every keystroke (the
// service's POST /api/v1/timer-tables gives the same table to scripts). This module is the
// feature's single door to the library.

export interface TimerTableOutcome {
  table: TimerTable | null;
  effects: FirmwareEffects | null;
  error: { field: string; message: string } | null;
}

export function buildTimerTable(
  options: TimerTableOptions,
  effectOptions: {
    minPulseWidth: number;
    /** Device on-state drops, V; left out for ideal switches. */
    onStateDrop?: { transistor: number; diode: number };
  },
): TimerTableOutcome {
  try {
    const table = timerTable(options);
    const effects = firmwareEffects(table, effectOptions);
    return { table, effects, error: null };
  } catch (error) {
    return { table: null, effects: null, error: libraryFieldError(error, 'table') };
  }
}

export function timerTableExports(table: TimerTable) {
  return {
    json: () => timerTableToJson(table),
    csv: () => timerTableToCsv(table),
    /** The C header with its names prefixed by `prefix` (a C identifier; the library checks it). */
    cHeader: (prefix?: string) => timerTableToCHeader(table, prefix ? { prefix } : {}),
  };
}

/**
 * The table's switching pattern as a SPICE netlist (the library's `timerTableToSpiceNetlist`,
 * the text the service's POST /api/v1/netlists and `pulsewright netlist` give), or the library's
 * error naming the option (`riseTime`, `fallTime`, `periods`, `gateVoltage`).
 */
export function netlistOf(
  table: TimerTable,
  options: SpiceNetlistOptions,
): { text: string; error: null } | { text: null; error: { field: string; message: string } } {
  try {
    return { text: timerTableToSpiceNetlist(table, options), error: null };
  } catch (error) {
    return { text: null, error: libraryFieldError(error, 'netlist') };
  }
}

/** The labelled spectra of an effect's reference and realised outputs, for the chart. */
export { firmwareEffectSpectra };

/**
 * The table corrected for its dead time by the sign of the current predicted at a lag of
 * `currentAngle` (the library's `deadTimeCompensation`, Murai et al. 1987), with the first
 * output's figures without dead time, with it and corrected; or the library's error naming the
 * option.
 */
export function compensationOf(
  table: TimerTable,
  currentAngle: number,
):
  | { result: DeadTimeCompensation; error: null }
  | { result: null; error: { field: string; message: string } } {
  try {
    return { result: deadTimeCompensation(table, { currentAngle }), error: null };
  } catch (error) {
    return { result: null, error: libraryFieldError(error, 'currentAngle') };
  }
}

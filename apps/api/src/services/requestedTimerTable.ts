import {
  compensateDeadTime,
  timerTable,
  type TimerTable,
  type TimerTableOptions,
} from '@pulsewright/modulation';
import { callLibrary } from './library.js';

/** A timer-table request as POST /timer-tables and POST /netlists take it (prefix apart). */
export type TimerTableRequest = TimerTableOptions & {
  /** Correct the compare values for the dead time by the predicted current's sign. */
  deadTimeCompensation?: { predictedCurrentAngle?: number };
};

/**
 * The library's timer table for a request, its compare values corrected for the dead time when the
 * request asks (`compensateDeadTime`: T. Murai et al., 1987), so the JSON, CSV, C header and
 * netlist all carry what the controller loads. Errors name the request's fields after `prefix`
 * (`modulation.ma`, `deadTimeCompensation.predictedCurrentAngle`).
 */
export function requestedTimerTable(request: TimerTableRequest, prefix = ''): TimerTable {
  const { deadTimeCompensation, ...options } = request;
  const table = callLibrary(prefix, () => timerTable(options));
  if (deadTimeCompensation === undefined) return table;
  return callLibrary(
    `${prefix}deadTimeCompensation.`,
    () => compensateDeadTime(table, deadTimeCompensation).table,
  );
}

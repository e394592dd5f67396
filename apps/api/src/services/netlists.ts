import { timerTableToSpiceNetlist, type SpiceNetlistOptions } from '@pulsewright/modulation';
import { callLibrary } from './library.js';
import { requestedTimerTable, type TimerTableRequest } from './requestedTimerTable.js';
import type { TimerDownload } from './compute.js';

/** POST /netlists: a timer-table request (as POST /timer-tables takes it) and the netlist's options. */
export type NetlistRequest = SpiceNetlistOptions & {
  timerTable: TimerTableRequest & { prefix?: string };
};

/** The netlist's own options, in the library's names (the table sits apart). */
const NETLIST_FIELDS = [
  'riseTime',
  'fallTime',
  'periods',
  'gateVoltage',
  'currentAngle',
  'onStateDrop.transistor',
  'onStateDrop.diode',
] as const;

/**
 * The switching pattern of a timer table as a SPICE netlist of piecewise-linear sources, written
 * by the library (`timerTable`, then `timerTableToSpiceNetlist`), ready to download as
 * `<prefix>.cir`. The library's errors name the request's fields: `timerTable.modulation.ma`,
 * `riseTime`, `periods`.
 */
export function computeNetlist(request: NetlistRequest): TimerDownload {
  const { timerTable: tableRequest, ...netlist } = request;
  const { prefix = 'pwm_pattern', ...options } = tableRequest;
  const table = requestedTimerTable(options, 'timerTable.');
  return {
    body: callLibrary('', () => timerTableToSpiceNetlist(table, netlist), NETLIST_FIELDS),
    contentType: 'text/plain; charset=utf-8',
    fileName: `${prefix}.cir`,
  };
}
